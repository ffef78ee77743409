import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AppConfig, ResetPasswordInput, ResetRequestInput } from '../schemas/auth';
import type { AcceptInviteInput, InvitePreview } from '../schemas/team';
import { api, ApiError } from './api';
import { meQueryKey } from './useSession';

export function useAppConfig() {
  return useQuery({ queryKey: ['app-config'], queryFn: () => api<AppConfig>('/app-config'), staleTime: Infinity });
}

export function useInvitePreview(token: string) {
  return useQuery<InvitePreview, ApiError>({ queryKey: ['invite', token], queryFn: () => api<InvitePreview>(`/invites/${token}`), retry: false });
}

export function useAcceptInvite(token: string) {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, AcceptInviteInput>({
    mutationFn: (input) => api(`/invites/${token}/accept`, { method: 'POST', body: input }),
    onSuccess: () => client.resetQueries({ queryKey: meQueryKey }),
  });
}

export function useResetRequest() {
  return useMutation<{ message: string }, ApiError, ResetRequestInput>({
    mutationFn: (input) => api('/auth/reset-request', { method: 'POST', body: input }),
  });
}

export function useResetPassword() {
  return useMutation<unknown, ApiError, ResetPasswordInput>({
    mutationFn: (input) => api('/auth/reset', { method: 'POST', body: input }),
  });
}
