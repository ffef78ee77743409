import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { Me } from '../../schemas/auth';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';
import { TreadleMark } from '../ui/TreadleMark';
import type { Mutation } from '../../hooks/mutation';
import { TeamSwitcher } from './TeamSwitcher';

/** The strip above every studio page: which studio, who you are in it, and the way out. */
export function StudioHeader({ me, wide, onSignOut, signingOut, switchTeam }: { me: Me; wide: boolean; onSignOut(): void; signingOut: boolean; switchTeam: Mutation<number> }) {
  return (
    <View role="banner" style={styles.bar}>
      {!wide && <TreadleMark size={24} />}
      <TeamSwitcher me={me} align={wide ? 'start' : 'end'} switchTeam={switchTeam} />
      <Pressable
        accessibilityRole="button"
        onPress={onSignOut}
        disabled={signingOut}
        style={({ pressed }) => [styles.signOut, pressed && styles.signOutPressed]}
      >
        <Text style={styles.signOutText}>{signingOut ? 'Signing out…' : 'Sign out'}</Text>
      </Pressable>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    backgroundColor: colors.paper,
    borderBottomWidth: 1,
    borderBottomColor: colors.rule,
    zIndex: 10,
  },
  signOut: {
    minHeight: touchTarget,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.rule,
  },
  signOutPressed: { backgroundColor: colors.paperDeep },
  signOutText: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
});
