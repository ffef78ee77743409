import { useQuery } from '@tanstack/react-query';
import type { TrialList } from '../schemas/trials';
import { api } from './api';

/** The studio's latest trials (newest first), for the Home overview. */
export function useRecentTrials() {
  return useQuery({ queryKey: ['trials', 'recent'], queryFn: () => api<TrialList>('/trials') });
}
