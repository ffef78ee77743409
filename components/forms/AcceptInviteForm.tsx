import { useRouter } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { acceptInviteNewAccountSchema, acceptInviteSchema, type InvitePreview } from '../../schemas/team';
import { PASSWORD_MIN } from '../../schemas/auth';
import { roleLabels } from '../../schemas/roles';
import { colors, fonts, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { AcceptInviteInput } from '../../schemas/team';
import { useSchemaForm } from '../../hooks/useSchemaForm';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';

export function AcceptInviteForm({ invite, accept }: { invite: InvitePreview; accept: Mutation<AcceptInviteInput> }) {
  const router = useRouter();
  const form = useSchemaForm(invite.hasAccount ? acceptInviteSchema : acceptInviteNewAccountSchema, { name: '', password: '' });

  function submit() {
    const input = form.validate();
    if (!input) return;
    accept.mutate(input, { onSuccess: () => router.replace('/'), onError: form.showServerError });
  }

  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        Join {invite.teamName}
      </Text>
      <Text style={styles.lede}>
        {invite.invitedBy} invited <Text style={styles.strong}>{invite.email}</Text> to join as{' '}
        <Text style={styles.strong}>{roleLabels[invite.role]}</Text>.
      </Text>
      {form.formError ? <Notice message={form.formError} /> : null}
      {invite.hasAccount ? (
        <Text style={styles.lede}>This address already has a Treadle account: enter its password to add this studio to it.</Text>
      ) : (
        <TextField label="Your name" value={form.values.name} onChangeText={(v) => form.set('name', v)} error={form.errors.name} autoComplete="name" />
      )}
      <TextField
        label={invite.hasAccount ? 'Password' : 'Choose a password'}
        value={form.values.password}
        onChangeText={(v) => form.set('password', v)}
        error={form.errors.password}
        hint={invite.hasAccount ? undefined : `At least ${PASSWORD_MIN} characters.`}
        secureTextEntry
        autoComplete={invite.hasAccount ? 'current-password' : 'new-password'}
        onSubmitEditing={submit}
      />
      <Button label={`Join ${invite.teamName}`} onPress={submit} busy={accept.isPending} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  lede: { ...type.body, color: colors.graphite },
  strong: { fontFamily: fonts.bodyStrong, color: colors.ink },
});
