import { StyleSheet, Text, View } from 'react-native';
import { tunableByKey, type DialInResult } from '../../schemas/dial-ins';
import { colors, fonts, space, type } from '../../constants/theme';
import { isBetter, showValue, valueAt } from './outcome';

const f = (v: number) => v.toFixed(1);

function Change({ before, after }: { before: number; after: number }) {
  const d = Math.round(after * 10) / 10 - Math.round(before * 10) / 10;
  if (Math.abs(d) < 0.05) return <Text style={[styles.num, styles.flat]}>± 0.0</Text>;
  return <Text style={[styles.num, d > 0 ? styles.better : styles.worse]}>{d > 0 ? `+${d.toFixed(1)}` : `−${Math.abs(d).toFixed(1)}`}</Text>;
}

/**
 * Footing score of the start and of the best candidate per course, with the change; then each tuned setting
 * from its start value to the value found. The better colour only where the shown figure really rose.
 */
export function BeforeAfter({ result, startSetup }: { result: DialInResult; startSetup?: unknown }) {
  const before = result.before!;
  const after = result.after!;
  const startValues = (result as { startValues?: Record<string, number> }).startValues;
  return (
    <View style={styles.wrap} testID="dial-in-result">
      <View style={styles.head}>
        <Text style={[styles.cell, styles.headText]}>Footing score</Text>
        <Text style={[styles.num, styles.headText]}>start</Text>
        <Text style={[styles.num, styles.headText]}>best</Text>
        <Text style={[styles.num, styles.headText]}>change</Text>
      </View>
      {after.perCourse.map((c) => {
        const b = before.perCourse.find((p) => p.courseId === c.courseId)?.footingScore ?? 0;
        return (
          <View key={c.courseId} style={styles.row} aria-label={`${c.courseName}: start ${f(b)}, best ${f(c.footingScore)}`}>
            <Text style={[styles.cell, styles.name]}>{c.courseName}</Text>
            <Text style={styles.num}>{f(b)}</Text>
            <Text style={[styles.num, isBetter(b, c.footingScore) && styles.better]}>{f(c.footingScore)}</Text>
            <Change before={b} after={c.footingScore} />
          </View>
        );
      })}
      <View style={[styles.row, styles.total]} aria-label={`Suite mean: start ${f(before.footingScore)}, best ${f(after.footingScore)}`}>
        <Text style={[styles.cell, styles.name, styles.strong]}>Suite mean</Text>
        <Text style={[styles.num, styles.strong]}>{f(before.footingScore)}</Text>
        <Text style={[styles.num, styles.strong, isBetter(before.footingScore, after.footingScore) && styles.better]} testID="dial-in-best-mean">
          {f(after.footingScore)}
        </Text>
        <Change before={before.footingScore} after={after.footingScore} />
      </View>

      {Object.keys(result.bestValues ?? {}).length ? (
        <>
          <View style={[styles.head, styles.gap]}>
            <Text style={[styles.cell, styles.headText]}>Tuned setting</Text>
            <Text style={[styles.wideNum, styles.headText]}>start</Text>
            <Text style={[styles.wideNum, styles.headText]}>found</Text>
          </View>
          {Object.entries(result.bestValues ?? {}).map(([k, v]) => {
            const start = startValues?.[k] ?? valueAt(startSetup, k);
            const label = tunableByKey(k)?.label ?? k;
            return (
              <View key={k} style={styles.row} aria-label={`${label}: start ${start === null ? 'unknown' : showValue(k, start)}, found ${showValue(k, v)}`}>
                <Text style={[styles.cell, styles.name]}>{label}</Text>
                <Text style={styles.wideNum}>{start === null ? '–' : showValue(k, start)}</Text>
                <Text style={styles.wideNum}>{showValue(k, v)}</Text>
              </View>
            );
          })}
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 2 },
  head: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.rule, paddingBottom: space.xs },
  gap: { marginTop: space.md },
  headText: { ...type.small, color: colors.graphite },
  row: { flexDirection: 'row', alignItems: 'center', minHeight: 28, gap: space.xs },
  total: { borderTopWidth: 1, borderColor: colors.rule },
  cell: { flex: 1, minWidth: 0 },
  name: { ...type.small, color: colors.ink },
  num: { width: 58, textAlign: 'right', fontFamily: fonts.mono, fontSize: 14, color: colors.ink },
  wideNum: { width: 86, textAlign: 'right', fontFamily: fonts.mono, fontSize: 14, color: colors.ink },
  better: { color: colors.moss },
  worse: { color: colors.danger },
  flat: { color: colors.graphite },
  strong: { fontFamily: fonts.monoMedium },
});
