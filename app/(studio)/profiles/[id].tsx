import { useState } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { Screen } from '../../../components/layout/Screen';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { Notice } from '../../../components/ui/Notice';
import { ProfilePage } from '../../../components/profiles/ProfilePage';
import type { DiffPick } from '../../../components/profiles/VersionDiff';
import { useCan } from '../../../hooks/useCan';
import { useProfile, useProfileDiff } from '../../../hooks/useProfiles';

export default function ProfileScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const mayManageTokens = useCan('tokens.manage');
  const profile = useProfile(Number(id));
  const versions = profile.data?.versions ?? [];
  // Until someone picks, the newest version against the one before it.
  const [picked, setPicked] = useState<DiffPick | null>(null);
  const pick: DiffPick = picked ?? { from: versions[1]?.version ?? null, to: versions[0]?.version ?? null };
  const diff = useProfileDiff(Number(id), pick.from, pick.to);
  const name = profile.data?.profile.character.name;
  return (
    <Screen title={name ? `${name} leg profile` : 'Leg profile'} lede={profile.data ? `Profile ${profile.data.profile.id} · ${profile.data.versions.length} published versions` : undefined}>
      {profile.isPending ? <LoadingPage /> : null}
      {profile.isError ? <Notice message={profile.error.message} /> : null}
      {profile.data ? <ProfilePage detail={profile.data} mayManageTokens={mayManageTokens} diffPick={pick} onDiffPick={setPicked} diff={diff} /> : null}
    </Screen>
  );
}
