/**
 * The in-process job runner: jobs live in SQLite, run on a piscina pool, at most `perTeam` of a team's jobs
 * at once (the rest wait queued, oldest first) and at most `maxRunning` overall. Progress is kept monotone
 * and written when its whole-number value grows; cancelling aborts the task's worker.
 */
import { setMaxListeners } from 'node:events';
import type { Clock } from '../clock';
import type { Db } from '../db';
import { HttpError } from '../errors';
import { readableJobFailure } from '../services/submission-checks';
import type { Job, JobKind } from '../../schemas/jobs';
import type { QueueStatus } from '../../schemas/queue';
import { JobCommit, type EnqueueRequest, type JobContext, type JobHandler, type JobRunner } from './job-runner';
import { SHUTDOWN_REASON, failOrphanedJobs, findJobRow, jobFromRow, type JobRow } from './job-rows';
import type { TaskPool } from './worker-pool';

export interface InProcessRunnerOptions {
  db: Db;
  clock: Clock;
  pool: TaskPool;
  handlers: Record<JobKind, JobHandler>;
  /** Jobs of one team running at once (default 2). */
  perTeam?: number;
  /** Jobs running at once overall (default 4). */
  maxRunning?: number;
}

interface Running {
  teamId: number;
  controller: AbortController;
  done: Promise<void>;
}

export class CancelledError extends Error {
  constructor() {
    super('cancelled');
    this.name = 'CancelledError';
  }
}

/**
 * Marks the job done and stores its result in one transaction, only while it is still running: a result
 * delivered twice (or after a cancel) is written once. A JobCommit's rows are written in that transaction.
 * Returns whether this call stored it.
 */
export async function commitJob(db: Db, jobId: number, answer: unknown, t: number): Promise<boolean> {
  return db.transaction(async (trx) => {
    const claimed = await trx('jobs').where({ id: jobId, status: 'running' }).update({ status: 'done', progress: 100, finished_at: t, updated_at: t });
    if (claimed !== 1) return false;
    const result = answer instanceof JobCommit ? await answer.write(trx) : answer;
    await trx('jobs').where({ id: jobId }).update({ result: JSON.stringify(result ?? null) });
    return true;
  });
}

export function createInProcessRunner(o: InProcessRunnerOptions): JobRunner & { idle(): Promise<void> } {
  const { db, clock, pool, handlers } = o;
  const perTeam = o.perTeam ?? 2;
  const maxRunning = o.maxRunning ?? 4;
  const running = new Map<number, Running>();
  let closed = false;
  let pumping: Promise<void> = Promise.resolve();

  const now = () => clock.now();

  /** Starts queued jobs while the limits allow; serialised so one job is never started twice. */
  function pump(): Promise<void> {
    pumping = pumping.then(async () => {
      if (closed) return;
      const queued = await db('jobs').where({ status: 'queued' }).orderBy('id').select<JobRow[]>();
      for (const row of queued) {
        if (running.size >= maxRunning) break;
        let mine = 0;
        for (const r of running.values()) if (r.teamId === row.team_id) mine++;
        if (mine >= perTeam) continue;
        const t = now();
        const claimed = await db('jobs').where({ id: row.id, status: 'queued' }).update({ status: 'running', started_at: t, updated_at: t });
        if (claimed !== 1) continue;
        const controller = new AbortController();
        const entry: Running = { teamId: row.team_id, controller, done: Promise.resolve() };
        running.set(row.id, entry);
        entry.done = execute(row, controller).finally(() => {
          running.delete(row.id);
          void pump();
        });
      }
    });
    return pumping.catch(() => undefined);
  }

  async function execute(row: JobRow, controller: AbortController): Promise<void> {
    let progress = 0;
    let partial: unknown;
    let writing: Promise<unknown> = Promise.resolve();
    const signal = controller.signal;
    // Every task of a job (a dial-in's batch can hold dozens) listens to the job's one signal.
    setMaxListeners(0, signal);
    const ctx: JobContext = {
      jobId: row.id,
      teamId: row.team_id,
      userId: row.created_by,
      input: JSON.parse(row.input),
      signal,
      report(p, part) {
        const next = Math.max(progress, Math.min(99, Math.floor(p)));
        if (part !== undefined) partial = part;
        if (next === progress && part === undefined) return;
        const grew = next > progress;
        progress = next;
        if (!grew) return;
        const patch: Record<string, unknown> = { progress: next, updated_at: now() };
        if (partial !== undefined) patch.result = JSON.stringify(partial);
        writing = writing.then(() => db('jobs').where({ id: row.id, status: 'running' }).update(patch)).catch(() => undefined);
      },
      runTask(name, payload, onMessage) {
        if (signal.aborted) return Promise.reject(new CancelledError());
        return pool.run(name, payload, onMessage ?? (() => undefined), signal, { jobId: row.id, teamId: row.team_id });
      },
    };
    try {
      const answer = await handlers[row.kind](ctx);
      await writing;
      if (signal.aborted) throw new CancelledError();
      await commitJob(db, row.id, answer, now());
    } catch (err) {
      await writing;
      const t = now();
      if (signal.aborted && closed) {
        await db('jobs').where({ id: row.id, status: 'running' }).update({ status: 'failed', error: SHUTDOWN_REASON, finished_at: t, updated_at: t });
      } else if (signal.aborted) {
        await db('jobs').where({ id: row.id, status: 'running' }).update({ status: 'cancelled', finished_at: t, updated_at: t });
      } else {
        const message = readableJobFailure(err, ctx.input);
        await db('jobs').where({ id: row.id, status: 'running' }).update({ status: 'failed', error: message, finished_at: t, updated_at: t });
      }
    }
  }

  return {
    async enqueue(r: EnqueueRequest): Promise<Job> {
      if (closed) throw new HttpError(503, 'shutting_down', 'The server is shutting down; try again in a moment.');
      const t = now();
      const [id] = await db('jobs').insert({
        team_id: r.teamId,
        kind: r.kind,
        status: 'queued',
        progress: 0,
        input: JSON.stringify(r.input),
        created_by: r.userId,
        created_at: t,
        updated_at: t,
      });
      const job = jobFromRow(await findJobRow(db, r.teamId, id));
      void pump();
      return job;
    },

    async cancel(teamId: number, jobId: number): Promise<Job> {
      const row = await findJobRow(db, teamId, jobId);
      if (row.status === 'queued') {
        const t = now();
        await db('jobs').where({ id: jobId, status: 'queued' }).update({ status: 'cancelled', finished_at: t, updated_at: t });
      } else if (row.status === 'running') {
        const r = running.get(jobId);
        if (r) {
          r.controller.abort();
          await r.done;
        }
      } else {
        throw new HttpError(409, 'job_finished', `This job has already ${row.status === 'done' ? 'finished' : row.status === 'failed' ? 'failed' : 'been cancelled'}; there is nothing to cancel.`);
      }
      return jobFromRow(await findJobRow(db, teamId, jobId));
    },

    async status(teamId: number, jobId: number): Promise<Job> {
      return jobFromRow(await findJobRow(db, teamId, jobId));
    },

    async queueStatus(teamId: number): Promise<QueueStatus> {
      const counts = (await pool.counts?.()) ?? { runner: 'embedded' as const, workers: [], waiting: 0, running: 0 };
      const byStatus = await db('jobs').where({ team_id: teamId }).whereIn('status', ['queued', 'running']).groupBy('status').select<{ status: string; n: number }[]>('status', db.raw('count(*) as n'));
      const of = (s: string) => Number(byStatus.find((r) => r.status === s)?.n ?? 0);
      return { ...counts, jobsQueued: of('queued'), jobsRunning: of('running') };
    },

    async start() {
      await failOrphanedJobs(db, now());
      await pump();
    },

    async idle() {
      // Wait until nothing runs and nothing that could start is queued.
      for (;;) {
        await pumping;
        const jobs = [...running.values()].map((r) => r.done);
        if (jobs.length === 0) return;
        await Promise.all(jobs);
      }
    },

    async close() {
      closed = true;
      for (const r of running.values()) r.controller.abort();
      await Promise.all([...running.values()].map((r) => r.done));
      await pumping;
      await pool.close();
    },
  };
}
