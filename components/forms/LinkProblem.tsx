import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '../../constants/theme';
import { Notice } from '../ui/Notice';

/** What a dead invite or reset link shows: the server's reason and the way forward. */
export function LinkProblem({ title, message }: { title: string; message: string }) {
  return (
    <View style={styles.stack}>
      <Text role="heading" aria-level={1} style={styles.title}>
        {title}
      </Text>
      <Notice message={message} />
      <Link href="/sign-in" style={styles.link}>
        Go to sign-in
      </Link>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  title: { ...type.title, color: colors.ink },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong, fontSize: 16, textDecorationLine: 'underline' },
});
