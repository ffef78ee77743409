import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DialInRequest } from '../schemas/dial-ins';
import type { DialInAllowance } from '../schemas/dial-in-allowance';
import type { JobAccepted } from '../schemas/jobs';
import type { LegSetupVersion } from '../schemas/leg-setups';
import { api, ApiError } from './api';


export function useStartDialIn() {
  const client = useQueryClient();
  return useMutation<JobAccepted, ApiError, DialInRequest>({
    mutationFn: (body) => api<JobAccepted>('/dial-ins', { method: 'POST', body }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['dial-ins', 'allowance'] }),
  });
}

export function useAcceptDialIn(characterId: number) {
  const client = useQueryClient();
  return useMutation<{ legSetup: LegSetupVersion }, ApiError, { jobId: number; note?: string }>({
    mutationFn: ({ jobId, note }) => api(`/dial-ins/${jobId}/accept`, { method: 'POST', body: { note } }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['leg-setups', characterId] }),
  });
}

/** The month's dial-in candidates: used and allowed (server/routes/dial-ins.ts, GET /allowance). */
export function useDialInAllowance(enabled = true) {
  return useQuery({ queryKey: ['dial-ins', 'allowance'], queryFn: () => api<DialInAllowance>('/dial-ins/allowance'), enabled });
}
