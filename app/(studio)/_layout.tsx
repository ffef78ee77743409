import { Redirect, Slot } from 'expo-router';
import { useMe, useSignOut } from '../../hooks/useSession';
import { useSwitchTeam } from '../../hooks/useTeam';
import { StudioShell } from '../../components/layout/StudioShell';
import { LoadingPage } from '../../components/layout/LoadingPage';

export default function StudioLayout() {
  const me = useMe();
  const signOut = useSignOut();
  const switchTeam = useSwitchTeam();
  if (me.isPending) return <LoadingPage />;
  if (me.isError) return <LoadingPage problem={me.error.message} onRetry={() => me.refetch()} />;
  if (!me.data) return <Redirect href="/sign-in" />;
  return (
    <StudioShell me={me.data} signOut={signOut} switchTeam={switchTeam}>
      <Slot />
    </StudioShell>
  );
}
