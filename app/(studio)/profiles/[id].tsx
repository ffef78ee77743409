import { useLocalSearchParams } from 'expo-router';
import { Screen } from '../../../components/layout/Screen';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { Notice } from '../../../components/ui/Notice';
import { ProfilePage } from '../../../components/profiles/ProfilePage';
import { useMe } from '../../../hooks/useSession';
import { useProfile } from '../../../hooks/useProfiles';
import { canManageTokens } from '../../../hooks/useTokens';

export default function ProfileScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMe();
  const profile = useProfile(Number(id));
  const name = profile.data?.profile.character.name;
  return (
    <Screen title={name ? `${name} leg profile` : 'Leg profile'} lede={profile.data ? `Profile ${profile.data.profile.id} · ${profile.data.versions.length} published versions` : undefined}>
      {profile.isPending ? <LoadingPage /> : null}
      {profile.isError ? <Notice message={profile.error.message} /> : null}
      {profile.data ? <ProfilePage detail={profile.data} mayManageTokens={canManageTokens(me.data)} /> : null}
    </Screen>
  );
}
