import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LegSetupCreate, LegSetupList, LegSetupVersion } from '../schemas/leg-setups';
import { api, ApiError } from './api';

const key = (characterId: number) => ['leg-setups', characterId] as const;

export function useLegSetups(characterId: number) {
  return useQuery({ queryKey: key(characterId), queryFn: () => api<LegSetupList>(`/characters/${characterId}/leg-setups`), enabled: characterId > 0 });
}

export function useSaveLegSetup(characterId: number) {
  const client = useQueryClient();
  return useMutation<{ legSetup: LegSetupVersion }, ApiError, LegSetupCreate>({
    mutationFn: (body) => api(`/characters/${characterId}/leg-setups`, { method: 'POST', body }),
    onSuccess: () => client.invalidateQueries({ queryKey: key(characterId) }),
  });
}
