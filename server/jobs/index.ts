/** The job runner the server uses: in-process, on a piscina pool, with the trial and dial-in handlers. */
import type { Clock } from '../clock';
import type { Db } from '../db';
import { dialInJobHandler } from './dial-in-job';
import { createInProcessRunner } from './in-process-runner';
import type { JobRunner } from './job-runner';
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
  pool?: TaskPool;
}

export function createJobRunner(o: JobRunnerOptions): JobRunner & { idle(): Promise<void> } {
  return createInProcessRunner({
    db: o.db,
    clock: o.clock,
    pool: o.pool ?? createPiscinaPool(o.threads ?? defaultThreads()),
    perTeam: o.perTeam,
    handlers: { trial: trialJobHandler(o.db, o.clock), 'dial-in': dialInJobHandler(o.db, o.clock) },
  });
}
