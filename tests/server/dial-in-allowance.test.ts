import { testApp, type TestApp } from '../support/test-app';
import { dialInAllowanceSchema } from '../../schemas/dial-in-allowance';
import { plansResponseSchema } from '../../schemas/billing';
import { consumeAllowance } from '../../server/services/billing-limits';
import { createStudio, signedIn } from '../support/studio';
import type { Agent } from './characters-helpers';

// The machine is shared: give set-up room, never assert on time.
jest.setTimeout(60_000);

let t: TestApp;
let designer: Agent;
let programmer: Agent;
let teamId: number;

beforeAll(async () => {
  t = await testApp();
  const home = await createStudio(t.db, 'tuners');
  teamId = home.teamId;
  designer = await signedIn(t.app, home.members.designer.email);
  programmer = await signedIn(t.app, home.members.programmer.email);
});
afterAll(() => t.cleanup());

describe('the month’s dial-in allowance, read before starting', () => {
  it('says the plan’s allowance as the plans page prices it, and what is used', async () => {
    const res = await designer.get('/api/dial-ins/allowance');
    expect(res.status).toBe(200);
    const allowance = dialInAllowanceSchema.parse(res.body);
    const { plans } = plansResponseSchema.parse((await designer.get('/api/plans')).body);
    // A new studio is on the free plan: the same figure the public plans list gives.
    const free = plans.find((p) => p.monthlyPrice === 0)!;
    expect(allowance).toMatchObject({ planName: free.name, used: 0, limit: free.limits.dialInCandidates });
    expect(allowance.month).toBe(new Date(t.clock.now()).toISOString().slice(0, 7));
  });

  it('counts what the month has used', async () => {
    await t.db.transaction((trx) => consumeAllowance(trx, teamId, 'dialInCandidates', 120, t.clock.now()));
    const allowance = dialInAllowanceSchema.parse((await designer.get('/api/dial-ins/allowance')).body);
    expect(allowance.used).toBe(120);
  });

  it('is for the roles that start dial-ins', async () => {
    expect((await programmer.get('/api/dial-ins/allowance')).status).toBe(403);
  });
});
