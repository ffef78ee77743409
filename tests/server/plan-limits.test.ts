/**
 * Plan limits that hold: characters and seats are counted inside the transaction that adds one, so requests sent
 * together cannot pass the limit between them; what lies past a limit is read-only; dial-in candidates are held
 * when a dial-in is accepted and what it did not run is given back when it ends.
 * The limits are the Solo plan's own (server/services/plans.ts: 5 seats, 5 characters, 500 candidates a month).
 */
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn, STUDIO_PASSWORD } from '../support/studio';
import { hashPassword } from '../../server/services/accounts';
import { hashToken } from '../../server/services/tokens';
import { attachReservation, reserveAllowance, settleReservation, usedOf } from '../../server/services/billing-limits';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { burrow, skitter, wicket } from '../../seeds/characters';
import { addCharacters } from './billing-helpers';
import { upload } from './characters-helpers';
import { trialStudio, type TrialStudio } from './trials-helpers';
import type { JobRunner } from '../../server/jobs/job-runner';

// Uploads are read on worker threads of a shared, busy machine: generous timeouts (no test checks time).
jest.setTimeout(120_000);

let t: TestApp;
beforeAll(async () => {
  t = await testApp();
});
afterAll(() => t.cleanup());

const countOf = async (table: string, teamId: number) => Number((await t.db(table).where({ team_id: teamId }).count({ n: '*' }).first())?.n);
const glbFile = async (design: typeof wicket, name: string) => ({ originalname: name, buffer: Buffer.from(await buildCharacterGlb(design)) });

describe('characters', () => {
  it('lets two uploads sent together take the last free place only once', async () => {
    const { teamId, members } = await createStudio(t.db, 'uploads');
    await addCharacters(t, teamId, members.owner.id, 4);
    const owner = await signedIn(t.app, members.owner.email);
    const [a, b] = await Promise.all([upload(owner, [await glbFile(burrow, 'burrow.glb')]), upload(owner, [await glbFile(skitter, 'skitter.glb')])]);
    expect([a.status, b.status].sort()).toEqual([201, 403]);
    const refused = a.status === 403 ? a : b;
    expect(refused.body.error).toMatchObject({ code: 'plan_limit', message: expect.stringMatching(/Solo plan allows 5 characters.*Upgrade to Crew/) });
    expect(await countOf('characters', teamId)).toBe(5);
    const sixth = await upload(owner, [await glbFile(wicket, 'wicket.glb')]);
    expect(sixth.status).toBe(403);
    expect(await countOf('characters', teamId)).toBe(5);
  });

  it('keeps the characters past the limit read-only: no leg edits, trials, dial-ins or publishes on them', async () => {
    const { teamId, members } = await createStudio(t.db, 'crowded');
    const ids = await addCharacters(t, teamId, members.owner.id, 7);
    const designer = await signedIn(t.app, members.designer.email);
    const newest = ids[6];
    const writes = [
      designer.put(`/api/characters/${newest}/legs`).send({ legs: [] }),
      designer.post(`/api/characters/${newest}/leg-setups`).send({}),
      designer.post('/api/trials').send({ characterId: newest, courseId: 1 }),
      designer.post('/api/dial-ins').send({ characterId: newest, suiteId: 1, params: [], candidates: 5, seed: 1 }),
    ];
    for (const res of await Promise.all(writes)) {
      expect(res.status).toBe(403);
      expect(res.body.error).toMatchObject({ code: 'plan_limit', message: expect.stringMatching(/read-only.*Nothing was deleted/) });
    }
    // The oldest five stay writable: the same request on the first is the route's to judge, not the plan's.
    const oldest = await designer.put(`/api/characters/${ids[0]}/legs`).send({ legs: [] });
    expect(oldest.body.error?.code).not.toBe('plan_limit');
    // Reading the read-only one still works.
    expect((await designer.get(`/api/characters/${newest}`)).status).not.toBe(403);
  });
});

describe('seats', () => {
  async function pendingInvite(teamId: number, invitedBy: number, email: string): Promise<string> {
    const token = `token-${email}`;
    await t.db('invites').insert({ team_id: teamId, email, role: 'designer', token_hash: hashToken(token), invited_by: invitedBy, created_at: t.clock.now(), expires_at: t.clock.now() + 86_400_000 });
    return token;
  }

  it('counts open invites as seats: a fifth seat can be offered, a sixth cannot', async () => {
    const { members } = await createStudio(t.db, 'inviting');
    const owner = await signedIn(t.app, members.owner.email);
    expect((await owner.post('/api/team/invites').send({ email: 'fifth@inviting.test', role: 'designer' })).status).toBe(201);
    // Sending it again replaces the first invite, so it takes no second seat.
    expect((await owner.post('/api/team/invites').send({ email: 'fifth@inviting.test', role: 'programmer' })).status).toBe(201);
    const sixth = await owner.post('/api/team/invites').send({ email: 'sixth@inviting.test', role: 'designer' });
    expect(sixth.status).toBe(403);
    expect(sixth.body.error).toMatchObject({ code: 'plan_limit', message: expect.stringMatching(/5 seats.*4 members and 1 open invite.*Upgrade to Crew/) });
    expect(await t.db('invites').where({ email: 'sixth@inviting.test' }).first()).toBeUndefined();
  });

  it('lets only one of two invites accepted together take the last seat', async () => {
    const { teamId, members } = await createStudio(t.db, 'racing');
    // Two invites out for one free seat (sent before the studio moved to a smaller plan, say).
    const first = await pendingInvite(teamId, members.owner.id, 'one@racing.test');
    const second = await pendingInvite(teamId, members.owner.id, 'two@racing.test');
    const accept = (token: string) => request(t.app).post(`/api/invites/${token}/accept`).send({ name: 'New Member', password: 'a walk in the yard' });
    const answers = await Promise.all([accept(first), accept(second)]);
    expect(answers.map((r) => r.status).sort()).toEqual([200, 403]);
    expect(answers.find((r) => r.status === 403)!.body.error.code).toBe('plan_limit');
    expect(await countOf('memberships', teamId)).toBe(5);
    // The refused one made no account and left its invite usable for when a seat is free.
    const users = await t.db('users').whereIn('email', ['one@racing.test', 'two@racing.test']);
    expect(users).toHaveLength(1);
    expect(await t.db('invites').where({ team_id: teamId }).whereNull('accepted_at').count({ n: '*' }).first()).toEqual({ n: 1 });
  });

  it('keeps a member whose seat is past the limit read-only, able to read and sign out', async () => {
    const { teamId, members } = await createStudio(t.db, 'overfull');
    const hash = await hashPassword(STUDIO_PASSWORD);
    for (const n of [5, 6]) {
      const [id] = await t.db('users').insert({ email: `member${n}@overfull.test`, name: `Member ${n}`, password_hash: hash, created_at: 1 });
      await t.db('memberships').insert({ team_id: teamId, user_id: id, role: 'designer', created_at: 100 + n });
    }
    const fifth = await signedIn(t.app, 'member5@overfull.test');
    const sixth = await signedIn(t.app, 'member6@overfull.test');
    const course = { name: 'Ramp', heightfield: undefined };
    const refused = await sixth.post('/api/courses').send(course);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatchObject({ code: 'plan_limit', message: expect.stringMatching(/Your seat is read-only.*5 seats/) });
    expect((await fifth.post('/api/courses').send(course)).body.error?.code).not.toBe('plan_limit');
    expect((await sixth.get('/api/team')).status).toBe(200);
    expect((await sixth.post('/api/auth/sign-out')).status).toBe(200);
    expect(members.owner).toBeDefined();
  });
});

describe('dial-in allowance', () => {
  let studio: TrialStudio;
  let runner: TestApp;
  beforeAll(async () => {
    // Jobs are accepted and left queued: what is tested is the allowance, not the search.
    const queuedOnly = {
      async enqueue(r: { teamId: number; userId: number; kind: string; input: unknown }) {
        const now = t.clock.now();
        const [id] = await runner.db('jobs').insert({ team_id: r.teamId, kind: r.kind, status: 'queued', progress: 0, input: JSON.stringify(r.input), created_by: r.userId, created_at: now, updated_at: now });
        return { id, kind: r.kind, status: 'queued', progress: 0, createdAt: now, result: null, error: null };
      },
    } as unknown as JobRunner;
    runner = await testApp({ jobs: queuedOnly });
    studio = await trialStudio(runner.db, runner.dataDir, 'allowance', runner.clock.now());
  });
  afterAll(() => runner.cleanup());

  const ask = (candidates: number) => ({
    characterId: studio.characters.burrow,
    suiteId: studio.suiteId,
    params: [{ key: 'gait.stepHeight', min: 0.03, max: 0.2 }],
    candidates,
    seed: 3,
  });
  const used = () => usedOf(runner.db, studio.teamId, 'dialInCandidates', runner.clock.now());

  it('holds the candidates at acceptance: of three dial-ins of 200 started together on 500, one is refused at once', async () => {
    const agent = await signedIn(runner.app, studio.members.designer.email);
    const answers = await Promise.all([agent.post('/api/dial-ins').send(ask(200)), agent.post('/api/dial-ins').send(ask(200)), agent.post('/api/dial-ins').send(ask(200))]);
    expect(answers.map((r) => r.status).sort()).toEqual([202, 202, 403]);
    expect(answers.find((r) => r.status === 403)!.body.error).toMatchObject({ code: 'plan_limit', message: expect.stringContaining('used 400 (this needs 200 more)') });
    expect(await used()).toBe(400);
  });

  it('gives back all of a failed or cancelled dial-in, and what a finished one did not run', async () => {
    const jobs = await runner.db('jobs').where({ team_id: studio.teamId, kind: 'dial-in' }).orderBy('id');
    expect(jobs).toHaveLength(2);
    await runner.db('jobs').where({ id: jobs[0].id }).update({ status: 'failed', error: 'a worker stopped' });
    expect(await used()).toBe(200);
    // The second finishes having run 130 of its 200: the runner's commit settles it in the same transaction.
    await runner.db.transaction(async (trx) => {
      await trx('jobs').where({ id: jobs[1].id }).update({ status: 'done', result: JSON.stringify({ candidatesTried: 130 }) });
      await settleReservation(trx, jobs[1].id, 130, runner.clock.now());
    });
    expect(await used()).toBe(130);
    const agent = await signedIn(runner.app, studio.members.designer.email);
    expect((await agent.post('/api/dial-ins').send(ask(370))).status).toBe(202);
    expect((await agent.post('/api/dial-ins').send(ask(5))).status).toBe(403);
    const last = await runner.db('jobs').where({ team_id: studio.teamId }).orderBy('id', 'desc').first();
    await runner.db('jobs').where({ id: last.id }).update({ status: 'cancelled' });
    expect(await used()).toBe(130);
  });

  it('records what a job ran even when it finished before its hold was tied to it', async () => {
    const { teamId, members } = await createStudio(runner.db, 'quick');
    const now = runner.clock.now();
    const held = await reserveAllowance(runner.db, teamId, 'dialInCandidates', 50, now);
    const [jobId] = await runner.db('jobs').insert({ team_id: teamId, kind: 'dial-in', status: 'done', progress: 100, input: '{}', result: JSON.stringify({ candidatesTried: 12 }), created_by: members.owner.id, created_at: now, updated_at: now, finished_at: now });
    await attachReservation(runner.db, held, jobId);
    expect(await usedOf(runner.db, teamId, 'dialInCandidates', now)).toBe(12);
  });

  it('gives the hold back when the dial-in could not be queued', async () => {
    const without = await testApp({ jobs: undefined });
    try {
      const s = await trialStudio(without.db, without.dataDir, 'no-runner', without.clock.now());
      const agent = await signedIn(without.app, s.members.designer.email);
      const res = await agent.post('/api/dial-ins').send({ ...ask(100), characterId: s.characters.burrow, suiteId: s.suiteId });
      expect(res.status).toBe(503);
      expect(await usedOf(without.db, s.teamId, 'dialInCandidates', without.clock.now())).toBe(0);
    } finally {
      await without.cleanup();
    }
  });
});
