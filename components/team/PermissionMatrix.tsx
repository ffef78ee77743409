import { ScrollView, StyleSheet, Text, View } from 'react-native';
import type { PermissionRow } from '../../schemas/permissions';
import { roleLabels, roleSchema } from '../../schemas/roles';
import { colors, fonts, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';

/** Actions down, roles across; a filled mark where the role may act. Straight from the server's table. */
export function PermissionMatrix({ rows }: { rows: PermissionRow[] }) {
  const roles = roleSchema.options;
  return (
    <Card style={styles.card}>
      <ScrollView horizontal contentContainerStyle={styles.scroll}>
        <View role="table" aria-label="Who may do what">
          <View role="row" style={[styles.row, styles.headRow]}>
            <Text role="columnheader" style={[styles.action, styles.head]}>
              Action
            </Text>
            {roles.map((r) => (
              <Text key={r} role="columnheader" style={[styles.cell, styles.head]}>
                {roleLabels[r]}
              </Text>
            ))}
          </View>
          {rows.map((row) => (
            <View key={row.action} role="row" style={styles.row}>
              <Text role="rowheader" style={styles.action}>
                {row.label}
              </Text>
              {roles.map((r) => {
                const yes = row.roles.includes(r);
                return (
                  <View key={r} role="cell" aria-label={`${roleLabels[r]}: ${yes ? 'yes' : 'no'}`} style={styles.cellBox}>
                    <View style={[styles.mark, yes ? styles.markYes : styles.markNo]} />
                  </View>
                );
              })}
            </View>
          ))}
        </View>
      </ScrollView>
      <Text style={styles.note}>Filled: allowed. Hollow: not allowed. The server enforces this same table on every request.</Text>
    </Card>
  );
}

const CELL = 84;
const styles = StyleSheet.create({
  card: { paddingHorizontal: 0 },
  scroll: { paddingHorizontal: space.lg },
  row: { flexDirection: 'row', alignItems: 'center', minHeight: 36, borderBottomWidth: 1, borderBottomColor: colors.paperDeep },
  headRow: { borderBottomColor: colors.rule },
  head: { fontFamily: fonts.bodyStrong, fontSize: 13, color: colors.ink },
  action: { width: 180, ...type.small, color: colors.ink, paddingRight: space.sm },
  cell: { width: CELL, textAlign: 'center' },
  cellBox: { width: CELL, alignItems: 'center' },
  mark: { width: 14, height: 14, borderRadius: 7, borderWidth: 2, borderColor: colors.ink },
  markYes: { backgroundColor: colors.moss, borderColor: colors.moss },
  markNo: { backgroundColor: 'transparent', borderColor: colors.rule },
  note: { ...type.small, color: colors.graphite, paddingHorizontal: space.lg },
});
