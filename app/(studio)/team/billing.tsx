import { useLocalSearchParams } from 'expo-router';
import { BillingPage, type CheckoutReturn } from '../../../components/billing/BillingPage';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { useBilling, useBillingChanges, usePlans } from '../../../hooks/useBilling';

export default function BillingScreen() {
  const { checkout } = useLocalSearchParams<{ checkout?: string }>();
  const back: CheckoutReturn = checkout === 'done' || checkout === 'cancelled' ? checkout : undefined;
  const billing = useBilling(back === 'done');
  const plans = usePlans();
  const changes = useBillingChanges();
  if (billing.isPending || plans.isPending) return <LoadingPage />;
  if (billing.isError) return <LoadingPage problem={billing.error.message} onRetry={() => billing.refetch()} />;
  if (plans.isError) return <LoadingPage problem={plans.error.message} onRetry={() => plans.refetch()} />;
  return <BillingPage view={billing.data} plans={plans.data.plans} changes={changes} checkoutReturn={back} />;
}
