import type Stripe from 'stripe';
import type { Db } from '../db';
import type { BillingStatus, PlanId } from '../../schemas/billing';
import { FREE_PLAN, planOfLookupKey } from './plans';

/** A team's row in team_billing; a team without one is on the free plan. */
export interface TeamBillingRow {
  team_id: number;
  plan: PlanId;
  status: BillingStatus;
  customer_id: string | null;
  subscription_id: string | null;
  subscription_item_id: string | null;
  subscription_created: number | null;
  current_period_end: number | null;
  cancel_at_period_end: boolean | number;
  updated_at: number;
}

/** Provider statuses under which the team keeps its paid plan (past_due: the provider is still retrying payment). */
const LIVE = new Set(['active', 'trialing', 'past_due']);

export async function teamBilling(db: Db, teamId: number): Promise<TeamBillingRow | null> {
  return (await db<TeamBillingRow>('team_billing').where({ team_id: teamId }).first()) ?? null;
}

export async function currentPlanOf(db: Db, teamId: number): Promise<PlanId> {
  return (await teamBilling(db, teamId))?.plan ?? FREE_PLAN;
}

export function hasLiveSubscription(row: TeamBillingRow | null): row is TeamBillingRow & { subscription_id: string; subscription_item_id: string } {
  return !!row?.subscription_id && !!row.subscription_item_id && LIVE.has(row.status);
}

export async function teamOfCustomer(db: Db, customerId: string): Promise<number | null> {
  const row = await db('team_billing').where({ customer_id: customerId }).first('team_id');
  return row ? (row.team_id as number) : null;
}

/** Remembers the team's customer at the provider (made at its first checkout). */
export async function saveCustomer(db: Db, teamId: number, customerId: string, now: number): Promise<void> {
  await db.transaction(async (trx) => {
    const updated = await trx('team_billing').where({ team_id: teamId }).update({ customer_id: customerId, updated_at: now });
    if (!updated) await trx('team_billing').insert({ team_id: teamId, customer_id: customerId, plan: FREE_PLAN, status: 'free', updated_at: now });
  });
}

export type ApplyOutcome = 'applied' | 'stale_subscription' | 'unknown_price';

/**
 * Writes a subscription as the provider now reports it onto the team (call inside a transaction).
 * Events can arrive late and out of order: news of an older subscription never overrides a newer one
 * (compared by the subscription's `created`), and an ended subscription does not end a different live one.
 */
export async function applySubscription(trx: Db, teamId: number, sub: Stripe.Subscription, now: number): Promise<ApplyOutcome> {
  const row = await teamBilling(trx, teamId);
  if (row?.subscription_id && row.subscription_id !== sub.id) {
    if ((row.subscription_created ?? 0) > sub.created) return 'stale_subscription';
    if (LIVE.has(row.status) && !LIVE.has(sub.status)) return 'stale_subscription';
  }
  const item = sub.items.data[0];
  const paidPlan = planOfLookupKey(item?.price.lookup_key) ?? (item?.price.metadata?.plan as PlanId | undefined) ?? null;
  if (!paidPlan) return 'unknown_price';
  const live = LIVE.has(sub.status);
  const fields = {
    plan: live ? paidPlan : FREE_PLAN,
    status: (live ? sub.status : sub.status === 'canceled' ? 'free' : sub.status) as BillingStatus,
    customer_id: typeof sub.customer === 'string' ? sub.customer : sub.customer.id,
    subscription_id: sub.id,
    subscription_item_id: item.id,
    subscription_created: sub.created,
    current_period_end: live ? item.current_period_end : null,
    cancel_at_period_end: live ? sub.cancel_at_period_end : false,
    updated_at: now,
  };
  if (row) await trx('team_billing').where({ team_id: teamId }).update(fields);
  else await trx('team_billing').insert({ team_id: teamId, ...fields });
  return 'applied';
}

const STATUS_RANK: Record<string, number> = { draft: 0, open: 1, paid: 2, void: 2, uncollectible: 2 };

/** Keeps the team's copy of an invoice; a status never moves backwards (a late "open" after "paid"). */
export async function saveInvoice(trx: Db, teamId: number, invoice: Stripe.Invoice): Promise<void> {
  const existing = await trx('billing_invoices').where({ id: invoice.id }).first('status');
  const status = invoice.status ?? 'draft';
  const row = {
    team_id: teamId,
    number: invoice.number,
    status,
    description: (invoice.description ?? invoice.lines?.data[0]?.description ?? 'Subscription').slice(0, 200),
    total: invoice.total,
    amount_paid: invoice.amount_paid,
    currency: invoice.currency,
    created: invoice.created,
    period_start: invoice.period_start,
    period_end: invoice.period_end,
  };
  if (!existing) await trx('billing_invoices').insert({ id: invoice.id, ...row });
  else if ((STATUS_RANK[status] ?? 0) >= (STATUS_RANK[existing.status] ?? 0)) await trx('billing_invoices').where({ id: invoice.id }).update(row);
}
