import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { createInviteSchema, type CreateInviteInput } from '../../schemas/team';
import type { Role } from '../../schemas/roles';
import { colors, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import { useSchemaForm } from '../../hooks/useSchemaForm';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { roleChoices, roleDuties } from './roleChoices';

export function InviteForm({ localInboxUrl, invite }: { localInboxUrl?: string; invite: Mutation<CreateInviteInput> }) {
  const form = useSchemaForm(createInviteSchema, { email: '', role: '' });
  const [sentTo, setSentTo] = useState<string | null>(null);
  const role = (form.values.role || undefined) as Role | undefined;

  function submit() {
    // A new attempt retires the last one's "Invite sent": it would stand beside this one's refusal.
    setSentTo(null);
    const input = form.validate();
    if (!input) return;
    invite.mutate(input, {
      onSuccess: () => {
        setSentTo(input.email);
        form.set('email', '');
      },
      onError: form.showServerError,
    });
  }

  return (
    <Card>
      <TextField
        label="E-mail to invite"
        value={form.values.email}
        onChangeText={(v) => form.set('email', v)}
        error={form.errors.email}
        inputMode="email"
        autoCapitalize="none"
        autoComplete="off"
      />
      <ChoiceChips label="Role" choices={roleChoices} value={role} onChange={(r) => form.set('role', r)} error={form.errors.role} />
      {role ? <Text style={styles.duty}>{roleDuties[role]}</Text> : null}
      {form.formError ? <Notice message={form.formError} /> : null}
      {sentTo ? (
        <Notice
          tone="info"
          message={`Invite sent to ${sentTo}. The link works once, for 7 days.${localInboxUrl ? ' This copy of Treadle keeps its mail on this machine: open the local inbox to see it.' : ''}`}
        />
      ) : null}
      <View style={styles.actions}>
        <Button label="Send invite" onPress={submit} busy={invite.isPending} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  duty: { ...type.small, color: colors.graphite },
  actions: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap', alignItems: 'center' },
});
