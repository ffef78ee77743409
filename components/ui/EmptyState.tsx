import { StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '../../constants/theme';

/** What a section will hold, said plainly until it holds it. */
export function EmptyState({ heading, body, points }: { heading: string; body: string; points?: readonly string[] }) {
  return (
    <View style={styles.box}>
      <Text style={styles.heading}>{heading}</Text>
      <Text style={styles.body}>{body}</Text>
      {points?.map((p) => (
        <View key={p} style={styles.point}>
          <View style={styles.dot} />
          <Text style={styles.pointText}>{p}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    borderWidth: 1.5,
    borderStyle: 'dashed',
    borderColor: colors.rule,
    borderRadius: radius.lg,
    padding: space.xl,
    gap: space.md,
  },
  heading: { ...type.heading, color: colors.ink },
  body: { ...type.body, color: colors.graphite },
  point: { flexDirection: 'row', gap: space.sm, alignItems: 'center' },
  dot: { width: 6, height: 6, borderRadius: 3, backgroundColor: colors.ember },
  pointText: { ...type.small, color: colors.ink, flexShrink: 1 },
});
