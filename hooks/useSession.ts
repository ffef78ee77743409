import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Me, SessionState, SignInInput, SignUpAnswer, SignUpInput } from '../schemas/auth';
import { api, ApiError } from './api';

export const meQueryKey = ['me'] as const;

/** The signed-in viewer, or null when signed out (the session probe answers 200 either way, so no error is logged). */
export function useMe() {
  return useQuery({
    queryKey: meQueryKey,
    queryFn: async (): Promise<Me | null> => {
      const state = await api<SessionState>('/me/session');
      return state.signedIn ? state.me : null;
    },
    staleTime: 60_000,
  });
}

export function useSignIn() {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, SignInInput>({
    mutationFn: (input) => api('/auth/sign-in', { method: 'POST', body: input }),
    onSuccess: () => client.invalidateQueries({ queryKey: meQueryKey }),
  });
}

/** Asks for a studio: the answer is the same for every address, and the link to finish arrives by mail. */
export function useSignUp() {
  return useMutation<SignUpAnswer, ApiError, SignUpInput>({
    mutationFn: (input) => api<SignUpAnswer>('/auth/sign-up', { method: 'POST', body: input }),
  });
}

/** The mailed link's second step: makes the account and studio and signs in. */
export function useConfirmSignUp(token: string) {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, void>({
    mutationFn: () => api('/auth/sign-up/confirm', { method: 'POST', body: { token } }),
    onSuccess: () => client.resetQueries({ queryKey: meQueryKey }),
  });
}

export function useSignOut() {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, void>({
    mutationFn: () => api('/auth/sign-out', { method: 'POST' }),
    onSuccess: () => {
      client.clear();
      client.setQueryData(meQueryKey, null);
    },
  });
}
