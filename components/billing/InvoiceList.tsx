import { StyleSheet, Text, View } from 'react-native';
import type { Invoice } from '../../schemas/billing';
import { colors, fonts, space, type } from '../../constants/theme';
import { formatDay } from '../ui/format';
import { formatMoney } from './money';

/** The studio's invoices, newest first: date, number and what for, then the amount right-aligned in mono. */
export function InvoiceList({ invoices }: { invoices: readonly Invoice[] }) {
  if (!invoices.length) return <Text style={styles.empty}>No invoices yet. They appear here once a paid plan starts.</Text>;
  return (
    <View role="list" aria-label="Invoices" style={styles.list}>
      {invoices.map((i) => (
        <View role="listitem" key={i.id} style={styles.row}>
          <View style={styles.what}>
            <Text style={styles.title} numberOfLines={2}>
              {i.description}
            </Text>
            <Text style={styles.meta}>
              {formatDay(i.createdAt)} · <Text style={styles.mono}>{i.number ?? 'draft'}</Text> · {i.status}
            </Text>
          </View>
          <Text style={styles.amount}>{formatMoney(i.total, i.currency)}</Text>
        </View>
      ))}
      <Text style={styles.meta}>Amounts before tax. Test mode invoices carry no real charge.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: 0 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.rule },
  what: { flex: 1, gap: 2 },
  title: { ...type.label, color: colors.ink },
  meta: { ...type.small, color: colors.graphite },
  mono: { fontFamily: fonts.mono },
  amount: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink, textAlign: 'right', minWidth: 88, fontVariant: ['tabular-nums'] },
  empty: { ...type.body, color: colors.graphite },
});
