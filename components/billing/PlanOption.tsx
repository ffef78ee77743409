import { StyleSheet, Text, View } from 'react-native';
import type { LimitKind, Plan } from '../../schemas/billing';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { formatCount, formatMoney } from './money';

const LIMIT_ROWS: { kind: LimitKind; label: string }[] = [
  { kind: 'seats', label: 'Seats' },
  { kind: 'characters', label: 'Characters' },
  { kind: 'dialInCandidates', label: 'Dial-in candidates / month' },
  { kind: 'profilePublishes', label: 'Profile publishes / month' },
];

/** One plan with its price and limits, and what choosing it would do from where the studio stands. */
export function PlanOption({ plan, wide, current, upgrade, actionLabel, busy, disabled, onChoose, children }: {
  plan: Plan;
  wide: boolean;
  current: boolean;
  /** Upgrades are the page's call to action; moving down is offered quietly. */
  upgrade: boolean;
  actionLabel: string | null;
  busy: boolean;
  disabled: boolean;
  onChoose(): void;
  children?: React.ReactNode;
}) {
  return (
    <View style={[styles.card, wide && styles.cardWide, current && styles.current]} aria-label={`${plan.name} plan`}>
      <View style={styles.head}>
        <Text style={styles.name}>{plan.name}</Text>
        {current ? <Text style={styles.badge}>Current</Text> : null}
      </View>
      <Text style={styles.price}>
        {plan.monthlyPrice ? formatMoney(plan.monthlyPrice, plan.currency) : 'Free'}
        {plan.monthlyPrice ? <Text style={styles.per}> / month before tax</Text> : null}
      </Text>
      <Text style={styles.blurb}>{plan.blurb}</Text>
      <View style={styles.limits}>
        {LIMIT_ROWS.map((row) => (
          <View key={row.kind} style={styles.limit}>
            <Text style={styles.limitLabel}>{row.label}</Text>
            <Text style={styles.limitValue}>{formatCount(plan.limits[row.kind])}</Text>
          </View>
        ))}
      </View>
      {actionLabel ? <Button label={actionLabel} tone={upgrade ? 'action' : 'quiet'} busy={busy} disabled={disabled} onPress={onChoose} /> : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.rule, padding: space.lg, gap: space.md },
  cardWide: { flex: 1, minWidth: 0 },
  current: { borderColor: colors.ink, borderWidth: 2 },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  name: { ...type.heading, color: colors.ink },
  badge: { ...type.small, fontFamily: fonts.bodyStrong, color: colors.onInk, backgroundColor: colors.ink, paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radius.sm, overflow: 'hidden' },
  price: { fontFamily: fonts.monoMedium, fontSize: 20, color: colors.ink },
  per: { fontFamily: fonts.body, fontSize: 13, color: colors.graphite },
  blurb: { ...type.small, color: colors.graphite },
  limits: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.rule, paddingTop: space.sm },
  limit: { flexDirection: 'row', justifyContent: 'space-between', gap: space.md },
  limitLabel: { ...type.small, color: colors.ink, flexShrink: 1 },
  limitValue: { fontFamily: fonts.mono, fontSize: 14, color: colors.ink, textAlign: 'right', fontVariant: ['tabular-nums'] },
});
