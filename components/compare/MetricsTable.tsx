import { useEffect, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { bestIndex, METRIC_GROUPS, METRIC_ROWS, type MetricGroup, type MetricRow } from '../../engine/profile/metric-rows';
import { colors, fonts, space, type } from '../../constants/theme';
import type { CompareResult } from '../../hooks/useCompare';
import { useIsWide } from '../../hooks/useLayout';
import { ChoiceChips } from '../ui/ChoiceChips';
import { ENTRY_STYLES } from './entryStyles';
import type { CompareFocus } from './focus';

type Entry = CompareResult['entries'][number];

const fmt = (v: number | null, digits: number) => (v === null ? '—' : v.toFixed(digits));
const signed = (v: number, digits: number) => `${v > 0 ? '+' : v < 0 ? '−' : '±'}${Math.abs(v).toFixed(digits)}`;

function Row({ row, entries, focus }: { row: MetricRow; entries: Entry[]; focus?: CompareFocus | null }) {
  const values = entries.map((e) => row.value(e.metrics));
  const best = bestIndex(row, values);
  const allSame = values.every((v) => v === values[0]);
  const focused = !!focus?.rows.includes(row.key);
  const focusedCells = focused ? (focus!.cells[row.key] ?? []) : [];
  return (
    <View role="row" testID={`metric-row-${row.key}`} aria-current={focused ? 'true' : undefined} style={[styles.row, focused && styles.focusedRow]}>
      <View role="rowheader" style={[styles.labelCell, focused && styles.focusedLabel]}>
        <Text style={styles.label}>{row.label}</Text>
        <Text style={styles.unit}>
          {row.unit ? `${row.unit} · ` : ''}
          {row.better === 'higher' ? 'higher is better' : row.better === 'lower' ? 'lower is better' : 'for reference'}
        </Text>
      </View>
      {values.map((v, i) => {
        const isBest = i === best && !allSame;
        const diff = v !== null && best >= 0 && values[best] !== null && !isBest && !allSame ? v - (values[best] as number) : null;
        const underCursor = focusedCells.includes(entries[i].pick);
        return (
          <View
            key={entries[i].pick}
            role="cell"
            testID={`metric-cell-${row.key}-${entries[i].pick}`}
            aria-current={underCursor ? 'true' : undefined}
            style={[styles.cell, isBest && styles.bestCell, underCursor && styles.focusedCell]}
            aria-label={`${entries[i].characterName}: ${fmt(v, row.digits)}${isBest ? ', best' : ''}${underCursor ? ', under the cursor' : ''}`}
          >
            <Text style={[styles.value, isBest && styles.bestValue]}>
              {isBest ? '★ ' : ''}
              {fmt(v, row.digits)}
            </Text>
            {diff !== null ? <Text style={styles.diff}>{signed(diff, row.digits)}</Text> : isBest ? <Text style={styles.bestWord}>best</Text> : null}
          </View>
        );
      })}
    </View>
  );
}

/** Each course's own footing score, as that course's trial reports it (the suite score pools them). */
function courseRows(entries: Entry[]): MetricRow[] {
  const names = entries[0]?.metrics.courses.map((c) => c.course) ?? [];
  return names.map((name) => ({
    key: `course.${name}`,
    label: name,
    group: 'score',
    unit: 'footing score',
    better: 'higher',
    digits: 1,
    value: (m) => m.courses.find((c) => c.course === name)?.footingScore ?? null,
  }));
}

const groupOf = (key: string): MetricGroup => (key.startsWith('course.') ? 'score' : (METRIC_ROWS.find((r) => r.key === key)?.group ?? 'score'));

/**
 * Metrics side by side, the best of each row starred; phone: one group at a time, wide: all of them. The rows in
 * `focus` (what the cursor points at in the plot or the walk) light up, and in them the cells of the entries meant.
 */
export function MetricsTable({ entries, focus }: { entries: Entry[]; focus?: CompareFocus | null }) {
  const wide = useIsWide();
  const perCourse = courseRows(entries);
  const [group, setGroup] = useState<MetricGroup>('score');
  // On a phone the table shows one group: follow the row pointed at, so its highlight is on screen.
  const pointedGroup = focus?.rows[0] ? groupOf(focus.rows[0]) : null;
  useEffect(() => {
    if (pointedGroup) setGroup(pointedGroup);
  }, [pointedGroup]);
  const groups = wide ? METRIC_GROUPS : METRIC_GROUPS.filter((g) => g.group === group);
  return (
    <View style={styles.wrap}>
      {wide ? null : <ChoiceChips label="Metric group" choices={METRIC_GROUPS.map((g) => ({ value: g.group as MetricGroup, label: g.label }))} value={group} onChange={(g: MetricGroup) => setGroup(g)} />}
      <View role="table" aria-label="Metrics side by side" style={styles.table}>
        <View role="row" style={[styles.row, styles.head]}>
          <View role="columnheader" style={styles.labelCell}>
            <Text style={[styles.headText, styles.left]}>Metric</Text>
          </View>
          {entries.map((e, i) => (
            <View key={e.pick} role="columnheader" style={styles.cell}>
              <View style={[styles.swatch, { backgroundColor: ENTRY_STYLES[i].color }]} />
              <Text style={styles.headText}>{e.characterName}</Text>
              <Text style={[styles.unit, styles.right]}>{e.label.split(' · ')[1] ?? ''}</Text>
            </View>
          ))}
        </View>
        {groups.map((g) => (
          <View key={g.group}>
            <Text role="row" style={styles.groupTitle}>
              {g.label}
            </Text>
            {METRIC_ROWS.filter((r) => r.group === g.group).map((r) => (
              <Row key={r.key} row={r} entries={entries} focus={focus} />
            ))}
            {g.group === 'score' && perCourse.length ? (
              <>
                <Text role="row" style={styles.subTitle}>
                  Per course
                </Text>
                {perCourse.map((r) => (
                  <Row key={r.key} row={r} entries={entries} focus={focus} />
                ))}
              </>
            ) : null}
          </View>
        ))}
      </View>
      <Text style={styles.unit}>★ marks the best in each row; the small figures are each entry's difference from the best. Rows under the cursor in the plot or the walk below light up, with a bar at their left and a frame round the entry meant.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  left: { textAlign: 'left' },
  right: { textAlign: 'right' },
  subTitle: { fontFamily: fonts.bodyMedium, fontSize: 13, color: colors.graphite, paddingTop: space.sm, paddingBottom: space.xs },
  table: { borderTopWidth: 1, borderTopColor: colors.rule },
  head: { backgroundColor: colors.paperDeep },
  headText: { fontFamily: fonts.bodyStrong, fontSize: 13, color: colors.ink, textAlign: 'right' },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.rule, alignItems: 'stretch' },
  groupTitle: { fontFamily: fonts.headingMedium, fontSize: 15, color: colors.ink, paddingTop: space.md, paddingBottom: space.xs },
  labelCell: { flex: 1.6, paddingVertical: space.sm, paddingRight: space.sm, justifyContent: 'center', textAlign: 'left' },
  label: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  unit: { ...type.small, color: colors.graphite, fontSize: 12 },
  cell: { flex: 1, paddingVertical: space.sm, paddingHorizontal: space.xs, alignItems: 'flex-end', justifyContent: 'center', minWidth: 0 },
  bestCell: { backgroundColor: '#E4EDDF' },
  focusedRow: { backgroundColor: '#FBE6DC' },
  focusedLabel: { borderLeftWidth: 3, borderLeftColor: colors.ember, paddingLeft: space.xs },
  focusedCell: { borderWidth: 2, borderColor: colors.ember, borderRadius: 4 },
  value: { fontFamily: fonts.mono, fontSize: 14, color: colors.ink, textAlign: 'right' },
  bestValue: { fontFamily: fonts.monoMedium },
  diff: { fontFamily: fonts.mono, fontSize: 12, color: colors.graphite, textAlign: 'right' },
  bestWord: { fontFamily: fonts.bodyMedium, fontSize: 12, color: colors.moss },
  swatch: { width: 18, height: 3, borderRadius: 2, marginBottom: 2 },
});
