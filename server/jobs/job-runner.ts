/**
 * The one interface routes use to run background work. The in-process runner (in-process-runner.ts) keeps
 * jobs in SQLite and runs them on a piscina worker pool; a shared queue across machines (e.g. BullMQ on
 * Redis) can implement the same interface later without touching the routes.
 */
import type { Job, JobKind } from '../../schemas/jobs';

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

export type WorkerTaskName = 'trial' | 'dialIn';

/** What a job kind does: the handler reads the database, runs worker tasks and stores what they give. */
export type JobHandler = (ctx: JobContext) => Promise<unknown>;
