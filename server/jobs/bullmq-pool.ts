/**
 * The task pool over BullMQ: each task becomes a job of the shared task queue in Redis, taken by whichever
 * worker process (`npm run worker`, on any machine) is free; its answer comes back through the queue's
 * events, with a slow poll behind them for events missed while Redis was away. Workers never see the
 * database: a task carries everything it needs, and a dial-in's shared context (rig, courses) is stored in
 * Redis once and fetched by reference. Aborting a task removes it if it still waits, and broadcasts the
 * cancel so the worker running it ends it.
 */
import crypto from 'node:crypto';
import { setMaxListeners } from 'node:events';
import { Job, Queue, QueueEvents } from 'bullmq';
import type IORedis from 'ioredis';
import { CancelledError } from './in-process-runner';
import type { WorkerTaskName } from './job-runner';
import { redisConnection, shownUrl } from './redis';
import { CANCEL_CHANNEL, KEEP_SECONDS, TASK_JOB_OPTIONS, TASK_QUEUE, cancelledKey, contextKey, readableTaskFailure, type TaskData } from './task-queue';
import type { TaskCounts, TaskMeta, TaskPool } from './worker-pool';

interface Pending {
  resolve(value: unknown): void;
  reject(err: Error): void;
  onMessage(message: unknown): void;
  since: number;
}

/** How often tasks whose answer has not come as an event are looked up (ms). */
const POLL_MS = 2000;

export interface BullmqPool extends TaskPool {
  readonly queue: Queue;
  readonly connection: IORedis;
}

export async function createBullmqPool(url: string, log: (line: string) => void = console.error): Promise<BullmqPool> {
  const connection = redisConnection(url, 'Treadle server', log);
  const eventsConnection = redisConnection(url, 'Treadle server (queue events)', log);
  const queue = new Queue<TaskData>(TASK_QUEUE, { connection });
  const events = new QueueEvents(TASK_QUEUE, { connection: eventsConnection });
  queue.on('error', () => undefined);
  events.on('error', () => undefined);
  await Promise.all([queue.waitUntilReady(), events.waitUntilReady()]);
  // Tasks still waiting belong to jobs a previous server process left behind (marked failed on its start):
  // nobody waits for their answers, so they are dropped rather than computed. One server per Redis.
  await queue.drain(true);
  const nonce = crypto.randomBytes(4).toString('hex');
  let seq = 0;
  const pending = new Map<string, Pending>();
  const contexts = new WeakMap<object, Promise<string>>();
  const cancelled = new Set<number>();
  let closed = false;

  const parse = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);
  function settle(id: string, outcome: { value: unknown } | { error: Error }) {
    const p = pending.get(id);
    if (!p) return;
    pending.delete(id);
    if ('error' in outcome) p.reject(outcome.error);
    else p.resolve(outcome.value);
  }
  events.on('completed', ({ jobId, returnvalue }) => settle(jobId, { value: parse(returnvalue) }));
  events.on('progress', ({ jobId, data }) => pending.get(jobId)?.onMessage(data));
  // 'failed' also comes for a try that will be retried: only a job that stays failed ends the task.
  events.on('failed', ({ jobId }) => void lookUp(jobId));

  async function lookUp(id: string): Promise<void> {
    if (!pending.has(id)) return;
    // The state first, then the job: read the other way round, a task finishing in between would be seen
    // completed with the answer it did not have yet when it was read.
    const state = await queue.getJobState(id).catch(() => 'unknown');
    if (state !== 'completed' && state !== 'failed') return;
    const job = await Job.fromId(queue, id).catch(() => undefined);
    if (!job) return;
    if (state === 'completed' && job.returnvalue !== null && job.returnvalue !== undefined) settle(id, { value: job.returnvalue });
    else if (state === 'failed') settle(id, { error: new Error(readableTaskFailure(job.failedReason ?? 'no reason given')) });
  }
  const poller = setInterval(() => {
    const now = Date.now();
    for (const [id, p] of pending) if (now - p.since > POLL_MS) void lookUp(id);
  }, POLL_MS);
  poller.unref();

  /** Stores a shared context once per object and answers its reference. */
  function contextRefOf(context: object): Promise<string> {
    let ref = contexts.get(context);
    if (!ref) {
      const id = `${nonce}-${crypto.randomBytes(6).toString('hex')}`;
      ref = connection.set(contextKey(id), JSON.stringify(context), 'EX', KEEP_SECONDS).then(() => id);
      contexts.set(context, ref);
    }
    return ref;
  }

  async function cancelTask(id: string, meta: TaskMeta | undefined) {
    const job = await Job.fromId(queue, id).catch(() => undefined);
    // A task still waiting is simply removed; one a worker holds is locked and stays, so the broadcast ends it;
    // one already finished stays as the record of what it did.
    const state = await job?.getState().catch(() => 'unknown');
    if (state === 'waiting' || state === 'delayed' || state === 'prioritized') await job?.remove().catch(() => undefined);
    if (meta && !cancelled.has(meta.jobId)) {
      cancelled.add(meta.jobId);
      await connection.set(cancelledKey(meta.jobId), '1', 'EX', KEEP_SECONDS);
      await connection.publish(CANCEL_CHANNEL, JSON.stringify({ jobId: meta.jobId }));
    }
  }

  return {
    queue,
    connection,
    threads: 64,
    async run<T>(name: WorkerTaskName, payload: unknown, onMessage: (message: unknown) => void, signal: AbortSignal, meta?: TaskMeta): Promise<T> {
      if (closed) throw new Error('the task queue is closed');
      if (signal.aborted) throw new CancelledError();
      setMaxListeners(0, signal);
      const data: TaskData = { name, payload, jobId: meta?.jobId, teamId: meta?.teamId };
      const p = payload as { context?: unknown };
      if (p && typeof p === 'object' && p.context && typeof p.context === 'object') {
        data.contextRef = await contextRefOf(p.context);
        data.payload = { ...p, context: undefined };
      }
      const id = `${meta ? `j${meta.jobId}` : 'task'}-${nonce}-${++seq}`;
      const answer = new Promise<T>((resolve, reject) => {
        pending.set(id, { resolve: resolve as (v: unknown) => void, reject, onMessage, since: Date.now() });
      });
      const onAbort = () => {
        settle(id, { error: new CancelledError() });
        void cancelTask(id, meta).catch(() => undefined);
      };
      signal.addEventListener('abort', onAbort, { once: true });
      try {
        await queue.add(name, data, { ...TASK_JOB_OPTIONS, jobId: id });
        return await answer;
      } finally {
        signal.removeEventListener('abort', onAbort);
        pending.delete(id);
      }
    },
    async counts(): Promise<TaskCounts> {
      try {
        const [workers, counts] = await Promise.all([queue.getWorkers(), queue.getJobCounts('waiting', 'prioritized', 'delayed', 'active')]);
        return {
          runner: 'redis',
          // BullMQ names a worker's connection "<prefix>:<queue>:w:<worker name>".
          workers: workers.map((w) => ({ name: (w.rawname ?? '').split(':w:')[1] || 'unnamed worker', address: w.addr })),
          waiting: (counts.waiting ?? 0) + (counts.prioritized ?? 0) + (counts.delayed ?? 0),
          running: counts.active ?? 0,
        };
      } catch (err) {
        return { runner: 'redis', workers: [], waiting: 0, running: 0, problem: `Redis at ${shownUrl(url)} does not answer: ${(err as Error).message}` };
      }
    },
    async close() {
      closed = true;
      clearInterval(poller);
      for (const id of [...pending.keys()]) settle(id, { error: new Error('the server is shutting down') });
      await events.close().catch(() => undefined);
      await queue.close().catch(() => undefined);
      connection.disconnect();
      eventsConnection.disconnect();
    },
  };
}
