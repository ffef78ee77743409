import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { JobAccepted } from '../schemas/jobs';
import type { TrialDetail, TrialList, TrialRequest } from '../schemas/trials';
import { api, ApiError } from './api';


export function useTrial(id: number) {
  return useQuery({ queryKey: ['trials', id], queryFn: () => api<TrialDetail>(`/trials/${id}`), enabled: Number.isInteger(id) && id > 0 });
}

export function useTrials(characterId: number) {
  return useQuery({ queryKey: ['trials', 'of', characterId], queryFn: () => api<TrialList>(`/trials?characterId=${characterId}`), enabled: characterId > 0 });
}

export function useRunTrial() {
  const client = useQueryClient();
  return useMutation<JobAccepted, ApiError, TrialRequest>({
    mutationFn: (body) => api<JobAccepted>('/trials', { method: 'POST', body }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['trials'] }),
  });
}
