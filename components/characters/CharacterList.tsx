import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import type { Character } from '../../schemas/characters';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { formatDay } from '../ui/format';
import { formatBytes } from './format';

/** The team's characters: a card each on a phone, one table on a wide screen. */
export function CharacterList({ characters }: { characters: Character[] }) {
  return useIsWide() ? <CharacterTable characters={characters} /> : <CharacterCards characters={characters} />;
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.figure}>
      <Text style={styles.figureValue}>{value}</Text>
      <Text style={styles.figureLabel}>{label}</Text>
    </View>
  );
}

function CharacterCards({ characters }: { characters: Character[] }) {
  const router = useRouter();
  return (
    <View style={styles.cards} role="list" aria-label="Characters">
      {characters.map((c) => (
        <View key={c.id} role="listitem" aria-label={c.name}>
          <Pressable role="link" accessibilityLabel={`Open ${c.name}`} onPress={() => router.push(`/characters/${c.id}`)} style={({ pressed }) => [styles.card, pressed && styles.pressed]}>
            <Text style={styles.cardName}>{c.name}</Text>
            <View style={styles.figures}>
              <Figure label="legs" value={String(c.legCount)} />
              <Figure label="joints" value={String(c.jointCount)} />
              <Figure label="file" value={formatBytes(c.byteSize)} />
            </View>
            <Text style={styles.meta}>
              {c.uploadedBy.name} · {formatDay(c.createdAt)}
            </Text>
          </Pressable>
        </View>
      ))}
    </View>
  );
}

const COLUMNS = [
  { key: 'name', label: 'Name', flex: 3, numeric: false },
  { key: 'legs', label: 'Legs', flex: 1, numeric: true },
  { key: 'joints', label: 'Joints', flex: 1, numeric: true },
  { key: 'size', label: 'File size', flex: 1.4, numeric: true },
  { key: 'by', label: 'Uploaded by', flex: 2.2, numeric: false },
  { key: 'when', label: 'When', flex: 1.6, numeric: true },
] as const;

function CharacterTable({ characters }: { characters: Character[] }) {
  const router = useRouter();
  const cells = (c: Character): Record<(typeof COLUMNS)[number]['key'], string> => ({
    name: c.name,
    legs: String(c.legCount),
    joints: String(c.jointCount),
    size: formatBytes(c.byteSize),
    by: c.uploadedBy.name,
    when: formatDay(c.createdAt),
  });
  return (
    <View style={styles.table} role="table" aria-label="Characters">
      <View style={[styles.row, styles.headRow]} role="row">
        {COLUMNS.map((col) => (
          <Text key={col.key} role="columnheader" style={[styles.headCell, { flex: col.flex }, col.numeric && styles.numeric]}>
            {col.label}
          </Text>
        ))}
      </View>
      {characters.map((c) => {
        const v = cells(c);
        return (
          <Pressable key={c.id} role="row" accessibilityLabel={c.name} onPress={() => router.push(`/characters/${c.id}`)} style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [styles.row, (pressed || hovered) && styles.pressed]}>
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
  figures: { flexDirection: 'row', gap: space.xl },
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
