import { useQuery } from '@tanstack/react-query';
import type { Job } from '../schemas/jobs';
import { FINISHED_STATUSES } from '../schemas/jobs';
import { api } from './api';

export const jobKey = (id: number) => ['jobs', id] as const;

/** Polls a job every half second until it is done, failed or cancelled. */
export function useJob(id: number | null) {
  return useQuery({
    queryKey: jobKey(id ?? 0),
    queryFn: () => api<Job>(`/jobs/${id}`),
    enabled: id !== null,
    refetchInterval: (q) => (q.state.data && FINISHED_STATUSES.includes(q.state.data.status) ? false : 500),
  });
}

export const cancelJob = (id: number) => api<Job>(`/jobs/${id}/cancel`, { method: 'POST' });
