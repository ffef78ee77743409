import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { usePathname, useRouter } from 'expo-router';
import type { Me } from '../../schemas/auth';
import { colors } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import type { Mutation } from '../../hooks/mutation';
import { sectionOfPath } from './navigation';
import { SideRail } from './SideRail';
import { StudioHeader } from './StudioHeader';
import { TabBar } from './TabBar';

/** Phone: header, page, bottom tabs. Wide: side rail, then header and page. The studio layout holds the sign-out and studio switch. */
export function StudioShell({ me, children, signOut, switchTeam }: { me: Me; children: ReactNode; signOut: Mutation; switchTeam: Mutation<number> }) {
  const wide = useIsWide();
  const active = sectionOfPath(usePathname());
  const router = useRouter();
  const header = (
    <StudioHeader me={me} wide={wide} signingOut={signOut.isPending} onSignOut={() => signOut.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })} switchTeam={switchTeam} />
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
