import type Stripe from 'stripe';
import type { AppDeps } from '../deps';
import type { Db } from '../db';
import { HttpError } from '../errors';
import { applySubscription, saveInvoice, teamOfCustomer } from './billing-state';
import { isMissing } from './billing';

export interface WebhookResult {
  duplicate: boolean;
  outcome: string;
}

const SUBSCRIPTION_EVENTS = new Set(['customer.subscription.created', 'customer.subscription.updated', 'customer.subscription.deleted']);
const INVOICE_EVENTS = new Set(['invoice.paid', 'invoice.payment_failed', 'invoice.finalized', 'invoice.updated']);

/**
 * One webhook delivery: the signature is checked against the raw body first (a bad one changes nothing),
 * each event id is handled once, and the team's plan and status change in one transaction.
 * For subscription news the provider's current subscription is fetched rather than trusting the event's copy,
 * so events that arrive late or out of order cannot wind the team back.
 */
export async function handleWebhook(deps: AppDeps, rawBody: Buffer, signature: string | undefined): Promise<WebhookResult> {
  let event: Stripe.Event;
  try {
    event = deps.payments.client.webhooks.constructEvent(rawBody, signature ?? '', deps.payments.webhookSecret);
  } catch {
    throw new HttpError(400, 'bad_signature', 'The webhook signature does not match this endpoint’s secret (or is too old). Nothing was changed.');
  }
  if (await alreadyHandled(deps.db, event.id)) return { duplicate: true, outcome: 'duplicate' };

  const subscription = await currentSubscription(deps, event);
  const now = deps.clock.now();
  return deps.db.transaction(async (trx) => {
    if (await alreadyHandled(trx, event.id)) return { duplicate: true, outcome: 'duplicate' };
    const teamId = await teamOf(trx, event);
    let outcome = 'ignored';
    if (teamId === null) outcome = 'unknown_team';
    else if (subscription) outcome = await applySubscription(trx, teamId, subscription, now);
    else if (INVOICE_EVENTS.has(event.type)) {
      await saveInvoice(trx, teamId, event.data.object as Stripe.Invoice);
      outcome = 'applied';
    }
    await trx('billing_events').insert({ id: event.id, type: event.type, team_id: teamId, outcome, received_at: now });
    return { duplicate: false, outcome };
  });
}

async function alreadyHandled(db: Db, eventId: string): Promise<boolean> {
  return !!(await db('billing_events').where({ id: eventId }).first('id'));
}

/** The subscription an event is about, as the provider reports it now; null for events that are not about one. */
async function currentSubscription(deps: AppDeps, event: Stripe.Event): Promise<Stripe.Subscription | null> {
  let id: string | null = null;
  let copy: Stripe.Subscription | null = null;
  if (event.type === 'checkout.session.completed') {
    const session = event.data.object as Stripe.Checkout.Session;
    if (session.mode !== 'subscription' || !session.subscription) return null;
    id = typeof session.subscription === 'string' ? session.subscription : session.subscription.id;
  } else if (SUBSCRIPTION_EVENTS.has(event.type)) {
    copy = event.data.object as Stripe.Subscription;
    id = copy.id;
  }
  if (!id) return null;
  try {
    return await deps.payments.client.subscriptions.retrieve(id);
  } catch (err) {
    // Only when the provider has no such subscription is the event's own copy the best account there is.
    if (isMissing(err) && copy) return copy;
    throw err;
  }
}

/**
 * The team an event belongs to: by the customer Treadle made for it, else by the team id Treadle put in the
 * metadata (only Treadle, holding the secret key, can set metadata, and the event itself is signed).
 */
async function teamOf(db: Db, event: Stripe.Event): Promise<number | null> {
  const object = event.data.object as { customer?: string | { id: string } | null; metadata?: Record<string, string> | null };
  const customer = typeof object.customer === 'string' ? object.customer : object.customer?.id;
  if (customer) {
    const team = await teamOfCustomer(db, customer);
    if (team !== null) return team;
  }
  const claimed = Number(object.metadata?.team_id);
  if (!Number.isInteger(claimed)) return null;
  const team = await db('teams').where({ id: claimed }).first('id');
  return team ? (team.id as number) : null;
}
