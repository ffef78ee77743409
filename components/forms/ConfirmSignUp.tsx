import { useRouter } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import { Button } from '../ui/Button';
import { LinkProblem } from './LinkProblem';

/**
 * The mailed sign-up link. It asks for one tap rather than acting on page load, so a mail scanner that opens
 * links ahead of the reader cannot spend it.
 */
export function ConfirmSignUp({ confirm }: { confirm: Mutation }) {
  const router = useRouter();
  if (confirm.isError) return <LinkProblem title="This sign-up link cannot be used" message={confirm.error.message} />;
  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        Your studio is nearly ready
      </Text>
      <Text style={styles.lede}>This link proves the address is yours. Open the studio to sign in as its owner; you can invite your team from there.</Text>
      <Button label="Open my studio" onPress={() => confirm.mutate(undefined, { onSuccess: () => router.replace('/') })} busy={confirm.isPending} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  lede: { ...type.body, color: colors.graphite },
});
