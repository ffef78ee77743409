import { StyleSheet, Text, View } from 'react-native';
import type { Usage } from '../../schemas/billing';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import { formatCount } from './money';

/** One limit: its name, a bar, and the figures (used / allowed) right-aligned in mono. */
export function UsageMeter({ usage }: { usage: Usage }) {
  const share = usage.limit > 0 ? Math.min(1, usage.used / usage.limit) : 1;
  const over = usage.used > usage.limit;
  const full = usage.used >= usage.limit;
  return (
    <View style={styles.row}>
      <View style={styles.head}>
        <Text style={styles.label}>{usage.label}</Text>
        <Text style={[styles.figures, over && styles.overText]} accessibilityLabel={`${usage.used} of ${usage.limit}`}>
          {formatCount(usage.used)} / {formatCount(usage.limit)}
        </Text>
      </View>
      <View style={styles.track} role="progressbar" aria-valuemin={0} aria-valuemax={usage.limit} aria-valuenow={usage.used} aria-label={usage.label}>
        <View style={[styles.fill, { width: `${share * 100}%` }, full && styles.fillFull, over && styles.fillOver]} />
      </View>
      {usage.readOnly > 0 ? (
        <Text style={styles.note}>
          {usage.readOnly} over the limit: read-only until you are back under {formatCount(usage.limit)}. Nothing was deleted.
        </Text>
      ) : full && usage.period === 'month' ? (
        <Text style={styles.note}>Used up for this month; it starts afresh on the 1st (UTC).</Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.xs },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.md },
  label: { ...type.label, color: colors.ink, flexShrink: 1 },
  figures: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink, textAlign: 'right', fontVariant: ['tabular-nums'] },
  overText: { color: colors.danger, fontFamily: fonts.monoMedium },
  track: { height: 10, borderRadius: radius.sm, backgroundColor: colors.paperDeep, overflow: 'hidden', borderWidth: 1, borderColor: colors.rule },
  fill: { height: '100%', backgroundColor: colors.moss },
  fillFull: { backgroundColor: colors.ember },
  fillOver: { backgroundColor: colors.danger },
  note: { ...type.small, color: colors.danger },
});
