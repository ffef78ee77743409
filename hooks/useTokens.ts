import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiToken, ApiTokenList, CreatedToken, CreateTokenInput } from '../schemas/tokens';
import { api, ApiError } from './api';

const key = ['tokens'] as const;


export function useTokens(enabled = true) {
  return useQuery({ queryKey: key, queryFn: () => api<ApiTokenList>('/tokens'), enabled });
}

export function useCreateToken() {
  const client = useQueryClient();
  return useMutation<CreatedToken, ApiError, CreateTokenInput>({
    mutationFn: (body) => api('/tokens', { method: 'POST', body }),
    onSuccess: () => client.invalidateQueries({ queryKey: key }),
  });
}

export function useRevokeToken() {
  const client = useQueryClient();
  return useMutation<{ token: ApiToken }, ApiError, number>({
    mutationFn: (id) => api(`/tokens/${id}`, { method: 'DELETE' }),
    onSuccess: () => client.invalidateQueries({ queryKey: key }),
  });
}
