import { useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import type { compareResultSchema } from '../schemas/compare';
import { api } from './api';

export type CompareResult = z.infer<typeof compareResultSchema>;

/** Runs (or reuses) the comparison of 2–4 picks on a suite; the same parameters as the screen's URL. */
export function useCompare(suite: number | null, picks: string[]) {
  const ready = suite !== null && picks.length >= 2 && picks.length <= 4;
  return useQuery({
    queryKey: ['compare', suite, ...picks],
    queryFn: () => api<CompareResult>(`/compare?suite=${suite}&pick=${picks.join(',')}`),
    enabled: ready,
    staleTime: 5 * 60_000,
  });
}
