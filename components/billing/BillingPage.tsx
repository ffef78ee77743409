import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { BillingView, OwnerBilling, Plan, PlanId } from '../../schemas/billing';
import { colors, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import type { BillingChanges } from '../../hooks/useBilling';
import { Screen } from '../layout/Screen';
import { SplitColumns } from '../layout/SplitColumns';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { BillingCautions } from './BillingCautions';
import { ConfirmPanel } from './ConfirmPanel';
import { CurrentPlanCard } from './CurrentPlanCard';
import { InvoiceList } from './InvoiceList';
import { PlanOption } from './PlanOption';
import { UsageMeter } from './UsageMeter';
import { formatMoney } from './money';
import { readOnlyAfter } from './impact';

export type CheckoutReturn = 'done' | 'cancelled' | undefined;

/** Team → Billing: the owner's plan, usage, plan changes and invoices; every other role sees the plan's name. */
export function BillingPage({ view, plans, changes, checkoutReturn }: { view: BillingView; plans: Plan[]; changes: BillingChanges; checkoutReturn: CheckoutReturn }) {
  if (view.view === 'member') {
    return (
      <Screen title="Billing" lede="The studio’s plan.">
        <Card>
          <Text style={styles.memberPlan}>
            The studio is on the <Text style={styles.strong}>{view.plan.name}</Text> plan.
          </Text>
          <Text style={styles.muted}>Only the studio’s owner sees usage and invoices and changes the plan.</Text>
        </Card>
      </Screen>
    );
  }
  return <OwnerBillingPage billing={view} plans={plans} changes={changes} checkoutReturn={checkoutReturn} />;
}

function OwnerBillingPage({ billing, plans, changes, checkoutReturn }: { billing: OwnerBilling; plans: Plan[]; changes: BillingChanges; checkoutReturn: CheckoutReturn }) {
  const wide = useIsWide();
  const [confirming, setConfirming] = useState<PlanId | 'cancel' | null>(null);
  // The note about the way back from checkout is about that moment; the next action makes it old news.
  const [returnNote, setReturnNote] = useState(checkoutReturn);
  const { checkout, change, cancel, resume } = changes;
  const problem = [checkout, change, cancel, resume].find((m) => m.isError)?.error?.message;
  const paid = billing.plan.monthlyPrice > 0;
  const solo = plans.find((p) => p.monthlyPrice === 0)!;
  const done = () => setConfirming(null);

  function actionFor(plan: Plan): string | null {
    if (plan.id === billing.plan.id) return null;
    if (plan.monthlyPrice === 0) return billing.cancelAtPeriodEnd ? null : `Move to ${plan.name}`;
    return plan.monthlyPrice > billing.plan.monthlyPrice ? `Upgrade to ${plan.name}` : `Downgrade to ${plan.name}`;
  }
  function choose(plan: Plan) {
    [checkout, change, cancel, resume].forEach((m) => m.reset());
    setReturnNote(undefined);
    if (!paid) checkout.mutate(plan.id);
    else setConfirming(plan.monthlyPrice === 0 ? 'cancel' : plan.id);
  }
  function changeMessage(plan: Plan): string {
    const price = `${formatMoney(plan.monthlyPrice, plan.currency)} a month before tax`;
    if (plan.monthlyPrice > billing.plan.monthlyPrice) {
      return `Move to ${plan.name} now? Its limits apply at once; the difference for the rest of this period is charged straight away, then ${price}.`;
    }
    const lost = readOnlyAfter(billing.usage, plan);
    return `Move to ${plan.name} now? Its limits apply at once${lost ? `: ${lost} become read-only until you are back under them (nothing is deleted)` : ''}. No refund for the rest of this period; from the next invoice ${price}.`;
  }

  return (
    <Screen title="Billing" lede="The studio’s plan, what it uses, and its invoices.">
      {returnNote === 'done' ? <Notice tone="info" message={paid ? `Payment received: the studio is on ${billing.plan.name}.` : 'Waiting for the payment service to confirm the payment…'} /> : null}
      {returnNote === 'cancelled' ? <Notice tone="info" message="Checkout cancelled. Nothing was charged and the plan is unchanged." /> : null}
      {problem ? <Notice message={problem} /> : null}
      <BillingCautions testMode={billing.testMode} />

      <SplitColumns
        main={
          <CurrentPlanCard
            billing={billing}
            freePlan={solo}
            confirmingCancel={confirming === 'cancel'}
            busy={cancel.isPending || resume.isPending}
            onAskCancel={() => {
              setReturnNote(undefined);
              setConfirming('cancel');
            }}
            onCancel={() => cancel.mutate(undefined, { onSuccess: done })}
            onKeep={done}
            onResume={() => {
              setReturnNote(undefined);
              resume.mutate();
            }}
          />
        }
        side={
          <Card>
            <SectionHeading>Usage</SectionHeading>
            {billing.usage.map((u) => (
              <UsageMeter key={u.kind} usage={u} />
            ))}
          </Card>
        }
      />

      <SectionHeading>Plans</SectionHeading>
      <View style={[styles.plans, wide && styles.plansWide]}>
        {plans.map((plan) => (
          <PlanOption
            key={plan.id}
            plan={plan}
            wide={wide}
            current={plan.id === billing.plan.id}
            upgrade={plan.monthlyPrice > billing.plan.monthlyPrice}
            actionLabel={actionFor(plan)}
            busy={(checkout.isPending && checkout.variables === plan.id) || (change.isPending && change.variables === plan.id)}
            disabled={checkout.isPending || change.isPending}
            onChoose={() => choose(plan)}
          >
            {confirming === plan.id ? (
              <ConfirmPanel
                message={changeMessage(plan)}
                confirmLabel={`Move to ${plan.name}`}
                keepLabel={`Keep ${billing.plan.name}`}
                busy={change.isPending}
                onConfirm={() => change.mutate(plan.id, { onSuccess: done })}
                onKeep={done}
              />
            ) : null}
          </PlanOption>
        ))}
      </View>

      <SectionHeading>Invoices</SectionHeading>
      <Card>
        <InvoiceList invoices={billing.invoices} />
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  plans: { gap: space.md },
  plansWide: { flexDirection: 'row', alignItems: 'stretch' },
  memberPlan: { ...type.body, color: colors.ink },
  strong: { fontFamily: type.heading.fontFamily },
  muted: { ...type.small, color: colors.graphite },
});
