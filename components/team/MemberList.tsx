import { useEffect, useRef, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import type { Member } from '../../schemas/team';
import { roleLabels, type Role } from '../../schemas/roles';
import { colors, fonts, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { roleChoices, roleDuties } from './roleChoices';

/** What a role change means for the member, in one sentence under the question. */
function consequence(member: Member, role: Role, isYou: boolean): string {
  const who = isYou ? 'You' : member.name;
  if (member.role === 'owner' && isYou) return `${who} lose the owner's rights (members, plan and billing) at once; another owner can give them back.`;
  if (role === 'owner') return `${who} can then manage members, the plan and billing, and remove other owners.`;
  return `${who} can then: ${roleDuties[role].charAt(0).toLowerCase()}${roleDuties[role].slice(1)} It takes effect at once.`;
}

/** The question under the chips, brought into view when it opens (on a phone it can open below the fold). */
function RoleConfirm({ label, children }: { label: string; children: React.ReactNode }) {
  const ref = useRef<View>(null);
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    (ref.current as unknown as { scrollIntoView?: (o: ScrollIntoViewOptions) => void } | null)?.scrollIntoView?.({ block: 'center' });
  }, []);
  return (
    <View ref={ref} style={styles.confirm} role="group" aria-label={label}>
      {children}
    </View>
  );
}

/** A member's role change and removal, as the screen holds them. */
export interface MemberChanges {
  changeRole: Mutation<{ userId: number; role: Role }>;
  remove: Mutation<number>;
}

function MemberRow({ member, manage, isYou, onlyOwner, changes: { changeRole, remove } }: { member: Member; manage: boolean; isYou: boolean; onlyOwner: boolean; changes: MemberChanges }) {
  const [confirming, setConfirming] = useState(false);
  const [pendingRole, setPendingRole] = useState<Role | null>(null);
  // One pair of mutations serves every row: a row shows only the progress and failure of its own member's change.
  const changingThis = changeRole.variables?.userId === member.userId;
  const removingThis = remove.variables === member.userId;
  const problem = (changingThis ? changeRole.error?.message : undefined) ?? (removingThis ? remove.error?.message : undefined);
  // The server refuses it too (409 last_owner); the screen does not offer it.
  const locked = onlyOwner;
  return (
    <View style={styles.row} aria-label={`Member ${member.name}`}>
      <View style={styles.who}>
        <Text style={styles.name}>
          {member.name}
          {isYou ? ' (you)' : ''}
        </Text>
        <Text style={styles.email}>{member.email}</Text>
        {!manage || locked ? <Text style={styles.role}>{roleLabels[member.role]}</Text> : null}
      </View>
      {manage && locked ? (
        <Text style={styles.hint}>
          {isYou ? 'You are' : `${member.name} is`} the studio's only owner. Make someone else an owner before changing this role or removing {isYou ? 'yourself' : 'them'}: a studio always keeps one.
        </Text>
      ) : null}
      {manage && !locked && (
        <View style={styles.controls}>
          <ChoiceChips
            label={`Role of ${member.name}`}
            choices={roleChoices}
            value={pendingRole ?? member.role}
            disabled={changeRole.isPending}
            onChange={(role) => setPendingRole(role === member.role ? null : role)}
          />
          {pendingRole ? (
            <RoleConfirm label={`Confirm the role change of ${member.name}`}>
              <Text style={styles.confirmText}>
                Change {isYou ? 'your role' : `${member.name}'s role`} from {roleLabels[member.role]} to {roleLabels[pendingRole]}? {consequence(member, pendingRole, isYou)}
              </Text>
              <View style={styles.confirmButtons}>
                <Button
                  label={`Make ${isYou ? 'me' : member.name.split(' ')[0]} ${roleLabels[pendingRole]}`}
                  busy={changeRole.isPending && changingThis}
                  onPress={() => changeRole.mutate({ userId: member.userId, role: pendingRole }, { onSettled: () => setPendingRole(null) })}
                />
                <Button label="Keep the role" tone="quiet" onPress={() => setPendingRole(null)} />
              </View>
            </RoleConfirm>
          ) : null}
          {confirming ? (
            <View style={styles.confirm}>
              <Text style={styles.confirmText}>
                {isYou ? 'Leave the studio? You lose access at once; your work stays.' : `Remove ${member.name} from the studio? They lose access at once; their work stays.`}
              </Text>
              <View style={styles.confirmButtons}>
                <Button label={isYou ? 'Leave' : 'Remove'} tone="danger" busy={remove.isPending && removingThis} onPress={() => remove.mutate(member.userId, { onSettled: () => setConfirming(false) })} />
                <Button label="Keep" tone="quiet" onPress={() => setConfirming(false)} />
              </View>
            </View>
          ) : (
            <Button label={isYou ? 'Leave the studio' : `Remove ${member.name}`} tone="quiet" onPress={() => setConfirming(true)} />
          )}
        </View>
      )}
      {problem ? <Notice message={problem} /> : null}
    </View>
  );
}

export function MemberList({ members, manage, viewerId, changes }: { members: Member[]; manage: boolean; viewerId: number; changes: MemberChanges }) {
  const owners = members.filter((m) => m.role === 'owner').length;
  return (
    <Card>
      {members.map((m, i) => (
        <View key={m.userId} style={i > 0 ? styles.divider : undefined}>
          <MemberRow member={m} manage={manage} isYou={m.userId === viewerId} onlyOwner={m.role === 'owner' && owners <= 1} changes={changes} />
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
  hint: { ...type.small, color: colors.graphite },
  confirmButtons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
