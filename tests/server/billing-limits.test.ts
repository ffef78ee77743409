import { testApp, type TestApp } from '../support/test-app';
import { createStudio } from '../support/studio';
import { checkLimit, consumeAllowance, usageMonth, usedOf } from '../../server/services/billing-limits';
import { upgradeFor } from '../../server/services/plans';

// A shared, busy machine: generous hook timeouts (no test checks how long anything takes).
jest.setTimeout(30_000);

let t: TestApp;
let teamId: number;
let otherTeam: number;

beforeAll(async () => {
  t = await testApp();
  teamId = (await createStudio(t.db, 'limits')).teamId;
  otherTeam = (await createStudio(t.db, 'neighbour')).teamId;
});
afterAll(() => t.cleanup());

const DEC = Date.UTC(2026, 11, 15);
const JAN = Date.UTC(2027, 0, 1, 0, 0, 1);

describe('monthly allowances', () => {
  it('counts dial-in candidates per team and per UTC month', async () => {
    await consumeAllowance(t.db, teamId, 'dialInCandidates', 300, DEC);
    await consumeAllowance(t.db, teamId, 'dialInCandidates', 150, DEC);
    expect(await usedOf(t.db, teamId, 'dialInCandidates', DEC)).toBe(450);
    expect(await usedOf(t.db, otherTeam, 'dialInCandidates', DEC)).toBe(0);
    expect(await usedOf(t.db, teamId, 'dialInCandidates', JAN)).toBe(0);
  });

  it('refuses a job that would pass the allowance, says what it needs and records nothing of it', async () => {
    const before = await usedOf(t.db, teamId, 'dialInCandidates', DEC);
    const refusal = t.db.transaction((trx) => consumeAllowance(trx, teamId, 'dialInCandidates', 100, DEC));
    await expect(refusal).rejects.toMatchObject({
      status: 403,
      code: 'plan_limit',
      message: 'The Solo plan allows 500 dial-in candidates a month and the team has used 450 (this needs 100 more). Upgrade to Crew (5000 dial-in candidates a month) under Team → Billing to go on.',
    });
    expect(await usedOf(t.db, teamId, 'dialInCandidates', DEC)).toBe(before);
  });

  it('rolls back the recorded use when the work in the same transaction fails', async () => {
    await expect(
      t.db.transaction(async (trx) => {
        await consumeAllowance(trx, teamId, 'profilePublishes', 1, DEC);
        throw new Error('publishing failed');
      }),
    ).rejects.toThrow('publishing failed');
    expect(await usedOf(t.db, teamId, 'profilePublishes', DEC)).toBe(0);
  });

  it('reports a check without throwing', async () => {
    expect(await checkLimit(t.db, teamId, 'profilePublishes', { adding: 11, now: DEC })).toEqual({ kind: 'profilePublishes', plan: 'solo', used: 0, limit: 10, allowed: false, upgradeTo: 'crew' });
    expect(await checkLimit(t.db, teamId, 'characters')).toMatchObject({ used: expect.any(Number), limit: 5 });
  });
});

describe('which plan to move to', () => {
  it('names the smallest plan that fits, or none past the largest', () => {
    expect(upgradeFor('solo', 'seats', 11)?.id).toBe('studio');
    expect(upgradeFor('crew', 'characters', 26)?.id).toBe('studio');
    expect(upgradeFor('studio', 'seats', 31)).toBeNull();
    expect(usageMonth(Date.UTC(2026, 11, 31, 23, 59))).toBe('2026-12');
  });
});
