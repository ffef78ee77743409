import { useLocalSearchParams } from 'expo-router';
import { BillingPage, type CheckoutReturn } from '../../../components/billing/BillingPage';

export default function BillingScreen() {
  const { checkout } = useLocalSearchParams<{ checkout?: string }>();
  const back: CheckoutReturn = checkout === 'done' || checkout === 'cancelled' ? checkout : undefined;
  return <BillingPage checkoutReturn={back} />;
}
