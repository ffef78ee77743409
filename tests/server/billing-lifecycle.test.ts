import request from 'supertest';
import { testApp, TEST_PUBLIC_URL, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';
import { assertWithinLimit, assertWritable, overLimitIds } from '../../server/services/billing-limits';
import { addCharacters, addMembers, DAY, payOnCheckoutPage } from './billing-helpers';

// A shared, busy machine: generous hook timeouts (no test checks how long anything takes).
jest.setTimeout(30_000);

let t: TestApp;
let teamId: number;
let ownerId: number;
let owner: ReturnType<typeof request.agent>;

beforeAll(async () => {
  t = await testApp();
  const studio = await createStudio(t.db, 'lifecycle');
  teamId = studio.teamId;
  ownerId = studio.members.owner.id;
  owner = await signedIn(t.app, studio.members.owner.email);
});
afterAll(() => t.cleanup());

const billing = async () => (await owner.get('/api/billing').expect(200)).body;
const memberCount = async () => Number((await t.db('memberships').where({ team_id: teamId }).count({ n: '*' }).first())?.n);

describe('a subscription from checkout to cancellation, through the real stripe SDK against the local fake', () => {
  let extra: number[];

  it('starts on the free Solo plan', async () => {
    const view = await billing();
    expect(view).toMatchObject({ view: 'owner', plan: { id: 'solo' }, status: 'free', cancelAtPeriodEnd: false, invoices: [], testMode: true });
    const plans = (await request(t.app).get('/api/plans').expect(200)).body.plans;
    expect(plans.map((p: { id: string }) => p.id)).toEqual(['solo', 'crew', 'studio']);
  });

  it('refuses a sixth seat on Solo with plan_limit naming the plan to move to', async () => {
    extra = await addMembers(t, teamId, 1);
    await expect(assertWithinLimit(t.db, teamId, 'seats')).rejects.toMatchObject({ status: 403, code: 'plan_limit', message: expect.stringMatching(/Solo plan allows 5 seats.*Upgrade to Crew/) });
  });

  let checkoutUrl: string;
  it('opens a checkout whose page lives on the fake and says it is a test', async () => {
    const res = await owner.post('/api/billing/checkout').send({ plan: 'studio' }).expect(200);
    checkoutUrl = res.body.url;
    expect(checkoutUrl.startsWith(`${t.payments.fake.url}/pay/treadle-test-checkout-`)).toBe(true);
    const page = await (await fetch(checkoutUrl)).text();
    expect(page).toContain('Treadle test checkout — no real money moves');
    expect(page).toContain('€69.00');
  });

  it('shows the refusal for the declined test card and changes nothing', async () => {
    // 4000 0000 0000 0002: the provider's published test card for a generic decline (Stripe docs, "Testing").
    const res = await payOnCheckoutPage(checkoutUrl, '4000 0000 0000 0002');
    expect(res.status).toBe(402);
    expect(res.html).toContain('Your card was declined');
    expect(res.html).not.toContain('4000000000000002" ');
    await t.payments.fake.settled();
    expect(t.payments.fake.deliveries).toHaveLength(0);
    expect((await billing()).plan.id).toBe('solo');
  });

  it('activates Studio once the success card pays and the webhooks arrive', async () => {
    // 4242 4242 4242 4242: the provider's published test card that always succeeds (Stripe docs, "Testing").
    const res = await payOnCheckoutPage(checkoutUrl, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.location).toMatch(new RegExp(`^${TEST_PUBLIC_URL}/team/billing\\?checkout=done&session=treadle-test-checkout-`));
    expect(t.payments.fake.deliveries.map((d) => [d.event.type, d.status])).toEqual([
      ['customer.subscription.created', 200],
      ['invoice.paid', 200],
      ['checkout.session.completed', 200],
    ]);
    const view = await billing();
    expect(view).toMatchObject({ plan: { id: 'studio' }, status: 'active', cancelAtPeriodEnd: false });
    expect(view.currentPeriodEnd).toBeGreaterThan(Date.now());
    expect(view.invoices).toEqual([expect.objectContaining({ status: 'paid', total: 6900, amountPaid: 6900, currency: 'eur' })]);
  });

  it('never keeps a whole card number in the fake', () => {
    const everything = JSON.stringify([...t.payments.fake.store.subscriptions.values(), ...t.payments.fake.store.sessions.values(), t.payments.fake.deliveries]);
    expect(everything).not.toContain('4242424242424242');
    expect(everything).not.toContain('4242 4242 4242 4242');
    expect(everything).toContain('"last4":"4242"');
  });

  let characters: number[];
  it('raises the limits: sixteen members and seven characters fit on Studio', async () => {
    extra.push(...(await addMembers(t, teamId, 11, 200)));
    characters = await addCharacters(t, teamId, ownerId, 7);
    await expect(assertWithinLimit(t.db, teamId, 'characters')).resolves.toBeUndefined();
    await expect(assertWithinLimit(t.db, teamId, 'seats')).resolves.toBeUndefined();
    expect((await billing()).usage.find((u: { kind: string }) => u.kind === 'seats')).toMatchObject({ used: 16, limit: 30, readOnly: 0 });
  });

  it('downgrades to Crew: over the limit, nothing is deleted and the newest six seats turn read-only', async () => {
    const view = (await owner.post('/api/billing/plan').send({ plan: 'crew' }).expect(200)).body;
    expect(view.plan.id).toBe('crew');
    await t.payments.fake.settled();
    expect(t.payments.fake.deliveries.at(-1)).toMatchObject({ event: { type: 'customer.subscription.updated' }, status: 200 });
    expect(await memberCount()).toBe(16);
    expect(view.usage.find((u: { kind: string }) => u.kind === 'seats')).toMatchObject({ used: 16, limit: 10, readOnly: 6 });
    expect(await overLimitIds(t.db, teamId, 'seats')).toEqual(extra.slice(6));
    await expect(assertWritable(t.db, teamId, 'seats', extra[0])).resolves.toBeUndefined();
    await expect(assertWritable(t.db, teamId, 'seats', extra[11])).rejects.toMatchObject({ status: 403, code: 'plan_limit', message: expect.stringMatching(/read-only.*Nothing was deleted/) });
    await expect(assertWithinLimit(t.db, teamId, 'seats')).rejects.toMatchObject({ code: 'plan_limit', message: expect.stringContaining('Upgrade to Studio') });
  });

  it('cancels at the period end: Crew stays until then', async () => {
    const view = (await owner.post('/api/billing/cancel').send({}).expect(200)).body;
    expect(view).toMatchObject({ plan: { id: 'crew' }, status: 'active', cancelAtPeriodEnd: true });
    const again = await owner.post('/api/billing/cancel').send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_cancelling');
  });

  it('moves the team to Solo when the period ends, still deleting nothing', async () => {
    await t.payments.fake.advance(31 * DAY);
    expect(t.payments.fake.deliveries.at(-1)).toMatchObject({ event: { type: 'customer.subscription.deleted' }, status: 200 });
    const view = await billing();
    expect(view).toMatchObject({ plan: { id: 'solo' }, status: 'free', cancelAtPeriodEnd: false, currentPeriodEnd: null });
    expect(await memberCount()).toBe(16);
    expect(view.usage.find((u: { kind: string }) => u.kind === 'seats')).toMatchObject({ used: 16, limit: 5, readOnly: 11 });
    expect(await overLimitIds(t.db, teamId, 'characters')).toEqual(characters.slice(5));
    await expect(assertWritable(t.db, teamId, 'characters', characters[0])).resolves.toBeUndefined();
    await expect(assertWritable(t.db, teamId, 'characters', characters[6])).rejects.toMatchObject({ code: 'plan_limit' });
    await expect(assertWithinLimit(t.db, teamId, 'characters')).rejects.toMatchObject({ code: 'plan_limit', message: expect.stringContaining('Upgrade to Crew') });
    expect(Number((await t.db('characters').where({ team_id: teamId }).count({ n: '*' }).first())?.n)).toBe(7);
    // The studio may subscribe again afterwards.
    const res = await owner.post('/api/billing/checkout').send({ plan: 'crew' });
    expect(res.status).toBe(200);
  });
});
