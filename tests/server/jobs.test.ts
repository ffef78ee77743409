/**
 * Background jobs: the lifecycle of a trial job through the API on the real piscina pool, progress that
 * never goes down, cancel (queued and running), restart recovery, and the per-team limit on running jobs.
 * The states and rules are the issue's own (issue 7, item 3); no outside reference applies.
 */
import { decodeSeries } from '../../engine/gait/series-encoding';
import { TrialMetricsSchema } from '../../engine/metrics/trial-metrics';
import { createInProcessRunner } from '../../server/jobs/in-process-runner';
import { CRASH_REASON } from '../../server/jobs/job-rows';
import { createPiscinaPool, type TaskPool } from '../../server/jobs/worker-pool';
import type { JobHandler } from '../../server/jobs/job-runner';
import { jobSchema, type Job } from '../../schemas/jobs';
import { testApp, type TestApp } from '../support/test-app';
import { signedIn } from '../support/studio';
import { pollJob, trialStudio, type TrialStudio } from './trials-helpers';

let t: TestApp;
let studio: TrialStudio;
let other: TrialStudio;

beforeAll(async () => {
  t = await testApp();
  studio = await trialStudio(t.db, t.dataDir, 'gantry', t.clock.now());
  other = await trialStudio(t.db, t.dataDir, 'sluice', t.clock.now());
}, 120_000);
afterAll(async () => t.cleanup());

const designer = () => signedIn(t.app, studio.members.designer.email);

describe('a trial job through the API', () => {
  it('runs queued → running → done with progress that never goes down, and stores metrics and series', async () => {
    const agent = await designer();
    const res = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, suiteId: studio.suiteId });
    expect(res.status).toBe(202);
    const accepted = jobSchema.parse(res.body.job);
    expect(accepted.kind).toBe('trial');
    expect(['queued', 'running']).toContain(accepted.status);
    const { job, seen } = await pollJob(agent, accepted.id);
    expect(job.status).toBe('done');
    expect(job.progress).toBe(100);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    const result = job.result as { trialIds: number[]; footingScore: number };
    expect(result.trialIds).toHaveLength(3);
    const detail = await agent.get(`/api/trials/${result.trialIds[0]}`);
    expect(detail.status).toBe(200);
    const metrics = TrialMetricsSchema.parse(detail.body.trial.metrics);
    expect(metrics.steps).toBeGreaterThan(0);
    const series = decodeSeries(detail.body.series);
    expect(series.legs).toBe(4);
    expect(series.length).toBeGreaterThan(10);
    expect(detail.body.course).not.toBeNull();
    const list = await agent.get(`/api/trials?characterId=${studio.characters.burrow}`);
    expect(list.body.trials.map((x: { id: number }) => x.id)).toEqual(expect.arrayContaining(result.trialIds));
  });

  it('runs an unsaved setup and refuses bad requests with field messages, writing nothing', async () => {
    const agent = await designer();
    const before = Number((await t.db('jobs').count({ n: '*' }).first())?.n);
    const neither = await agent.post('/api/trials').send({ characterId: studio.characters.burrow });
    expect(neither.status).toBe(400);
    expect(neither.body.error.fields.courseId).toMatch(/course or a suite/);
    const bad = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: studio.courses.curb, legSetup: { version: 1 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).some((k) => k.startsWith('legSetup.'))).toBe(true);
    const foreign = await agent.post('/api/trials').send({ characterId: other.characters.burrow, courseId: studio.courses.curb });
    expect(foreign.status).toBe(404);
    const foreignCourse = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: other.courses.curb });
    expect(foreignCourse.status).toBe(404);
    expect(Number((await t.db('jobs').count({ n: '*' }).first())?.n)).toBe(before);
  });

  it('lets every role read a job, only owner and designer start or cancel one, and hides it from other teams', async () => {
    const agent = await designer();
    const res = await agent.post('/api/trials').send({ characterId: studio.characters.wicket, courseId: studio.courses.curb });
    const id = res.body.job.id;
    const programmer = await signedIn(t.app, studio.members.programmer.email);
    expect((await programmer.get(`/api/jobs/${id}`)).status).toBe(200);
    expect((await programmer.post('/api/trials').send({ characterId: studio.characters.wicket, courseId: studio.courses.curb })).status).toBe(403);
    expect((await programmer.post(`/api/jobs/${id}/cancel`)).status).toBe(403);
    const outsider = await signedIn(t.app, other.members.owner.email);
    expect((await outsider.get(`/api/jobs/${id}`)).status).toBe(404);
    expect((await outsider.post(`/api/jobs/${id}/cancel`)).status).toBe(404);
    const { job } = await pollJob(agent, id);
    expect(job.status).toBe('done');
    const late = await agent.post(`/api/jobs/${id}/cancel`);
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/already finished/);
  });
});

/** A runner over the test database with handlers of the test's own, on the given pool. */
function runnerWith(handlers: { trial: JobHandler; dialIn?: JobHandler }, pool: TaskPool, perTeam = 2) {
  return createInProcessRunner({ db: t.db, clock: t.clock, pool, perTeam, handlers: { trial: handlers.trial, 'dial-in': handlers.dialIn ?? handlers.trial } });
}

const stubPool: TaskPool = { threads: 1, run: () => Promise.reject(new Error('no pool in this test')), close: async () => undefined };

function gate() {
  let open!: () => void;
  const opened = new Promise<void>((r) => (open = r));
  return { open, opened };
}

async function waitFor(check: () => Promise<boolean>, what: string): Promise<void> {
  for (let i = 0; i < 2000; i++) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 5));
  }
  throw new Error(`timed out waiting for ${what}`);
}

const statusOf = async (id: number) => (await t.db('jobs').where({ id }).first('status')).status as Job['status'];

describe('the in-process runner', () => {
  it('keeps progress monotone even when a handler reports a lower figure', async () => {
    const steps = [gate(), gate(), gate()];
    const reported: number[] = [];
    const runner = runnerWith(
      {
        trial: async (ctx) => {
          const figures = [40, 25, 70];
          for (const [i, g] of steps.entries()) {
            ctx.report(figures[i]);
            await new Promise((r) => setTimeout(r, 20));
            reported.push((await t.db('jobs').where({ id: ctx.jobId }).first('progress')).progress);
            g.open();
          }
          return { ok: true };
        },
      },
      stubPool,
    );
    const job = await runner.enqueue({ teamId: studio.teamId, userId: studio.members.owner.id, kind: 'trial', input: {} });
    await runner.idle();
    expect(reported).toEqual([40, 40, 70]);
    const done = await runner.status(studio.teamId, job.id);
    expect(done).toMatchObject({ status: 'done', progress: 100, result: { ok: true } });
    await runner.close();
  });

  it('cancels a running job by ending its worker task, and a queued one before it starts', async () => {
    const pool = createPiscinaPool(1);
    const started = gate();
    // A dial-in search with a large budget keeps the one worker busy until it is aborted.
    const runner = runnerWith(
      {
        trial: async (ctx) => {
          started.open();
          return ctx.runTask('trial', { rig: null, setup: null, course: null, options: {} });
        },
        dialIn: async (ctx) => {
          const course = (await import('../../engine/course/encoding')).encodeCourse((await import('../../engine/course/generators')).flatCourse(40));
          const rig = (await import('../../engine/gait/rig-presets')).presetRig('quadruped');
          const base = (await import('../../engine/gait/leg-setup')).defaultLegSetup(rig);
          started.open();
          return ctx.runTask('dialIn', { rig, base, params: [{ key: 'gait.stepHeight', min: 0.02, max: 0.2 }], courses: [course], budget: 100_000, seed: 1, start: null, options: { duration: 30 } }, () => ctx.report(1));
        },
      },
      pool,
      1,
    );
    const running = await runner.enqueue({ teamId: studio.teamId, userId: studio.members.owner.id, kind: 'dial-in', input: {} });
    const queued = await runner.enqueue({ teamId: studio.teamId, userId: studio.members.owner.id, kind: 'dial-in', input: {} });
    await started.opened;
    await waitFor(async () => (await t.db('jobs').where({ id: running.id }).first('progress')).progress > 0, 'the search to report');
    expect(await statusOf(queued.id)).toBe('queued');
    const q = await runner.cancel(studio.teamId, queued.id);
    expect(q.status).toBe('cancelled');
    const r = await runner.cancel(studio.teamId, running.id);
    expect(r.status).toBe('cancelled');
    expect(r.finishedAt).not.toBeNull();
    await runner.close();
  }, 60_000);

  it('marks jobs a crash left running as failed with the reason on start, and runs the queued ones', async () => {
    const now = t.clock.now();
    const base = { team_id: studio.teamId, kind: 'trial', input: '{}', created_by: studio.members.owner.id, created_at: now, updated_at: now };
    const [orphan] = await t.db('jobs').insert({ ...base, status: 'running', progress: 37, started_at: now });
    const [waiting] = await t.db('jobs').insert({ ...base, status: 'queued', progress: 0 });
    const runner = runnerWith({ trial: async () => ({ picked: 'up' }) }, stubPool);
    await runner.start();
    await runner.idle();
    const failed = await runner.status(studio.teamId, orphan);
    expect(failed).toMatchObject({ status: 'failed', progress: 37, error: CRASH_REASON });
    expect(await runner.status(studio.teamId, waiting)).toMatchObject({ status: 'done', result: { picked: 'up' } });
    await runner.close();
  });

  it("runs at most the per-team limit of a team's jobs at once, while other teams' jobs go ahead", async () => {
    const gates = new Map<number, ReturnType<typeof gate>>();
    const runner = runnerWith(
      {
        trial: async (ctx) => {
          const g = gate();
          gates.set(ctx.jobId, g);
          await g.opened;
          return null;
        },
      },
      stubPool,
      1,
    );
    const enqueue = (s: TrialStudio) => runner.enqueue({ teamId: s.teamId, userId: s.members.owner.id, kind: 'trial', input: {} });
    const a1 = await enqueue(studio);
    const a2 = await enqueue(studio);
    const b1 = await enqueue(other);
    await waitFor(async () => gates.has(a1.id) && gates.has(b1.id), 'a1 and b1 to start');
    expect(await statusOf(a1.id)).toBe('running');
    expect(await statusOf(b1.id)).toBe('running');
    expect(await statusOf(a2.id)).toBe('queued');
    gates.get(a1.id)!.open();
    await waitFor(async () => gates.has(a2.id), 'a2 to start after a1');
    expect(await statusOf(a1.id)).toBe('done');
    expect(await statusOf(a2.id)).toBe('running');
    gates.get(a2.id)!.open();
    gates.get(b1.id)!.open();
    await runner.idle();
    expect(await statusOf(a2.id)).toBe('done');
    await runner.close();
  });
});
