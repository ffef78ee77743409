import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';

/** The studio's plan and the programmers' API tokens, one tap from the Team page. */
export function StudioLinks({ planName, mayManageBilling, mayManageTokens }: { planName: string | undefined; mayManageBilling: boolean; mayManageTokens: boolean }) {
  return (
    <View style={styles.row}>
      <Link href="/team/billing" style={styles.tile}>
        <Text style={styles.tileTitle}>Plan and billing</Text>
        {'\n'}
        <Text style={styles.tileBody}>
          {planName ? `On ${planName}. ` : ''}
          {mayManageBilling ? 'Usage, upgrades, invoices.' : 'Only the owner changes the plan.'}
        </Text>
      </Link>
      {mayManageTokens && (
        <Link href="/tokens" style={styles.tile}>
          <Text style={styles.tileTitle}>API tokens</Text>
          {'\n'}
          <Text style={styles.tileBody}>Read-only tokens for build scripts that fetch leg profiles.</Text>
        </Link>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  tile: {
    flexGrow: 1,
    flexBasis: 240,
    minHeight: touchTarget,
    padding: space.lg,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.rule,
    backgroundColor: colors.card,
  },
  tileTitle: { fontFamily: fonts.bodyStrong, fontSize: 16, color: colors.ink },
  tileBody: { ...type.small, color: colors.graphite },
});
