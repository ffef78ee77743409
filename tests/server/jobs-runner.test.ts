/**
 * The in-process job runner on a database of its own (so no other runner picks its jobs up): progress kept
 * monotone, cancel of a running job (its worker task is ended) and of a queued one, restart recovery, and
 * the per-team limit on running jobs. The rules are Treadle's own; no outside reference applies.
 */
import { createInProcessRunner } from '../../server/jobs/in-process-runner';
import { CRASH_REASON } from '../../server/jobs/job-rows';
import { createPiscinaPool, type TaskPool } from '../../server/jobs/worker-pool';
import type { JobHandler } from '../../server/jobs/job-runner';
import type { Job } from '../../schemas/jobs';
import { encodeCourse } from '../../engine/course/encoding';
import { flatCourse } from '../../engine/course/generators';
import { presetRig } from '../../engine/gait/rig-presets';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { freshDatabase } from '../support/test-db';
import { manualClock } from '../support/test-app';
import { createStudio } from '../support/studio';
import type { Db } from '../../server/db';

type Studio = Awaited<ReturnType<typeof createStudio>>;
// Worker threads start on the first job and the machine is shared: generous timeouts, no timing assertions.
jest.setTimeout(120_000);

let database: Awaited<ReturnType<typeof freshDatabase>>;
let db: Db;
const clock = manualClock();
let studio: Studio;
let other: Studio;

beforeAll(async () => {
  database = await freshDatabase();
  db = database.db;
  studio = await createStudio(db, 'gantry');
  other = await createStudio(db, 'sluice');
});
afterAll(async () => database.cleanup());

/** A runner over the test database with handlers of the test's own, on the given pool. */
function runnerWith(handlers: { trial: JobHandler; dialIn?: JobHandler }, pool: TaskPool, perTeam = 2) {
  return createInProcessRunner({ db, clock, pool, perTeam, handlers: { trial: handlers.trial, 'dial-in': handlers.dialIn ?? handlers.trial } });
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

const statusOf = async (id: number) => (await db('jobs').where({ id }).first('status')).status as Job['status'];

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
            reported.push((await db('jobs').where({ id: ctx.jobId }).first('progress')).progress);
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
    // A 600 s trial keeps the one worker busy until it is aborted.
    const runner = runnerWith(
      {
        trial: async () => null,
        dialIn: async (ctx) => {
          const course = encodeCourse(flatCourse(40));
          const rig = presetRig('quadruped');
          const setup = defaultLegSetup(rig);
          started.open();
          return ctx.runTask('trial', { rig, setup, course, options: { duration: 600 } }, () => ctx.report(1));
        },
      },
      pool,
      1,
    );
    const running = await runner.enqueue({ teamId: studio.teamId, userId: studio.members.owner.id, kind: 'dial-in', input: {} });
    const queued = await runner.enqueue({ teamId: studio.teamId, userId: studio.members.owner.id, kind: 'dial-in', input: {} });
    await started.opened;
    await waitFor(async () => (await db('jobs').where({ id: running.id }).first('progress')).progress > 0, 'the search to report');
    expect(await statusOf(queued.id)).toBe('queued');
    const q = await runner.cancel(studio.teamId, queued.id);
    expect(q.status).toBe('cancelled');
    const r = await runner.cancel(studio.teamId, running.id);
    expect(r.status).toBe('cancelled');
    expect(r.finishedAt).not.toBeNull();
    await runner.close();
  }, 60_000);

  it('marks jobs a crash left running as failed with the reason on start, and runs the queued ones', async () => {
    const now = clock.now();
    const base = { team_id: studio.teamId, kind: 'trial', input: '{}', created_by: studio.members.owner.id, created_at: now, updated_at: now };
    const [orphan] = await db('jobs').insert({ ...base, status: 'running', progress: 37, started_at: now });
    const [waiting] = await db('jobs').insert({ ...base, status: 'queued', progress: 0 });
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
    const enqueue = (s: Studio) => runner.enqueue({ teamId: s.teamId, userId: s.members.owner.id, kind: 'trial', input: {} });
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
