import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ProfileDetail, ProfileList, PublishProfileInput } from '../schemas/profiles';
import type { ProfileDiff } from '../engine/profile/diff';
import type { LegProfile } from '../engine/profile/schema';
import { api, ApiError } from './api';

export const profilesKey = ['profiles'] as const;


export function useProfiles() {
  return useQuery({ queryKey: profilesKey, queryFn: () => api<ProfileList>('/profiles') });
}

export function useProfile(id: number) {
  return useQuery({ queryKey: ['profiles', id], queryFn: () => api<ProfileDetail>(`/profiles/${id}`), enabled: Number.isInteger(id) && id > 0 });
}

export function useProfileDiff(id: number, from: number | null, to: number | null) {
  return useQuery({
    queryKey: ['profiles', id, 'diff', from, to],
    queryFn: () => api<{ diff: ProfileDiff }>(`/profiles/${id}/diff?from=${from}&to=${to}`),
    enabled: id > 0 && from !== null && to !== null && from !== to,
  });
}

/** One published file, read through the same API build scripts use (a session works there too). */
export function useProfileVersion(id: number, version: number | null) {
  return useQuery({
    queryKey: ['profiles', id, 'version', version],
    queryFn: () => api<LegProfile>(`/v1/profiles/${id}/versions/${version}`),
    enabled: id > 0 && version !== null,
    staleTime: Infinity,
  });
}

/** Where the browser downloads a version as a file (same origin, session cookie). */
export const profileDownloadUrl = (id: number, version: number) => `/api/v1/profiles/${id}/versions/${version}?download`;
export const LEG_PROFILE_SCHEMA_URL = '/api/schema/leg-profile.json';

export function usePublishProfile() {
  const client = useQueryClient();
  return useMutation<{ profileId: number; version: number }, ApiError, PublishProfileInput>({
    mutationFn: (body) => api('/profiles', { method: 'POST', body }),
    onSuccess: () => client.invalidateQueries({ queryKey: profilesKey }),
  });
}

/** The difference between two versions, as the profile screen hands it to VersionDiff. */
export type ProfileDiffQuery = ReturnType<typeof useProfileDiff>;
