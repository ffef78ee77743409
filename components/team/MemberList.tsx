import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Member } from '../../schemas/team';
import { roleLabels } from '../../schemas/roles';
import { colors, fonts, space, type } from '../../constants/theme';
import { useChangeRole, useRemoveMember } from '../../hooks/useTeam';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { roleChoices } from './roleChoices';

function MemberRow({ member, manage, isYou }: { member: Member; manage: boolean; isYou: boolean }) {
  const changeRole = useChangeRole();
  const remove = useRemoveMember();
  const [confirming, setConfirming] = useState(false);
  const problem = changeRole.error?.message ?? remove.error?.message;
  return (
    <View style={styles.row} aria-label={`Member ${member.name}`}>
      <View style={styles.who}>
        <Text style={styles.name}>
          {member.name}
          {isYou ? ' (you)' : ''}
        </Text>
        <Text style={styles.email}>{member.email}</Text>
        {!manage && <Text style={styles.role}>{roleLabels[member.role]}</Text>}
      </View>
      {manage && (
        <View style={styles.controls}>
          <ChoiceChips
            label={`Role of ${member.name}`}
            choices={roleChoices}
            value={member.role}
            disabled={changeRole.isPending}
            onChange={(role) => changeRole.mutate({ userId: member.userId, role })}
          />
          {confirming ? (
            <View style={styles.confirm}>
              <Text style={styles.confirmText}>Remove {member.name} from the studio? They lose access at once; their work stays.</Text>
              <View style={styles.confirmButtons}>
                <Button label="Remove" tone="danger" busy={remove.isPending} onPress={() => remove.mutate(member.userId, { onSettled: () => setConfirming(false) })} />
                <Button label="Keep" tone="quiet" onPress={() => setConfirming(false)} />
              </View>
            </View>
          ) : (
            <Button label={`Remove ${member.name}`} tone="quiet" onPress={() => setConfirming(true)} />
          )}
        </View>
      )}
      {problem ? <Notice message={problem} /> : null}
    </View>
  );
}

export function MemberList({ members, manage, viewerId }: { members: Member[]; manage: boolean; viewerId: number }) {
  return (
    <Card>
      {members.map((m, i) => (
        <View key={m.userId} style={i > 0 ? styles.divider : undefined}>
          <MemberRow member={m} manage={manage} isYou={m.userId === viewerId} />
        </View>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.md, paddingVertical: space.sm },
  divider: { borderTopWidth: 1, borderTopColor: colors.rule },
  who: { gap: 2 },
  name: { fontFamily: fonts.bodyStrong, fontSize: 16, color: colors.ink },
  email: { ...type.small, color: colors.graphite },
  role: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  controls: { gap: space.md },
  confirm: { gap: space.sm },
  confirmText: { ...type.small, color: colors.ink },
  confirmButtons: { flexDirection: 'row', gap: space.sm },
});
