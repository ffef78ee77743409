import type Stripe from 'stripe';
import type { AppDeps } from '../deps';
import type { Viewer } from '../middleware/auth';
import type { BillingView, Invoice, OwnerBilling, PlanId, PlansResponse } from '../../schemas/billing';
import { HttpError } from '../errors';
import { FREE_PLAN, isPaidPlan, planById, PLANS } from './plans';
import { priceIds } from './billing-catalog';
import { applySubscription, hasLiveSubscription, saveCustomer, teamBilling } from './billing-state';
import { usageOf } from './billing-limits';

/** The billing screen's data, shaped by role: the owner sees everything, everyone else the plan's name. */
export async function billingViewFor(deps: AppDeps, viewer: Viewer): Promise<BillingView> {
  const row = await teamBilling(deps.db, viewer.team.id);
  const plan = planById(row?.plan ?? FREE_PLAN);
  if (viewer.role !== 'owner') return { view: 'member', plan: { id: plan.id, name: plan.name } };
  const invoices = await deps.db('billing_invoices').where({ team_id: viewer.team.id }).orderBy('created', 'desc').limit(24);
  const view: OwnerBilling = {
    view: 'owner',
    plan,
    status: row?.status ?? 'free',
    cancelAtPeriodEnd: !!row?.cancel_at_period_end,
    currentPeriodEnd: row?.current_period_end ? row.current_period_end * 1000 : null,
    usage: await usageOf(deps.db, viewer.team.id, deps.clock.now()),
    invoices: invoices.map(
      (i): Invoice => ({
        id: i.id,
        number: i.number,
        status: i.status,
        description: i.description,
        total: i.total,
        amountPaid: i.amount_paid,
        currency: i.currency,
        createdAt: i.created * 1000,
        periodStart: i.period_start * 1000,
        periodEnd: i.period_end * 1000,
      }),
    ),
    testMode: deps.payments.testMode,
  };
  return view;
}

export function plansList(deps: AppDeps): PlansResponse {
  return { plans: [...PLANS], testMode: deps.payments.testMode };
}

/** Opens a checkout for a paid plan and answers the address of the provider's hosted page. */
export async function startCheckout(deps: AppDeps, viewer: Viewer, planId: PlanId): Promise<string> {
  if (!isPaidPlan(planId)) {
    throw new HttpError(400, 'free_plan', 'Solo is free and needs no checkout. To move to Solo, cancel the subscription.', { plan: 'Solo is free: choose Crew or Studio.' });
  }
  const teamId = viewer.team.id;
  const row = await teamBilling(deps.db, teamId);
  if (hasLiveSubscription(row)) {
    throw new HttpError(409, 'already_subscribed', `The studio already pays for ${planById(row.plan).name}. Change the plan instead of starting a second checkout.`);
  }
  const client = deps.payments.client;
  const customerId = await ensureCustomer(deps, viewer, row?.customer_id ?? null);
  const price = (await priceIds(client)).get(planId)!;
  const base = deps.publicUrl();
  const session = await client.checkout.sessions.create({
    mode: 'subscription',
    customer: customerId,
    client_reference_id: String(teamId),
    line_items: [{ price, quantity: 1 }],
    metadata: { team_id: String(teamId), plan: planId },
    subscription_data: { metadata: { team_id: String(teamId), plan: planId } },
    success_url: `${base}/team/billing?checkout=done&session={CHECKOUT_SESSION_ID}`,
    cancel_url: `${base}/team/billing?checkout=cancelled`,
  });
  if (!session.url) throw new HttpError(502, 'payments_unavailable', 'The payment service did not give a checkout page. Try again.');
  return session.url;
}

async function ensureCustomer(deps: AppDeps, viewer: Viewer, known: string | null): Promise<string> {
  const client = deps.payments.client;
  if (known) {
    try {
      const existing = await client.customers.retrieve(known);
      if (!('deleted' in existing && existing.deleted)) return known;
    } catch (err) {
      // The provider no longer knows it (the local test service's file was removed, say): make the team a new one.
      if (!isMissing(err)) throw err;
    }
  }
  const customer = await client.customers.create({ name: viewer.team.name, email: viewer.user.email, metadata: { team_id: String(viewer.team.id) } });
  await saveCustomer(deps.db, viewer.team.id, customer.id, deps.clock.now());
  return customer.id;
}

/** Moves a paid subscription to another paid plan now; an upgrade is charged for the rest of the period at once. */
export async function changePlan(deps: AppDeps, viewer: Viewer, planId: PlanId): Promise<void> {
  const row = await teamBilling(deps.db, viewer.team.id);
  if (planId === FREE_PLAN) {
    throw new HttpError(400, 'free_plan', 'To move to Solo, cancel the subscription: the paid plan stays until the period ends.', { plan: 'Cancel the subscription to move to Solo.' });
  }
  if (!hasLiveSubscription(row)) throw new HttpError(409, 'checkout_needed', 'The studio has no paid plan yet. Start a checkout to choose one.');
  if (row.plan === planId) throw new HttpError(409, 'same_plan', `The studio is already on ${planById(planId).name}.`, { plan: 'That is the current plan.' });
  const upgrade = planById(planId).monthlyPrice > planById(row.plan).monthlyPrice;
  const price = (await priceIds(deps.payments.client)).get(planId)!;
  const sub = await updateSubscription(deps, row.subscription_id, {
    items: [{ id: row.subscription_item_id, price }],
    proration_behavior: upgrade ? 'always_invoice' : 'none',
    cancel_at_period_end: false,
    metadata: { plan: planId },
  });
  await record(deps, viewer.team.id, sub);
}

/** Cancels at the period's end (true) or takes a scheduled cancellation back (false). */
export async function setCancelAtPeriodEnd(deps: AppDeps, viewer: Viewer, cancel: boolean): Promise<void> {
  const row = await teamBilling(deps.db, viewer.team.id);
  if (!hasLiveSubscription(row)) throw new HttpError(409, 'no_subscription', 'The studio is on the free Solo plan; there is nothing to cancel.');
  if (!!row.cancel_at_period_end === cancel) {
    throw new HttpError(409, cancel ? 'already_cancelling' : 'not_cancelling', cancel ? 'The subscription already ends at the close of this period.' : 'The subscription is not set to end.');
  }
  const sub = await updateSubscription(deps, row.subscription_id, { cancel_at_period_end: cancel });
  await record(deps, viewer.team.id, sub);
}

async function updateSubscription(deps: AppDeps, id: string, params: Stripe.SubscriptionUpdateParams): Promise<Stripe.Subscription> {
  try {
    return await deps.payments.client.subscriptions.update(id, params);
  } catch (err) {
    if (isMissing(err)) {
      throw new HttpError(409, 'subscription_unknown', 'The payment service no longer knows this subscription (if it is the local test service, its file may have been removed). Nothing was changed.');
    }
    throw err;
  }
}

/** The provider's answer is the subscription as it now stands: keep it at once rather than wait for its webhook. */
async function record(deps: AppDeps, teamId: number, sub: Stripe.Subscription): Promise<void> {
  await deps.db.transaction((trx) => applySubscription(trx, teamId, sub, deps.clock.now()));
}

export function isMissing(err: unknown): boolean {
  return !!err && typeof err === 'object' && 'code' in err && (err as { code?: string }).code === 'resource_missing';
}
