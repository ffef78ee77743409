import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { PASSWORD_MIN, resetPasswordSchema } from '../../schemas/auth';
import { colors, fonts, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { ResetPasswordInput } from '../../schemas/auth';
import { useSchemaForm } from '../../hooks/useSchemaForm';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';

export function NewPasswordForm({ token, reset }: { token: string; reset: Mutation<ResetPasswordInput> }) {
  const form = useSchemaForm(resetPasswordSchema, { token, password: '' });

  function submit() {
    const input = form.validate();
    if (!input) return;
    reset.mutate(input, { onError: form.showServerError });
  }

  if (reset.isSuccess) {
    return (
      <View style={styles.stack}>
        <Text role="heading" aria-level={1} style={styles.title}>
          Password changed
        </Text>
        <Notice tone="info" message="Your new password is set, and every session you had has ended. Sign in with the new password." />
        <Link href="/sign-in" style={styles.link}>
          Sign in
        </Link>
      </View>
    );
  }
  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        Choose a new password
      </Text>
      {form.formError ? <Notice message={form.formError} /> : null}
      {form.errors.token ? <Notice message={form.errors.token} /> : null}
      <TextField
        label="New password"
        value={form.values.password}
        onChangeText={(v) => form.set('password', v)}
        error={form.errors.password}
        hint={`At least ${PASSWORD_MIN} characters. Setting it signs you out everywhere.`}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
      />
      <Button label="Set new password" onPress={submit} busy={reset.isPending} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong, fontSize: 16, textDecorationLine: 'underline' },
});
