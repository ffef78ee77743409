import request from 'supertest';
import Stripe from 'stripe';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';
import { signatureHeader } from '../../server/fakes/payments/webhooks';
import { DAY, payOnCheckoutPage } from './billing-helpers';

// A shared, busy machine: generous hook timeouts (no test checks how long anything takes).
jest.setTimeout(30_000);

let t: TestApp;
let teamId: number;
let owner: ReturnType<typeof request.agent>;

beforeAll(async () => {
  t = await testApp();
  const studio = await createStudio(t.db, 'hooks');
  teamId = studio.teamId;
  owner = await signedIn(t.app, studio.members.owner.email);
  const { url } = (await owner.post('/api/billing/checkout').send({ plan: 'crew' }).expect(200)).body;
  await payOnCheckoutPage(url, '4242424242424242');
});
afterAll(() => t.cleanup());

const snapshot = async () => ({
  billing: await t.db('team_billing').where({ team_id: teamId }).first(),
  events: await t.db('billing_events').orderBy('id'),
  invoices: await t.db('billing_invoices').orderBy('id'),
});
const post = (payload: string, header: string) =>
  request(t.app).post('/api/billing/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', header).send(payload);

describe('the webhook signature', () => {
  it('is the scheme the SDK verifies: same header as generateTestHeaderString, accepted by constructEvent', () => {
    // The provider's scheme as implemented by the stripe SDK (webhooks.generateTestHeaderString / constructEvent).
    const payload = JSON.stringify({ id: 'evt_x', object: 'event' });
    const secret = 'whsec_scheme_check';
    const timestamp = Math.floor(Date.now() / 1000);
    const stripe = t.payments.deps.client;
    expect(signatureHeader(payload, secret, timestamp)).toBe(stripe.webhooks.generateTestHeaderString({ payload, secret, timestamp }));
    expect(stripe.webhooks.constructEvent(payload, signatureHeader(payload, secret), secret).id).toBe('evt_x');
  });

  it.each([
    ['a wrong secret', (p: string) => signatureHeader(p, 'whsec_not_ours')],
    ['no signature', () => ''],
    ['a signature of other bytes', (p: string) => signatureHeader(`${p} `, t.payments.deps.webhookSecret)],
    // Replay protection: the SDK refuses timestamps older than its DEFAULT_TOLERANCE of 300 s (stripe-node, Webhooks.js).
    ['a ten-minute-old timestamp', (p: string) => signatureHeader(p, t.payments.deps.webhookSecret, Math.floor(Date.now() / 1000) - 600)],
  ])('refuses %s with 400 and changes nothing', async (_what, sign) => {
    const before = await snapshot();
    const delivered = t.payments.fake.deliveries.find((d) => d.event.type === 'customer.subscription.created')!;
    const forged = delivered.payload.replace(/"id": "treadle-test-event-\w+"/, '"id": "evt_forged"').replace('"status": "active"', '"status": "canceled"');
    const res = await post(forged, sign(forged));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_signature');
    expect(await snapshot()).toEqual(before);
  });
});

describe('deliveries more than once and out of order', () => {
  it('handles each event id once: a second delivery of every event changes nothing', async () => {
    const before = await snapshot();
    for (const d of [...t.payments.fake.deliveries]) {
      // Sent again freshly signed, as the provider does on a retry.
      const res = await post(d.payload, signatureHeader(d.payload, t.payments.deps.webhookSecret));
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ received: true, duplicate: true, outcome: 'duplicate' });
    }
    expect(await snapshot()).toEqual(before);
  });

  it('an old "created" event arriving after an upgrade does not wind the plan back', async () => {
    await owner.post('/api/billing/plan').send({ plan: 'studio' }).expect(200);
    await t.payments.fake.settled();
    // The "created" event (Crew) replayed under a new id, as if its first delivery had been lost and came late.
    const old = t.payments.fake.deliveries.find((d) => d.event.type === 'customer.subscription.created')!;
    const late = old.payload.replace(/"id": "treadle-test-event-\w+"/, '"id": "evt_late_created"');
    const res = await post(late, signatureHeader(late, t.payments.deps.webhookSecret));
    expect(res.body).toMatchObject({ duplicate: false, outcome: 'applied' });
    expect((await t.db('team_billing').where({ team_id: teamId }).first()).plan).toBe('studio');
  });

  it('the end of an earlier subscription, arriving late, does not end the current one', async () => {
    // Cancel now (the provider's DELETE), subscribe again, then hear late of the first one's end.
    const first = (await t.db('team_billing').where({ team_id: teamId }).first()).subscription_id;
    await t.payments.deps.client.subscriptions.cancel(first);
    await t.payments.fake.settled();
    expect((await t.db('team_billing').where({ team_id: teamId }).first()).plan).toBe('solo');
    await t.payments.fake.advance(DAY);
    const { url } = (await owner.post('/api/billing/checkout').send({ plan: 'crew' }).expect(200)).body;
    await payOnCheckoutPage(url, '4242 4242 4242 4242');
    const row = await t.db('team_billing').where({ team_id: teamId }).first();
    expect(row).toMatchObject({ plan: 'crew', status: 'active' });
    expect(row.subscription_id).not.toBe(first);

    const ended = t.payments.fake.deliveries.find((d) => d.event.type === 'customer.subscription.deleted')!;
    const late = ended.payload.replace(/"id": "treadle-test-event-\w+"/, '"id": "evt_late_deleted"');
    const res = await post(late, signatureHeader(late, t.payments.deps.webhookSecret));
    expect(res.body).toMatchObject({ duplicate: false, outcome: 'stale_subscription' });
    expect(await t.db('team_billing').where({ team_id: teamId }).first()).toEqual(row);
  });

  it('a late "open" copy of a paid invoice does not mark it unpaid', async () => {
    const paid = t.payments.fake.deliveries.find((d) => d.event.type === 'invoice.paid')!;
    const stale = paid.payload.replace(/"id": "treadle-test-event-\w+"/, '"id": "evt_stale_invoice"').replace(/"type": "invoice.paid"/, '"type": "invoice.finalized"').replace('"status": "paid"', '"status": "open"');
    await post(stale, signatureHeader(stale, t.payments.deps.webhookSecret)).expect(200);
    const invoice = await t.db('billing_invoices').where({ id: (paid.event.data.object as { id: string }).id }).first();
    expect(invoice.status).toBe('paid');
  });

  it('ignores events for a customer Treadle does not know, recording only that it saw them', async () => {
    const event = { id: 'evt_stranger', object: 'event', type: 'invoice.paid', created: 1, data: { object: { id: 'in_x', object: 'invoice', customer: 'cus_stranger', metadata: {} } } };
    const payload = JSON.stringify(event);
    const res = await post(payload, signatureHeader(payload, t.payments.deps.webhookSecret));
    expect(res.body).toMatchObject({ outcome: 'unknown_team' });
    expect(await t.db('billing_invoices').where({ id: 'in_x' }).first()).toBeUndefined();
  });
});

it('the SDK refuses to talk to the fake with a live-looking key (the fake accepts test keys only)', async () => {
  const live = new Stripe('sk_live_nope', { host: '127.0.0.1', port: t.payments.fake.port, protocol: 'http', maxNetworkRetries: 0 });
  await expect(live.customers.create({})).rejects.toMatchObject({ type: 'StripeAuthenticationError' });
});

it('keeps one checkout open per studio: of two opened at once, the later replaces the earlier, and only it can be paid', async () => {
  const other = await createStudio(t.db, 'twin');
  const agent = await signedIn(t.app, other.members.owner.email);
  const [first, second] = await Promise.all([
    agent.post('/api/billing/checkout').send({ plan: 'crew' }),
    agent.post('/api/billing/checkout').send({ plan: 'studio' }),
  ]);
  expect([first.status, second.status]).toEqual([200, 200]);
  const pages = await Promise.all([first.body.url, second.body.url].map(async (u: string) => (await fetch(u)).status));
  expect([...pages].sort()).toEqual([200, 410]);
  // Whichever the service saw first is the one replaced; its page says why and takes no payment.
  const [openUrl, closedUrl]: string[] = pages[0] === 200 ? [first.body.url, second.body.url] : [second.body.url, first.body.url];
  const refused = await payOnCheckoutPage(closedUrl, '4242 4242 4242 4242');
  expect(refused.status).toBe(410);
  expect(refused.html).toContain('only one can be open at a time');
  const paid = await payOnCheckoutPage(openUrl, '4242 4242 4242 4242');
  expect(paid.status).toBe(303);
  const plan = (await t.db('team_billing').where({ team_id: other.teamId }).first()).plan;
  expect(['crew', 'studio']).toContain(plan);
  expect(await t.db('team_billing').where({ team_id: other.teamId }).first()).toMatchObject({ status: 'active' });
  const subscriptions = [...t.payments.fake.store.subscriptions.values()].filter((s) => (s.metadata as { team_id?: string }).team_id === String(other.teamId));
  expect(subscriptions).toHaveLength(1);
  expect((await agent.post('/api/billing/checkout').send({ plan: 'studio' })).status).toBe(409);
});
