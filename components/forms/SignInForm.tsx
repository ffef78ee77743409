import { Link, useRouter } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { signInSchema } from '../../schemas/auth';
import type { Mutation } from '../../hooks/mutation';
import type { SignInInput } from '../../schemas/auth';
import { useSchemaForm } from '../../hooks/useSchemaForm';
import { colors, fonts, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { TextField } from '../ui/TextField';
import { Notice } from '../ui/Notice';

export function SignInForm({ signIn }: { signIn: Mutation<SignInInput> }) {
  const router = useRouter();
  const form = useSchemaForm(signInSchema, { email: '', password: '' });

  function submit() {
    const input = form.validate();
    if (!input) return;
    signIn.mutate(input, { onSuccess: () => router.replace('/'), onError: form.showServerError });
  }

  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        Sign in to your studio
      </Text>
      {form.formError ? <Notice message={form.formError} /> : null}
      <TextField
        label="E-mail"
        value={form.values.email}
        onChangeText={(v) => form.set('email', v)}
        error={form.errors.email}
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
      />
      <TextField
        label="Password"
        value={form.values.password}
        onChangeText={(v) => form.set('password', v)}
        error={form.errors.password}
        secureTextEntry
        autoComplete="current-password"
        onSubmitEditing={submit}
      />
      <Button label="Sign in" onPress={submit} busy={signIn.isPending} />
      <Link href="/forgot-password" style={styles.forgot}>
        Forgot your password?
      </Link>
      <Text style={styles.switch}>
        New to Treadle?{' '}
        <Link href="/sign-up" style={styles.link}>
          Set up a studio
        </Link>
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  switch: { ...type.body, color: colors.graphite, textAlign: 'center' },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong, textDecorationLine: 'underline' },
  forgot: { color: colors.ember, fontFamily: fonts.bodyStrong, textDecorationLine: 'underline', textAlign: 'center', fontSize: 15 },
});
