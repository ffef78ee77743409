import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import type { CourseSummary } from '../../schemas/courses';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { formatDay } from '../ui/format';

const relief = (c: CourseSummary) => `${(c.maxHeight - c.minHeight).toFixed(2)} m`;
const kinds = (c: CourseSummary) => (c.generatorKinds.length ? c.generatorKinds.join(', ') : 'uploaded');

/** The team's courses: a card each on a phone, one table on a wide screen. */
export function CourseList({ courses }: { courses: CourseSummary[] }) {
  return useIsWide() ? <CourseTable courses={courses} /> : <CourseCards courses={courses} />;
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.figure}>
      <Text style={styles.figureValue}>{value}</Text>
      <Text style={styles.figureLabel}>{label}</Text>
    </View>
  );
}

function CourseCards({ courses }: { courses: CourseSummary[] }) {
  const router = useRouter();
  return (
    <View style={styles.cards} role="list" aria-label="Courses">
      {courses.map((c) => (
        <View key={c.id} role="listitem" aria-label={c.name}>
          <Pressable role="link" accessibilityLabel={`Open ${c.name}`} onPress={() => router.push(`/courses/${c.id}`)} style={({ pressed }) => [styles.card, pressed && styles.pressed]}>
            <Text style={styles.cardName}>{c.name}</Text>
            <View style={styles.figures}>
              <Figure label="long" value={`${c.length.toFixed(2)} m`} />
              <Figure label="wide" value={`${c.width.toFixed(2)} m`} />
              <Figure label="relief" value={relief(c)} />
              <Figure label="version" value={String(c.version)} />
            </View>
            <Text style={styles.meta}>
              {kinds(c)} · {c.updatedBy.name} · {formatDay(c.updatedAt)}
            </Text>
          </Pressable>
        </View>
      ))}
    </View>
  );
}

const COLUMNS = [
  { key: 'name', label: 'Name', flex: 3, numeric: false },
  { key: 'made', label: 'Made from', flex: 2.4, numeric: false },
  { key: 'length', label: 'Length', flex: 1.2, numeric: true },
  { key: 'width', label: 'Width', flex: 1.1, numeric: true },
  { key: 'relief', label: 'Relief', flex: 1.1, numeric: true },
  { key: 'version', label: 'Version', flex: 1, numeric: true },
  { key: 'when', label: 'Saved', flex: 1.5, numeric: true },
] as const;

function CourseTable({ courses }: { courses: CourseSummary[] }) {
  const router = useRouter();
  const cells = (c: CourseSummary): Record<(typeof COLUMNS)[number]['key'], string> => ({
    name: c.name,
    made: kinds(c),
    length: `${c.length.toFixed(2)} m`,
    width: `${c.width.toFixed(2)} m`,
    relief: relief(c),
    version: String(c.version),
    when: formatDay(c.updatedAt),
  });
  return (
    <View style={styles.table} role="table" aria-label="Courses">
      <View style={[styles.row, styles.headRow]} role="row">
        {COLUMNS.map((col) => (
          <Text key={col.key} role="columnheader" style={[styles.headCell, { flex: col.flex }, col.numeric && styles.numeric]}>
            {col.label}
          </Text>
        ))}
      </View>
      {courses.map((c) => {
        const v = cells(c);
        return (
          <Pressable
            key={c.id}
            role="row"
            accessibilityLabel={`Open ${c.name}`}
            onPress={() => router.push(`/courses/${c.id}`)}
            style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [styles.row, (pressed || hovered) && styles.pressed]}
          >
            {COLUMNS.map((col) => (
              <Text key={col.key} role="cell" style={[col.numeric ? styles.figureCell : col.key === 'name' ? styles.nameCell : styles.cell, { flex: col.flex }, col.numeric && styles.numeric]}>
                {v[col.key]}
              </Text>
            ))}
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  cards: { gap: space.md },
  card: { backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.rule, padding: space.lg, gap: space.sm, minHeight: touchTarget },
  pressed: { backgroundColor: colors.paperDeep },
  cardName: { ...type.heading, color: colors.ink },
  figures: { flexDirection: 'row', gap: space.xl, flexWrap: 'wrap' },
  figure: { alignItems: 'flex-end' },
  figureValue: { ...type.figure, color: colors.ink },
  figureLabel: { ...type.small, color: colors.graphite },
  meta: { ...type.small, color: colors.graphite },
  table: { backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.rule, overflow: 'hidden' },
  row: { flexDirection: 'row', alignItems: 'center', minHeight: touchTarget + 4, paddingHorizontal: space.lg, gap: space.md, borderTopWidth: 1, borderTopColor: colors.rule },
  headRow: { borderTopWidth: 0, backgroundColor: colors.paperDeep, minHeight: touchTarget },
  headCell: { ...type.label, color: colors.graphite },
  cell: { ...type.body, color: colors.ink },
  nameCell: { fontFamily: fonts.bodyStrong, fontSize: 16, color: colors.ink },
  figureCell: { ...type.figure, color: colors.ink },
  numeric: { textAlign: 'right' },
});
