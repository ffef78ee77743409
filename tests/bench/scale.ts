/**
 * Scale benchmark (never a timed test): the same dial-in (400 candidates by default) of a demo character
 * over the demo suite "Scrapyard crossing", run through the real job path three ways in the same run: the
 * embedded piscina pool (one thread per core), one worker process and two worker processes on a redis-server
 * of its own (each worker one task at a time, as if each were a one-core machine). Prints wall time,
 * candidates per second, whether each answer is the embedded pool's, the two-worker speed-up over one worker
 * (goal ≥ 1.8×) and the queue's overhead per task against a task's own trial time (goal under 2 %), from
 * BullMQ's own processedOn/finishedOn stamps of each task.
 * Flags: --candidates N, --character wicket|burrow|skitter, --json (last line:
 * {"runs":[{"runner","workers","wallMs","candidatesPerSec","sameResult"}…], …}).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Queue } from 'bullmq';
import IORedis from 'ioredis';
import { systemClock } from '../../server/clock';
import { migrateToLatest, openDatabase } from '../../server/db';
import { createJobRunner, openJobRunner, type JobRunner } from '../../server/jobs';
import type { DialInJobInput } from '../../server/jobs/dial-in-job';
import { TASK_QUEUE } from '../../server/jobs/task-queue';
import { storeCharacterUpload } from '../../server/services/gltf-import-store';
import { loadSuiteCourses } from '../../server/services/courses';
import { loadCharacterRig } from '../../server/services/characters';
import { DEMO_SUITE, seedDemoCourses } from '../../seeds/demo-courses';
import { seededSetupFor } from '../../seeds/demo-setups';
import * as designs from '../../seeds/characters';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { TUNABLE_SETTINGS, type DialInResult } from '../../schemas/dial-ins';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { createStudio } from '../support/studio';
import { startRedis, startWorkerProcess, type WorkerProcess } from '../support/redis';

const arg = (name: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
};
const CANDIDATES = Number(arg('candidates') ?? 400);
const CHARACTER = (arg('character') ?? 'wicket') as 'wicket' | 'burrow' | 'skitter';
const SEED = 2026;
/** The seven settings issue-free users tune most: solver damping and budget, gait timing, body settling. */
const KEYS = ['solver.lambda', 'solver.maxIterations', 'gait.dutyFactor', 'gait.stepHeight', 'body.settleTime', 'body.followHeight', 'body.heightOffset'];

interface Run {
  runner: 'embedded' | 'redis';
  workers: number;
  wallMs: number;
  candidatesPerSec: number;
  sameResult: boolean;
}

async function main(): Promise<void> {
  const json = process.argv.includes('--json');
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'h17-scale-'));
  const db = openDatabase(path.join(dir, 'bench.sqlite'));
  await migrateToLatest(db);
  const now = Date.now();
  const { teamId, members } = await createStudio(db, 'scale', now);
  const design = (designs as unknown as Record<string, Parameters<typeof buildCharacterGlb>[0]>)[CHARACTER];
  const stored = await storeCharacterUpload({ db, dataDir: path.join(dir, 'files'), now: () => now }, { teamId, userId: members.owner.id, name: design.name, files: [{ originalname: `${CHARACTER}.glb`, buffer: Buffer.from(await buildCharacterGlb(design)) }] });
  await seedDemoCourses(db, teamId, members.owner.id, now);
  const suite = await db('suites').where({ team_id: teamId, name: DEMO_SUITE }).first('id');
  const courses = await loadSuiteCourses(db, teamId, suite.id);
  const character = await loadCharacterRig(db, teamId, stored.id);
  const input: DialInJobInput = {
    characterId: stored.id,
    suiteId: suite.id,
    courseIds: courses.map((c) => c.id),
    base: seededSetupFor(design.name, character.rig),
    baseLegSetupId: null,
    params: KEYS.map((key) => {
      const t = TUNABLE_SETTINGS.find((s) => s.key === key)!;
      return { key, min: t.suggested[0], max: t.suggested[1] };
    }),
    candidates: CANDIDATES,
    seed: SEED,
    duration: TRIAL_SECONDS,
  };

  async function dialIn(runner: JobRunner): Promise<{ wallMs: number; result: DialInResult; jobId: number }> {
    const t0 = performance.now();
    const job = await runner.enqueue({ teamId, userId: members.owner.id, kind: 'dial-in', input });
    for (;;) {
      const row = await db('jobs').where({ id: job.id }).first();
      if (row.status === 'done') return { wallMs: performance.now() - t0, result: JSON.parse(row.result), jobId: job.id };
      if (row.status !== 'queued' && row.status !== 'running') throw new Error(`dial-in ${row.status}: ${row.error}`);
      await new Promise((r) => setTimeout(r, 20));
    }
  }

  const runs: Run[] = [];
  const threads = os.availableParallelism?.() ?? os.cpus().length;
  const embedded = createJobRunner({ db, clock: systemClock, threads });
  const reference = await dialIn(embedded);
  await embedded.close();
  const tried = reference.result.candidatesTried;
  const row = (runner: Run['runner'], workers: number, wallMs: number, same: boolean): Run => ({ runner, workers, wallMs: Math.round(wallMs), candidatesPerSec: Number(((1000 * tried) / wallMs).toFixed(2)), sameResult: same });
  runs.push(row('embedded', threads, reference.wallMs, true));

  const redis = await startRedis();
  const connection = new IORedis(redis.url, { maxRetriesPerRequest: null });
  const queue = new Queue(TASK_QUEUE, { connection });
  const overhead: { workers: number; tasks: number; taskMs: number; overheadPerTaskMs: number; share: number }[] = [];
  try {
    for (const count of [1, 2]) {
      const workers: WorkerProcess[] = [];
      for (let i = 0; i < count; i++) workers.push(await startWorkerProcess(redis.url, { name: `bench-${count}-${i + 1}`, env: { TREADLE_LOCK_MS: '', TREADLE_STALLED_MS: '' } }));
      const runner = await openJobRunner({ db, clock: systemClock, redisUrl: redis.url, log: () => undefined });
      const r = await dialIn(runner);
      await runner.close();
      runs.push(row('redis', count, r.wallMs, JSON.stringify(r.result) === JSON.stringify(reference.result)));
      const tasks = (await queue.getJobs(['completed'], 0, -1)).filter((j) => j.data.jobId === r.jobId);
      const busyMs = tasks.reduce((s, j) => s + (j.finishedOn! - j.processedOn!), 0);
      // With one worker taking one task at a time, whatever of the wall time it did not spend in a task is the
      // queue's round trip plus the server's own search steps: the overhead a task costs.
      const perTask = (r.wallMs * count - busyMs) / tasks.length;
      overhead.push({ workers: count, tasks: tasks.length, taskMs: Number((busyMs / tasks.length).toFixed(1)), overheadPerTaskMs: Number(perTask.toFixed(2)), share: Number((perTask / (busyMs / tasks.length)).toFixed(4)) });
      for (const w of workers) w.kill('SIGTERM');
      await Promise.all(workers.map((w) => w.exited));
      await queue.obliterate({ force: true });
    }
  } finally {
    await queue.close();
    connection.disconnect();
    await redis.stop();
    await db.destroy();
    fs.rmSync(dir, { recursive: true, force: true });
  }

  const one = runs.find((r) => r.runner === 'redis' && r.workers === 1)!;
  const two = runs.find((r) => r.runner === 'redis' && r.workers === 2)!;
  const twoOverOne = Number((one.wallMs / two.wallMs).toFixed(2));
  const trialsPerCandidate = courses.length;
  const taskMs = overhead[0].taskMs;
  // A 20,000-trial dial-in in 5 minutes on one-task workers like these: trials × trial time / 300 s, if the
  // batches were wide enough to keep them all busy.
  const workersFor20k = Math.ceil((20_000 * taskMs) / 300_000);
  console.log(`dial-in of ${design.name}, ${tried} candidates (asked ${CANDIDATES}, stopped by ${reference.result.stopReason}) × ${trialsPerCandidate} courses of "${DEMO_SUITE}", ${TRIAL_SECONDS} s trials:`);
  console.log(`  footing score ${reference.result.before!.footingScore.toFixed(1)} → ${reference.result.after!.footingScore.toFixed(1)} (mean penalty ${reference.result.before!.penalty!.toFixed(3)} → ${reference.result.after!.penalty!.toFixed(3)})`);
  for (const r of runs) console.log(`  ${r.runner === 'embedded' ? `embedded pool, ${r.workers} threads` : `${r.workers} worker process${r.workers > 1 ? 'es' : ''}`}: ${(r.wallMs / 1000).toFixed(1)} s, ${r.candidatesPerSec} candidates/s, same result as the embedded pool: ${r.sameResult ? 'yes' : 'NO'}`);
  console.log(`  two workers over one: ×${twoOverOne} (goal ≥ 1.8×)`);
  for (const o of overhead) console.log(`  ${o.workers} worker(s): ${o.tasks} tasks of ${o.taskMs} ms; wall not spent in a task: ${o.overheadPerTaskMs} ms per task = ${(o.share * 100).toFixed(2)} % of a task${o.workers === 1 ? ' (goal under 2 %)' : ' (includes batch ends where a worker waits for the other)'}`);
  console.log(`  a 20,000-trial dial-in in 5 min needs about ${workersFor20k} one-task workers at ${taskMs} ms a trial (20,000 × ${taskMs} ms / 300 s)`);
  if (json) console.log(JSON.stringify({ runs, twoOverOne, overhead, workersFor20k, candidates: tried, courses: trialsPerCandidate, taskMs }));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
