import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { resetRequestSchema } from '../../schemas/auth';
import { colors, fonts, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { ResetRequestInput } from '../../schemas/auth';
import { useSchemaForm } from '../../hooks/useSchemaForm';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';

export function ResetRequestForm({ request }: { request: Mutation<ResetRequestInput, { message: string }> }) {
  const form = useSchemaForm(resetRequestSchema, { email: '' });

  function submit() {
    const input = form.validate();
    if (!input) return;
    request.mutate(input, { onError: form.showServerError });
  }

  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        Reset your password
      </Text>
      <Text style={styles.lede}>We mail a link to the address of your account. It works once, for one hour.</Text>
      {form.formError ? <Notice message={form.formError} /> : null}
      {request.data ? <Notice tone="info" message={request.data.message} /> : null}
      <TextField
        label="E-mail"
        value={form.values.email}
        onChangeText={(v) => form.set('email', v)}
        error={form.errors.email}
        inputMode="email"
        autoCapitalize="none"
        autoComplete="email"
        onSubmitEditing={submit}
      />
      <Button label="Send reset link" onPress={submit} busy={request.isPending} />
      <Link href="/sign-in" style={styles.link}>
        Back to sign-in
      </Link>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  lede: { ...type.body, color: colors.graphite },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong, fontSize: 16, textAlign: 'center', textDecorationLine: 'underline' },
});
