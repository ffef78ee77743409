/**
 * What the server and the worker processes agree on about the task queue in Redis: the queue's name, how
 * tasks are retried and kept, where a dial-in's shared context is stored once, and the channel cancels go
 * out on. A task is one unit of engine work (one course of a trial, one dial-in candidate over a suite).
 */
import type { JobsOptions } from 'bullmq';
import type { WorkerTaskName } from './job-runner';

export const TASK_QUEUE = 'treadle-tasks';
/** Cancels are broadcast here: every worker ends the tasks of that job it is running. */
export const CANCEL_CHANNEL = 'treadle:cancel';
/** A cancelled job's mark, read by a worker before it starts a task (a task taken just after the broadcast). */
export const cancelledKey = (jobId: number) => `treadle:cancelled:${jobId}`;
export const contextKey = (id: string) => `treadle:context:${id}`;
/** How long shared contexts and cancel marks live in Redis (a day is longer than any job). */
export const KEEP_SECONDS = 24 * 3600;
/** Tries of a task before it fails for good (a worker's crash or an engine error). */
export const TASK_ATTEMPTS = 3;

export const TASK_JOB_OPTIONS: JobsOptions = {
  attempts: TASK_ATTEMPTS,
  backoff: { type: 'exponential', delay: 500 },
  removeOnComplete: { age: 3600, count: 5000 },
  removeOnFail: { age: KEEP_SECONDS },
};

export interface TaskData {
  name: WorkerTaskName;
  payload: unknown;
  /** The payload's `context`, stored once under contextKey(contextRef) instead of with every task. */
  contextRef?: string;
  jobId?: number;
  teamId?: number;
}

/** Worker lock settings: a worker that stops renewing its lock (killed, cut off) loses the task to another. */
export function lockSettings(env: NodeJS.ProcessEnv = process.env) {
  const lockDuration = Number(env.TREADLE_LOCK_MS) > 0 ? Number(env.TREADLE_LOCK_MS) : 15_000;
  const stalledInterval = Number(env.TREADLE_STALLED_MS) > 0 ? Number(env.TREADLE_STALLED_MS) : 5_000;
  // A task taken back from stalled workers this many times fails with the reason instead of trying forever.
  return { lockDuration, stalledInterval, maxStalledCount: 2 };
}

/** What a task's failure means to a person reading the job. */
export function readableTaskFailure(reason: string): string {
  if (/stalled more than allowable limit/i.test(reason)) return 'The workers running one of its tasks stopped responding too many times (killed or cut off from Redis), so it was given up.';
  return `A worker failed one of its tasks ${TASK_ATTEMPTS} times: ${reason}`;
}
