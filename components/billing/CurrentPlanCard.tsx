import { StyleSheet, Text, View } from 'react-native';
import type { OwnerBilling, Plan } from '../../schemas/billing';
import { colors, fonts, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { formatDay } from '../ui/format';
import { formatMoney } from './money';
import { ConfirmPanel } from './ConfirmPanel';
import { readOnlyAfter } from './impact';

const STATUS_WORDS: Record<OwnerBilling['status'], string> = {
  free: 'Free plan',
  active: 'Active',
  trialing: 'Trial',
  past_due: 'Payment overdue: the payment service is retrying',
  unpaid: 'Unpaid',
  canceled: 'Ended',
  incomplete: 'Waiting for payment',
  incomplete_expired: 'Payment not completed',
  paused: 'Paused',
};

export function CurrentPlanCard({ billing, freePlan, confirmingCancel, busy, onAskCancel, onCancel, onKeep, onResume }: {
  billing: OwnerBilling;
  freePlan: Plan;
  confirmingCancel: boolean;
  busy: boolean;
  onAskCancel(): void;
  onCancel(): void;
  onKeep(): void;
  onResume(): void;
}) {
  const { plan, currentPeriodEnd, cancelAtPeriodEnd } = billing;
  const paid = plan.monthlyPrice > 0;
  const end = currentPeriodEnd ? formatDay(currentPeriodEnd) : null;
  const lost = readOnlyAfter(billing.usage, freePlan);
  let when = STATUS_WORDS[billing.status];
  if (paid && end) when = cancelAtPeriodEnd ? `Ends on ${end}, then Solo` : `${when} · renews on ${end}`;
  return (
    <Card>
      <Text style={styles.kicker}>Current plan</Text>
      <View style={styles.head}>
        <Text role="heading" aria-level={2} style={styles.name}>
          {plan.name}
        </Text>
        <Text style={styles.price}>{paid ? `${formatMoney(plan.monthlyPrice, plan.currency)} / month` : 'Free'}</Text>
      </View>
      <Text style={[styles.status, cancelAtPeriodEnd && styles.ending]}>{when}</Text>
      {paid && !cancelAtPeriodEnd && !confirmingCancel ? <Button label="Cancel subscription" tone="quiet" onPress={onAskCancel} /> : null}
      {confirmingCancel ? (
        <ConfirmPanel
          message={`${plan.name} stays until ${end ?? 'the end of this period'}; then the studio moves to the free Solo plan and no further invoices come. Nothing is deleted${lost ? `: ${lost} over Solo’s limits become read-only until you are back under them` : ''}. You can take this back until then.`}
          confirmLabel="Cancel at period end"
          keepLabel={`Keep ${plan.name}`}
          busy={busy}
          onConfirm={onCancel}
          onKeep={onKeep}
        />
      ) : null}
      {cancelAtPeriodEnd ? <Button label={`Keep ${plan.name} after ${end ?? 'this period'}`} busy={busy} onPress={onResume} /> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  kicker: { ...type.label, color: colors.graphite, textTransform: 'uppercase', letterSpacing: 0.6 },
  head: { flexDirection: 'row', alignItems: 'baseline', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  name: { ...type.display, color: colors.ink },
  price: { fontFamily: fonts.mono, fontSize: 16, color: colors.ink },
  status: { ...type.body, color: colors.graphite },
  ending: { color: colors.danger },
});
