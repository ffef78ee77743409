/**
 * The job runner the server uses, with the trial and dial-in handlers: tasks on a piscina pool in this
 * process by default, or on worker processes over BullMQ when REDIS_URL is set (openJobRunner).
 */
import type { Clock } from '../clock';
import type { Db } from '../db';
import { createBullmqPool } from './bullmq-pool';
import { dialInJobHandler } from './dial-in-job';
import { createInProcessRunner } from './in-process-runner';
import type { JobRunner } from './job-runner';
import { assertRedisReachable } from './redis';
import { trialJobHandler } from './trial-job';
import { createPiscinaPool, defaultThreads, type TaskPool } from './worker-pool';

export type { JobRunner } from './job-runner';

export interface JobRunnerOptions {
  db: Db;
  clock: Clock;
  /** Worker threads (default: TREADLE_WORKERS or one per core). */
  threads?: number;
  /** A team's jobs running at once (default 2). */
  perTeam?: number;
  /** Jobs running at once overall (default 4 in-process; 32 over a queue, where workers do the work). */
  maxRunning?: number;
  pool?: TaskPool;
}

export function createJobRunner(o: JobRunnerOptions): JobRunner & { idle(): Promise<void> } {
  return createInProcessRunner({
    db: o.db,
    clock: o.clock,
    pool: o.pool ?? createPiscinaPool(o.threads ?? defaultThreads()),
    perTeam: o.perTeam,
    maxRunning: o.maxRunning,
    handlers: { trial: trialJobHandler(o.db, o.clock), 'dial-in': dialInJobHandler(o.db, o.clock) },
  });
}

/**
 * The runner for `npm start`: over BullMQ on `redisUrl` when given (throws RedisUnreachable when Redis
 * does not answer), else the embedded pool.
 */
export async function openJobRunner(o: JobRunnerOptions & { redisUrl?: string; log?: (line: string) => void }): Promise<JobRunner & { idle(): Promise<void> }> {
  if (!o.redisUrl) return createJobRunner(o);
  await assertRedisReachable(o.redisUrl);
  const pool = await createBullmqPool(o.redisUrl, o.log);
  return createJobRunner({ ...o, pool, maxRunning: o.maxRunning ?? 32 });
}
