import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter, type Href } from 'expo-router';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';

export interface RecordColumn<K extends string> {
  key: K;
  label: string;
  flex: number;
  /** Figures: right-aligned in the mono face. */
  numeric: boolean;
}

export interface RecordListProps<T, K extends string> {
  /** What the list holds, for assistive technology ("Characters"). */
  label: string;
  items: readonly T[];
  idOf(item: T): number;
  nameOf(item: T): string;
  hrefOf(item: T): Href;
  /** The wide table's columns; the one keyed 'name' is drawn as the name. */
  columns: readonly RecordColumn<K>[];
  cells(item: T): Record<K, string>;
  /** The phone card's figures under the name. */
  figures(item: T): { label: string; value: string }[];
  /** The phone card's last line. */
  meta(item: T): string;
}

/** A team's records: a card each on a phone, one table on a wide screen; each opens its own page. */
export function RecordList<T, K extends string>(props: RecordListProps<T, K>) {
  return useIsWide() ? <RecordTable {...props} /> : <RecordCards {...props} />;
}

function RecordCards<T, K extends string>({ label, items, idOf, nameOf, hrefOf, figures, meta }: RecordListProps<T, K>) {
  const router = useRouter();
  return (
    <View style={styles.cards} role="list" aria-label={label}>
      {items.map((item) => (
        <View key={idOf(item)} role="listitem" aria-label={nameOf(item)}>
          <Pressable
            role="link"
            accessibilityLabel={`Open ${nameOf(item)}`}
            onPress={() => router.push(hrefOf(item))}
            style={({ pressed }) => [styles.card, pressed && styles.pressed]}
          >
            <Text style={styles.cardName}>{nameOf(item)}</Text>
            <View style={styles.figures}>
              {figures(item).map((f) => (
                <View key={f.label} style={styles.figure}>
                  <Text style={styles.figureValue}>{f.value}</Text>
                  <Text style={styles.figureLabel}>{f.label}</Text>
                </View>
              ))}
            </View>
            <Text style={styles.meta}>{meta(item)}</Text>
          </Pressable>
        </View>
      ))}
    </View>
  );
}

function RecordTable<T, K extends string>({ label, items, idOf, nameOf, hrefOf, columns, cells }: RecordListProps<T, K>) {
  const router = useRouter();
  return (
    <View style={styles.table} role="table" aria-label={label}>
      <View style={[styles.row, styles.headRow]} role="row">
        {columns.map((col) => (
          <Text key={col.key} role="columnheader" style={[styles.headCell, { flex: col.flex }, col.numeric && styles.numeric]}>
            {col.label}
          </Text>
        ))}
      </View>
      {items.map((item) => {
        const v = cells(item);
        return (
          <Pressable
            key={idOf(item)}
            role="row"
            accessibilityLabel={`Open ${nameOf(item)}`}
            onPress={() => router.push(hrefOf(item))}
            style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [styles.row, (pressed || hovered) && styles.pressed]}
          >
            {columns.map((col) => (
              <Text
                key={col.key}
                role="cell"
                style={[col.numeric ? styles.figureCell : col.key === 'name' ? styles.nameCell : styles.cell, { flex: col.flex }, col.numeric && styles.numeric]}
              >
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
