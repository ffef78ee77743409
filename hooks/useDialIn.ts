import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me } from '../schemas/auth';
import type { DialInRequest } from '../schemas/dial-ins';
import type { JobAccepted } from '../schemas/jobs';
import type { LegSetupVersion } from '../schemas/leg-setups';
import { api, ApiError } from './api';

export const canDialIn = (me: Me | null | undefined) => !!me?.permissions.includes('dial-ins.run');

export function useStartDialIn() {
  return useMutation<JobAccepted, ApiError, DialInRequest>({ mutationFn: (body) => api<JobAccepted>('/dial-ins', { method: 'POST', body }) });
}

export function useAcceptDialIn(characterId: number) {
  const client = useQueryClient();
  return useMutation<{ legSetup: LegSetupVersion }, ApiError, { jobId: number; note?: string }>({
    mutationFn: ({ jobId, note }) => api(`/dial-ins/${jobId}/accept`, { method: 'POST', body: { note } }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['leg-setups', characterId] }),
  });
}
