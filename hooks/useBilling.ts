import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BillingView, CheckoutResponse, PlanId, PlansResponse } from '../schemas/billing';
import { api, ApiError } from './api';

export const billingQueryKey = ['billing'] as const;

export function usePlans() {
  return useQuery({ queryKey: ['plans'], queryFn: () => api<PlansResponse>('/plans'), staleTime: 10 * 60_000 });
}

/**
 * The studio's plan (everything for the owner, the name for others). Just back from the checkout page, it asks
 * again every two seconds for a while in case the payment news is still on its way.
 */
export function useBilling(waitingForPayment = false) {
  return useQuery({
    queryKey: billingQueryKey,
    queryFn: () => api<BillingView>('/billing'),
    refetchInterval: (query) => (waitingForPayment && query.state.data?.plan.id === 'solo' && query.state.dataUpdateCount < 15 ? 2000 : false),
  });
}

/** Opens a checkout and leaves for the payment service's page (another origin, so a full navigation). */
export function useStartCheckout() {
  return useMutation<CheckoutResponse, ApiError, PlanId>({
    mutationFn: (plan) => api<CheckoutResponse>('/billing/checkout', { method: 'POST', body: { plan } }),
    onSuccess: ({ url }) => {
      if (typeof window !== 'undefined') window.location.assign(url);
    },
  });
}

function useBillingChange<V>(path: string, body: (v: V) => unknown) {
  const client = useQueryClient();
  return useMutation<BillingView, ApiError, V>({
    mutationFn: (v) => api<BillingView>(path, { method: 'POST', body: body(v) }),
    onSuccess: (view) => client.setQueryData(billingQueryKey, view),
  });
}

export const useChangePlan = () => useBillingChange<PlanId>('/billing/plan', (plan) => ({ plan }));
export const useCancelSubscription = () => useBillingChange<void>('/billing/cancel', () => ({}));
export const useResumeSubscription = () => useBillingChange<void>('/billing/resume', () => ({}));

/** The owner's four plan changes, held by the billing screen and handed to its page. */
export function useBillingChanges() {
  return { checkout: useStartCheckout(), change: useChangePlan(), cancel: useCancelSubscription(), resume: useResumeSubscription() };
}
export type BillingChanges = ReturnType<typeof useBillingChanges>;
