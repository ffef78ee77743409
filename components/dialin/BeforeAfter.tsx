import { StyleSheet, Text, View } from 'react-native';
import { tunableByKey, type DialInResult } from '../../schemas/dial-ins';
import { colors, fonts, space, type } from '../../constants/theme';

const f = (v: number, d = 1) => v.toFixed(d);

/** Footing score before and after per course, and the values found. */
export function BeforeAfter({ result }: { result: DialInResult }) {
  const before = result.before!;
  const after = result.after!;
  return (
    <View style={styles.wrap} testID="dial-in-result">
      <View style={styles.head}>
        <Text style={[styles.cell, styles.name]}>Footing score</Text>
        <Text style={styles.num}>before</Text>
        <Text style={styles.num}>after</Text>
      </View>
      {after.perCourse.map((c, i) => (
        <View key={c.courseId} style={styles.row}>
          <Text style={[styles.cell, styles.name]}>{c.courseName}</Text>
          <Text style={styles.num}>{f(before.perCourse[i]?.footingScore ?? 0)}</Text>
          <Text style={[styles.num, c.footingScore > (before.perCourse[i]?.footingScore ?? 0) && styles.better]}>{f(c.footingScore)}</Text>
        </View>
      ))}
      <View style={[styles.row, styles.total]}>
        <Text style={[styles.cell, styles.name, styles.strong]}>Suite mean</Text>
        <Text style={[styles.num, styles.strong]}>{f(before.footingScore)}</Text>
        <Text style={[styles.num, styles.strong, styles.better]}>{f(after.footingScore)}</Text>
      </View>
      {Object.entries(result.bestValues ?? {}).map(([k, v]) => (
        <View key={k} style={styles.row}>
          <Text style={[styles.cell, styles.name]}>{tunableByKey(k)?.label ?? k}</Text>
          <Text style={styles.num}>{f(v, 3)}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 2 },
  head: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.rule, paddingBottom: space.xs },
  row: { flexDirection: 'row', alignItems: 'center', minHeight: 28 },
  total: { borderTopWidth: 1, borderColor: colors.rule },
  cell: { flex: 1 },
  name: { ...type.small, color: colors.ink },
  num: { width: 70, textAlign: 'right', fontFamily: fonts.mono, fontSize: 14, color: colors.ink },
  better: { color: colors.moss },
  strong: { fontFamily: fonts.monoMedium },
});
