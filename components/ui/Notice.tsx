import { StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '../../constants/theme';

/** A message box for form-wide problems (the field ones sit under their fields). */
export function Notice({ message, tone = 'problem' }: { message: string; tone?: 'problem' | 'info' }) {
  return (
    <View role={tone === 'problem' ? 'alert' : undefined} style={[styles.box, tone === 'problem' ? styles.problem : styles.info]}>
      <Text style={styles.text}>{message}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.sm, padding: space.md, borderLeftWidth: 4 },
  problem: { backgroundColor: '#F6E3DF', borderLeftColor: colors.danger },
  info: { backgroundColor: colors.paperDeep, borderLeftColor: colors.graphite },
  text: { ...type.small, color: colors.ink },
});
