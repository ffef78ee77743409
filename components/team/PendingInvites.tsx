import { StyleSheet, Text, View } from 'react-native';
import type { Invite } from '../../schemas/team';
import { roleLabels } from '../../schemas/roles';
import { colors, fonts, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { formatDay } from '../ui/format';

export function PendingInvites({ invites, resend, revoke }: { invites: Invite[]; resend: Mutation<number>; revoke: Mutation<number> }) {
  if (!invites.length) return <Text style={styles.none}>No invites waiting.</Text>;
  return (
    <Card>
      {invites.map((inv, i) => (
        <View key={inv.id} style={[styles.row, i > 0 && styles.divider]} aria-label={`Invite for ${inv.email}`}>
          <View style={styles.who}>
            <Text style={styles.email}>{inv.email}</Text>
            <Text style={styles.meta}>
              {roleLabels[inv.role]} · sent by {inv.invitedBy} · link valid until {formatDay(inv.expiresAt)}
            </Text>
          </View>
          <View style={styles.buttons}>
            <Button label="Resend" tone="quiet" busy={resend.isPending && resend.variables === inv.id} onPress={() => resend.mutate(inv.id)} />
            <Button label="Revoke" tone="danger" busy={revoke.isPending && revoke.variables === inv.id} onPress={() => revoke.mutate(inv.id)} />
          </View>
        </View>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  none: { ...type.body, color: colors.graphite },
  row: { gap: space.sm, paddingVertical: space.sm },
  divider: { borderTopWidth: 1, borderTopColor: colors.rule },
  who: { gap: 2 },
  email: { fontFamily: fonts.bodyStrong, fontSize: 15, color: colors.ink },
  meta: { ...type.small, color: colors.graphite },
  buttons: { flexDirection: 'row', gap: space.sm },
});
