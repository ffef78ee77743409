import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';
import { payOnCheckoutPage } from './billing-helpers';
import type { Role } from '../../schemas/roles';

// A shared, busy machine: generous hook timeouts (no test checks how long anything takes).
jest.setTimeout(30_000);

let t: TestApp;
let teamId: number;
let agents: Record<Role, ReturnType<typeof request.agent>>;

beforeAll(async () => {
  t = await testApp();
  const studio = await createStudio(t.db, 'access');
  teamId = studio.teamId;
  agents = {
    owner: await signedIn(t.app, studio.members.owner.email),
    designer: await signedIn(t.app, studio.members.designer.email),
    programmer: await signedIn(t.app, studio.members.programmer.email),
    art_lead: await signedIn(t.app, studio.members.art_lead.email),
  };
});
afterAll(() => t.cleanup());

const others: Role[] = ['designer', 'programmer', 'art_lead'];

describe('who may see and change the plan', () => {
  it('lists the plans with prices and limits to anyone, signed in or not', async () => {
    const res = await request(t.app).get('/api/plans').expect(200);
    expect(res.body.testMode).toBe(true);
    expect(res.body.plans[1]).toEqual({ id: 'crew', name: 'Crew', blurb: expect.any(String), monthlyPrice: 2400, currency: 'eur', limits: { seats: 10, characters: 25, dialInCandidates: 5000, profilePublishes: 100 } });
  });

  it.each(others)('shows %s the plan name only', async (role) => {
    const res = await agents[role].get('/api/billing').expect(200);
    expect(res.body).toEqual({ view: 'member', plan: { id: 'solo', name: 'Solo' } });
  });

  it.each(others)('refuses %s a checkout, a plan change and a cancel with 403, writing nothing', async (role) => {
    for (const [path, body] of [['/api/billing/checkout', { plan: 'crew' }], ['/api/billing/plan', { plan: 'crew' }], ['/api/billing/cancel', {}], ['/api/billing/resume', {}]] as const) {
      const res = await agents[role].post(path).send(body);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect(await t.db('team_billing').where({ team_id: teamId }).first()).toBeUndefined();
    expect(t.payments.fake.store.customers.size).toBe(0);
  });

  it('refuses bad input with a field message', async () => {
    const res = await agents.owner.post('/api/billing/checkout').send({ plan: 'platinum' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.plan).toMatch(/solo, crew or studio/);
    const free = await agents.owner.post('/api/billing/checkout').send({ plan: 'solo' });
    expect(free.status).toBe(400);
    expect(free.body.error.fields.plan).toMatch(/Solo is free/);
  });

  it('tells the owner to check out first when there is nothing to change or cancel', async () => {
    expect((await agents.owner.post('/api/billing/plan').send({ plan: 'studio' })).body.error.code).toBe('checkout_needed');
    expect((await agents.owner.post('/api/billing/cancel').send({})).body.error.code).toBe('no_subscription');
  });

  it('lets only the owner cancel a live subscription, and take the cancellation back', async () => {
    const { url } = (await agents.owner.post('/api/billing/checkout').send({ plan: 'crew' }).expect(200)).body;
    await payOnCheckoutPage(url, '4242 4242 4242 4242');
    for (const role of others) expect((await agents[role].post('/api/billing/cancel').send({})).status).toBe(403);
    expect((await agents.owner.get('/api/billing')).body.cancelAtPeriodEnd).toBe(false);
    expect((await agents.owner.post('/api/billing/cancel').send({}).expect(200)).body.cancelAtPeriodEnd).toBe(true);
    expect((await agents.owner.post('/api/billing/resume').send({}).expect(200)).body.cancelAtPeriodEnd).toBe(false);
    expect((await agents.designer.get('/api/billing')).body).toEqual({ view: 'member', plan: { id: 'crew', name: 'Crew' } });
  });

  it('refuses a second checkout while a plan is paid for', async () => {
    const res = await agents.owner.post('/api/billing/checkout').send({ plan: 'studio' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already pays for Crew/);
  });
});
