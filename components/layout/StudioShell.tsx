import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { usePathname, useRouter } from 'expo-router';
import type { Me } from '../../schemas/auth';
import { colors } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { useSignOut } from '../../hooks/useSession';
import { sectionOfPath } from './navigation';
import { SideRail } from './SideRail';
import { StudioHeader } from './StudioHeader';
import { TabBar } from './TabBar';

/** Phone: header, page, bottom tabs. Wide: side rail, then header and page. */
export function StudioShell({ me, children }: { me: Me; children: ReactNode }) {
  const wide = useIsWide();
  const active = sectionOfPath(usePathname());
  const router = useRouter();
  const signOut = useSignOut();
  const header = (
    <StudioHeader me={me} wide={wide} signingOut={signOut.isPending} onSignOut={() => signOut.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })} />
  );
  if (wide) {
    return (
      <View style={styles.wide}>
        <SideRail active={active} />
        <View style={styles.main}>
          {header}
          <View role="main" style={styles.page}>
            {children}
          </View>
        </View>
      </View>
    );
  }
  return (
    <View style={styles.phone}>
      {header}
      <View role="main" style={styles.page}>
        {children}
      </View>
      <TabBar active={active} />
    </View>
  );
}

const styles = StyleSheet.create({
  wide: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  phone: { flex: 1, backgroundColor: colors.paper },
  main: { flex: 1 },
  page: { flex: 1 },
});
