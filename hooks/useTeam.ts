import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AuditEntry, CreateInviteInput, TeamOverview } from '../schemas/team';
import type { PermissionTable } from '../schemas/permissions';
import type { Role } from '../schemas/roles';
import { api, ApiError } from './api';
import { meQueryKey } from './useSession';

const teamKey = ['team'] as const;

export function useTeam() {
  return useQuery({ queryKey: teamKey, queryFn: () => api<TeamOverview>('/team') });
}

export function usePermissionTable() {
  return useQuery({ queryKey: ['permissions'], queryFn: () => api<PermissionTable>('/permissions'), staleTime: Infinity });
}

export function useAuditLog(enabled: boolean) {
  return useQuery({ queryKey: ['team', 'audit'], queryFn: () => api<{ entries: AuditEntry[] }>('/team/audit'), enabled });
}

/** A team write that refreshes the member list (and its log) when it lands, and the viewer's own role and rights. */
function useTeamWrite<Input>(call: (input: Input) => Promise<unknown>) {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, Input>({
    mutationFn: call,
    onSettled: () => Promise.all([client.invalidateQueries({ queryKey: teamKey }), client.invalidateQueries({ queryKey: meQueryKey })]),
  });
}

export const useInvite = () => useTeamWrite((input: CreateInviteInput) => api('/team/invites', { method: 'POST', body: input }));
export const useResendInvite = () => useTeamWrite((id: number) => api(`/team/invites/${id}/resend`, { method: 'POST' }));
export const useRevokeInvite = () => useTeamWrite((id: number) => api(`/team/invites/${id}`, { method: 'DELETE' }));
export const useChangeRole = () =>
  useTeamWrite(({ userId, role }: { userId: number; role: Role }) => api(`/team/members/${userId}`, { method: 'PATCH', body: { role } }));
export const useRemoveMember = () => useTeamWrite((userId: number) => api(`/team/members/${userId}`, { method: 'DELETE' }));

export function useSwitchTeam() {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, number>({
    mutationFn: (teamId) => api('/me/team', { method: 'POST', body: { teamId } }),
    // Everything on screen belonged to the other studio.
    onSuccess: () => client.resetQueries(),
  });
}

export function useSignOutEverywhere() {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, void>({
    mutationFn: () => api('/auth/sign-out-everywhere', { method: 'POST' }),
    onSuccess: () => {
      client.clear();
      client.setQueryData(meQueryKey, null);
    },
  });
}
