import { useQuery } from '@tanstack/react-query';
import type { QueueStatus } from '../schemas/queue';
import { api } from './api';

const REFRESH_MS = 3000;

/** Where trials and dial-ins run, refreshed every few seconds while `enabled` (owners only). */
export function useQueueStatus(enabled: boolean) {
  return useQuery({ queryKey: ['queue'], queryFn: () => api<QueueStatus>('/queue'), enabled, refetchInterval: REFRESH_MS });
}
