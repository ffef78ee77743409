import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { PASSWORD_MIN, signUpSchema } from '../../schemas/auth';
import type { Mutation } from '../../hooks/mutation';
import type { SignUpAnswer, SignUpInput } from '../../schemas/auth';
import { useSchemaForm } from '../../hooks/useSchemaForm';
import { colors, fonts, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { TextField } from '../ui/TextField';
import { Notice } from '../ui/Notice';

export function SignUpForm({ signUp, localInboxUrl }: { signUp: Mutation<SignUpInput, SignUpAnswer>; localInboxUrl: string | undefined }) {
  const form = useSchemaForm(signUpSchema, { name: '', email: '', password: '', teamName: '' });

  function submit() {
    const input = form.validate();
    if (!input) return;
    signUp.mutate(input, { onError: form.showServerError });
  }

  if (signUp.data) {
    const inbox = localInboxUrl;
    return (
      <View style={styles.stack}>
        <Text role="heading" aria-level={1} style={styles.title}>
          Check your inbox
        </Text>
        <Notice tone="info" message={signUp.data.message} />
        {inbox ? (
          <Text style={styles.lede}>
            This Treadle keeps its mail on this machine:{' '}
            <Link href={inbox} target="_blank" style={styles.link}>
              open the local inbox
            </Link>
            .
          </Text>
        ) : null}
        <Button label="Use another address" tone="quiet" onPress={() => signUp.reset()} />
      </View>
    );
  }

  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        Set up your studio
      </Text>
      <Text style={styles.lede}>You become the studio's owner and can invite your team afterwards.</Text>
      {form.formError ? <Notice message={form.formError} /> : null}
      <TextField label="Your name" value={form.values.name} onChangeText={(v) => form.set('name', v)} error={form.errors.name} autoComplete="name" />
      <TextField
        label="Studio name"
        value={form.values.teamName}
        onChangeText={(v) => form.set('teamName', v)}
        error={form.errors.teamName}
        autoComplete="organization"
      />
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
        hint={`At least ${PASSWORD_MIN} characters. A long phrase you will remember beats a short, clever one.`}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
      />
      <Button label="Create studio" onPress={submit} busy={signUp.isPending} />
      <Text style={styles.switch}>
        Already have an account?{' '}
        <Link href="/sign-in" style={styles.link}>
          Sign in
        </Link>
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  lede: { ...type.body, color: colors.graphite },
  switch: { ...type.body, color: colors.graphite, textAlign: 'center' },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong, textDecorationLine: 'underline' },
});
