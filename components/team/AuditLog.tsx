import { StyleSheet, Text, View } from 'react-native';
import type { AuditEntry } from '../../schemas/team';
import { colors, fonts, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';
import { formatMoment } from '../ui/format';

const verbs: Record<string, string> = {
  'member.role_changed': 'changed the role of',
  'member.removed': 'removed',
  'member.joined': 'joined:',
  'invite.sent': 'invited',
  'invite.resent': 'resent the invite to',
  'invite.revoked': 'revoked the invite to',
};

export function AuditLog({ entries }: { entries: AuditEntry[] }) {
  if (!entries.length) return <Text style={styles.none}>No changes yet.</Text>;
  return (
    <Card>
      {entries.map((e) => (
        <View key={e.id} style={styles.row}>
          <Text style={styles.when}>{formatMoment(e.at)}</Text>
          <Text style={styles.what}>
            <Text style={styles.actor}>{e.actor}</Text> {verbs[e.action] ?? e.action} {e.subject}
            {e.detail ? ` (${e.detail})` : ''}
          </Text>
        </View>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  none: { ...type.body, color: colors.graphite },
  row: { gap: 2, paddingVertical: space.xs },
  when: { fontFamily: fonts.mono, fontSize: 12, color: colors.graphite },
  what: { ...type.small, color: colors.ink },
  actor: { fontFamily: fonts.bodyStrong },
});
