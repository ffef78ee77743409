/**
 * The one interface routes use to run background work. Jobs live in SQLite and their handlers run in the
 * server process (in-process-runner.ts); the engine work of a job goes out as tasks to a task pool: piscina
 * threads in this process (worker-pool.ts), or BullMQ over Redis to worker processes on any machine
 * (bullmq-pool.ts). Either way only the server writes the database.
 */
import type { Knex } from 'knex';
import type { Job, JobKind } from '../../schemas/jobs';
import type { QueueStatus } from '../../schemas/queue';

export interface EnqueueRequest {
  teamId: number;
  userId: number;
  kind: JobKind;
  /** JSON-serialisable input the kind's handler reads. */
  input: unknown;
}

export interface JobRunner {
  /** Stores the job as queued and starts it when the team's limit and the pool allow. */
  enqueue(request: EnqueueRequest): Promise<Job>;
  /** Stops a queued or running job; a finished job answers 409. Another team's job is a 404. */
  cancel(teamId: number, jobId: number): Promise<Job>;
  /** The job as it stands; another team's job is a 404. */
  status(teamId: number, jobId: number): Promise<Job>;
  /** Marks jobs left running by a crash as failed, then picks up queued ones. Call once before serving. */
  start(): Promise<void>;
  /** Stops taking work, cancels what runs and shuts the pool down. */
  close(): Promise<void>;
  /** Where tasks run: workers connected, tasks waiting and running, and the team's own jobs queued and running. */
  queueStatus(teamId: number): Promise<QueueStatus>;
}

/** Passed to a kind's handler while its job runs. */
export interface JobContext {
  jobId: number;
  teamId: number;
  userId: number;
  input: unknown;
  signal: AbortSignal;
  /** Reports progress 0–100 (the runner keeps it monotone) and optionally a partial result shown while running. */
  report(progress: number, partial?: unknown): void;
  /** Runs one task on the worker pool: `name` is the worker export, progress messages go to `onMessage`. */
  runTask<T>(name: WorkerTaskName, payload: unknown, onMessage?: (message: unknown) => void): Promise<T>;
}

export type WorkerTaskName = 'trial' | 'candidate';

/**
 * A handler's answer that still has rows to write: the runner calls `write` inside the one transaction that
 * marks the job done, and only if the job was still running (so a result delivered twice is stored once).
 * `write` returns the job's result.
 */
export class JobCommit {
  constructor(readonly write: (trx: Knex.Transaction) => Promise<unknown>) {}
}

/** What a job kind does: the handler reads the database and runs worker tasks; what they give is stored by the runner. */
export type JobHandler = (ctx: JobContext) => Promise<unknown>;
