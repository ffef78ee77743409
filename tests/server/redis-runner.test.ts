/**
 * The BullMQ job runner against a real redis-server of the test's own and two real worker processes
 * (`npm run worker`, one task at a time each, as if on two machines): a trial job and a dial-in job give
 * exactly what the embedded piscina pool gives for the same inputs and seed; a worker killed with SIGKILL in
 * the middle of a dial-in loses nothing (its stalled task is taken up by the other) and the result is the
 * same; a result delivered twice is stored once; a cancel ends the job's tasks on every worker; a task that
 * keeps failing ends the job `failed` with the reason; the per-team limit holds however many workers wait;
 * an unreachable Redis stops the worker and the server with one line. The rules are Treadle's own;
 * the queue semantics (locks, stalled jobs, retries) are BullMQ's documented behaviour.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { Queue } from 'bullmq';
import IORedis from 'ioredis';
import { createJobRunner, openJobRunner } from '../../server/jobs';
import { commitJob } from '../../server/jobs/in-process-runner';
import { JobCommit } from '../../server/jobs/job-runner';
import { TASK_QUEUE } from '../../server/jobs/task-queue';
import type { DialInJobInput } from '../../server/jobs/dial-in-job';
import type { TrialJobInput } from '../../server/jobs/trial-job';
import { loadCharacterRig } from '../../server/services/characters';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { presetRig } from '../../engine/gait/rig-presets';
import type { Job } from '../../schemas/jobs';
import type { Db } from '../../server/db';
import { freshDatabase } from '../support/test-db';
import { manualClock } from '../support/test-app';
import { freePort, startRedis, startWorkerProcess, type TestRedis, type WorkerProcess } from '../support/redis';
import { trialStudio, type TrialStudio } from './trials-helpers';
import { insertCourse } from '../../server/services/courses';
import { generateCourse } from '../../engine/course/generators';
import { GAUNTLET } from '../../engine/course/gauntlet';
import fs from 'node:fs';
import os from 'node:os';

jest.setTimeout(300_000);

let redis: TestRedis;
let database: Awaited<ReturnType<typeof freshDatabase>>;
let db: Db;
let studio: TrialStudio;
let dataDir: string;
const clock = manualClock();
const workers: WorkerProcess[] = [];
let queue: Queue;
let queueConnection: IORedis;

type Runner = Awaited<ReturnType<typeof openJobRunner>>;

async function waitFor<T>(check: () => Promise<T | false | undefined | null>, what: string, limitMs = 240_000): Promise<T> {
  const until = Date.now() + limitMs;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const jobRow = async (id: number) => (await db('jobs').where({ id }).first()) as { status: Job['status']; progress: number; result: string | null; error: string | null };
const finished = (id: number) => waitFor(async () => {
  const r = await jobRow(id);
  return ['done', 'failed', 'cancelled'].includes(r.status) ? r : null;
}, `job ${id} to finish`);

let trialInput: TrialJobInput;
let dialInInput: DialInJobInput;
/** A closed walk path: a trial on it walks its whole duration, where one on a straight course ends with the ground. */
let loopCourse: number;
const enqueue = (runner: Runner, kind: 'trial' | 'dial-in', input: unknown) => runner.enqueue({ teamId: studio.teamId, userId: studio.members.owner.id, kind, input });

beforeAll(async () => {
  redis = await startRedis();
  database = await freshDatabase();
  db = database.db;
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'h17-data-'));
  studio = await trialStudio(db, dataDir, 'quarry', clock.now());
  const burrow = await loadCharacterRig(db, studio.teamId, studio.characters.burrow);
  const setup = defaultLegSetup(burrow.rig);
  const courseIds = Object.values(studio.courses);
  const loop = GAUNTLET.find((c) => c.name.startsWith('turn'))!;
  loopCourse = await insertCourse(db, { teamId: studio.teamId, userId: studio.members.owner.id, name: 'Test loop', heightfield: generateCourse(loop.recipe), generator: null, now: clock.now() });
  trialInput = { characterId: studio.characters.burrow, courseIds, setup, legSetupId: null, duration: 20 };
  dialInInput = {
    characterId: studio.characters.burrow,
    suiteId: studio.suiteId,
    courseIds,
    base: setup,
    baseLegSetupId: null,
    params: [
      { key: 'body.heightOffset', min: -0.25, max: 0.05 },
      { key: 'gait.stepHeight', min: 0.03, max: 0.2 },
    ],
    candidates: 30,
    seed: 7,
    duration: 20,
  };
  workers.push(await startWorkerProcess(redis.url, { name: 'machine-a' }), await startWorkerProcess(redis.url, { name: 'machine-b' }));
  queueConnection = new IORedis(redis.url, { maxRetriesPerRequest: null });
  queue = new Queue(TASK_QUEUE, { connection: queueConnection });
});

afterAll(async () => {
  for (const w of workers) w.kill('SIGKILL');
  await Promise.all(workers.map((w) => w.exited));
  await queue?.close();
  queueConnection?.disconnect();
  await redis?.stop();
  await database?.cleanup();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

const trialsOf = async (jobId: number) =>
  (await db('trials').where({ job_id: jobId }).orderBy('id').select('course_id', 'metrics', 'series', 'footing_score')) as { course_id: number; metrics: string; series: string; footing_score: number }[];

let reference: { trial: Awaited<ReturnType<typeof trialsOf>>; dialIn: unknown };

describe('the BullMQ runner with two worker processes', () => {
  it('shows both workers in the queue status', async () => {
    const runner = await openJobRunner({ db, clock, redisUrl: redis.url });
    try {
      const status = await waitFor(async () => {
        const s = await runner.queueStatus(studio.teamId);
        return s.workers.length === 2 ? s : null;
      }, 'two workers');
      expect(status).toMatchObject({ runner: 'redis', waiting: 0, running: 0, jobsQueued: 0, jobsRunning: 0 });
      expect(status.workers.map((w) => w.name).sort()).toEqual(['machine-a', 'machine-b']);
    } finally {
      await runner.close();
    }
  });

  it('gives exactly the embedded pool’s trial and dial-in results for the same inputs and seed', async () => {
    const embedded = createJobRunner({ db, clock, threads: 2 });
    const t0 = await enqueue(embedded, 'trial', trialInput);
    const d0 = await enqueue(embedded, 'dial-in', dialInInput);
    await embedded.idle();
    await embedded.close();
    expect((await jobRow(t0.id)).status).toBe('done');
    expect((await jobRow(d0.id)).status).toBe('done');
    reference = { trial: await trialsOf(t0.id), dialIn: JSON.parse((await jobRow(d0.id)).result!) };

    const runner = await openJobRunner({ db, clock, redisUrl: redis.url });
    const t1 = await enqueue(runner, 'trial', trialInput);
    const d1 = await enqueue(runner, 'dial-in', dialInInput);
    expect((await finished(t1.id)).status).toBe('done');
    expect((await finished(d1.id)).status).toBe('done');
    await runner.close();
    expect(await trialsOf(t1.id)).toEqual(reference.trial);
    expect(reference.trial).toHaveLength(3);
    expect(JSON.parse((await jobRow(d1.id)).result!)).toEqual(reference.dialIn);
    // Both processes did part of the work.
    const done = await queue.getJobs(['completed'], 0, 500);
    const by = new Set(done.filter((j) => j.data.jobId === d1.id).map((j) => j.processedBy));
    expect([...by].sort()).toEqual(['machine-a', 'machine-b']);
  });

  it('completes a dial-in with the same result when a worker is killed with SIGKILL in the middle', async () => {
    const runner = await openJobRunner({ db, clock, redisUrl: redis.url });
    const job = await enqueue(runner, 'dial-in', dialInInput);
    await waitFor(async () => (await jobRow(job.id)).progress >= 20 && (await queue.getActive()).some((j) => j.processedBy === 'machine-a'), 'machine-a to be in the middle of a task');
    const victim = workers.shift()!;
    victim.kill('SIGKILL');
    expect(await victim.exited).toBe('SIGKILL');
    const row = await finished(job.id);
    expect(row.error).toBeNull();
    expect(row.status).toBe('done');
    expect(JSON.parse(row.result!)).toEqual(reference.dialIn);
    await runner.close();
    workers.push(await startWorkerProcess(redis.url, { name: 'machine-c' }));
  });

  it('stores a result delivered twice once', async () => {
    const now = clock.now();
    const [id] = await db('jobs').insert({ team_id: studio.teamId, kind: 'trial', status: 'running', progress: 50, input: '{}', created_by: studio.members.owner.id, created_at: now, started_at: now, updated_at: now });
    const parsed = reference.trial[0];
    const deliver = () =>
      commitJob(
        db,
        id,
        new JobCommit(async (trx) => {
          const [trialId] = await trx('trials').insert({ team_id: studio.teamId, character_id: studio.characters.burrow, leg_setup_id: null, setup: JSON.stringify(trialInput.setup), course_id: parsed.course_id, course_name: 'Test rubble', course_version: 1, job_id: id, metrics: parsed.metrics, leg_names: '[]', series: parsed.series, footing_score: parsed.footing_score, created_by: studio.members.owner.id, created_at: now });
          return { trialIds: [trialId] };
        }),
        now,
      );
    expect(await deliver()).toBe(true);
    expect(await deliver()).toBe(false);
    expect(await db('trials').where({ job_id: id }).count({ n: '*' }).first()).toEqual({ n: 1 });
    const row = await jobRow(id);
    expect(row.status).toBe('done');
    expect(JSON.parse(row.result!).trialIds).toHaveLength(1);
  });

  it('ends a cancelled job’s tasks on every worker', async () => {
    const runner = await openJobRunner({ db, clock, redisUrl: redis.url });
    try {
      // The longest trials allowed, on a loop that never runs out of ground, so each task keeps its worker busy
      // for seconds, well beyond the cancel (the straight courses end after a few seconds of walking, and a task
      // then finished on its own while the cancel was on its way to a busy machine).
      const job = await enqueue(runner, 'dial-in', { ...dialInInput, courseIds: [loopCourse], duration: 600, seed: 99 });
      const held = await waitFor(async () => {
        const active = (await queue.getActive()).filter((j) => j.data.jobId === job.id);
        return new Set(active.map((j) => j.processedBy)).size === 2 ? active : null;
      }, 'both workers to hold a task of the job');
      const started = Date.now();
      const after = await runner.cancel(studio.teamId, job.id);
      expect(after.status).toBe('cancelled');
      await waitFor(async () => (await queue.getActive()).length === 0 && (await queue.getWaiting()).length === 0, 'the workers to let go');
      console.log(`cancel: both workers let go ${Date.now() - started} ms after the cancel (goal under 1 s; not asserted)`);
      // Every task a worker held was ended by the cancel, unless it finished while the cancel was on its way
      // (a task that completes in the few ms the broadcast takes; 100 ms allowed here, common practice, no source).
      const inFlight = started + 100;
      let ended = 0;
      for (const t of held) {
        const again = (await queue.getJob(t.id!))!;
        const state = await again.getState();
        if (state === 'completed') expect(again.finishedOn!).toBeLessThanOrEqual(inFlight);
        else {
          expect(state).toBe('failed');
          expect(again.failedReason).toBe('cancelled');
          ended++;
        }
      }
      expect(ended).toBeGreaterThan(0);
      // Nothing of the job ran on after the cancel: no task of it completed later.
      const late = (await queue.getJobs(['completed'], 0, -1)).filter((j) => j.data.jobId === job.id && j.finishedOn! > inFlight);
      expect(late).toEqual([]);
    } finally {
      await runner.close();
    }
  });

  it('ends a job whose task keeps failing as failed, with the reason', async () => {
    const runner = await openJobRunner({ db, clock, redisUrl: redis.url });
    // A biped's setup on the quadruped: the engine refuses it on the worker, every try.
    const job = await enqueue(runner, 'trial', { ...trialInput, courseIds: [studio.courses.curb], setup: defaultLegSetup(presetRig('biped')) });
    const row = await finished(job.id);
    expect(row.status).toBe('failed');
    expect(row.error).toMatch(/failed one of its tasks 3 times: .*need 4 phase offsets for rig Burrow/);
    await runner.close();
  });

  it("holds the per-team limit however many workers are free", async () => {
    const runner = await openJobRunner({ db, clock, redisUrl: redis.url, perTeam: 1 });
    const first = await enqueue(runner, 'dial-in', { ...dialInInput, duration: 300, seed: 5 });
    const second = await enqueue(runner, 'dial-in', { ...dialInInput, duration: 300, seed: 6 });
    await waitFor(async () => (await queue.getActive()).length === 2, 'both workers busy');
    expect((await jobRow(first.id)).status).toBe('running');
    expect((await jobRow(second.id)).status).toBe('queued');
    const tasks = [...(await queue.getActive()), ...(await queue.getWaiting())];
    expect(new Set(tasks.map((t) => t.data.jobId))).toEqual(new Set([first.id]));
    await runner.cancel(studio.teamId, second.id);
    await runner.cancel(studio.teamId, first.id);
    await runner.close();
  });
});

describe('an unreachable Redis', () => {
  it('stops `npm run worker` and `npm start` with one line and a non-zero exit', async () => {
    const url = `redis://127.0.0.1:${await freePort()}`;
    const worker = await startWorkerProcess(url, { name: 'nowhere', ready: false });
    expect(await worker.exited).toBe(1);
    expect(worker.output().trim().split('\n')).toEqual([expect.stringMatching(/^Cannot reach Redis at redis:\/\/127\.0\.0\.1:\d+ \(REDIS_URL\): .*ECONNREFUSED/)]);
    const server = spawnSync(process.execPath, ['--import', 'tsx', path.join(__dirname, '..', '..', 'server', 'launch', 'index.ts')], { env: { ...process.env, REDIS_URL: url, TREADLE_DB: path.join(dataDir, 'never.sqlite') }, encoding: 'utf8' });
    expect(server.status).toBe(1);
    expect(`${server.stdout}${server.stderr}`.trim().split('\n')).toEqual([expect.stringMatching(/^Cannot reach Redis at .*ECONNREFUSED/)]);
    expect(fs.existsSync(path.join(dataDir, 'never.sqlite'))).toBe(false);
  });
});
