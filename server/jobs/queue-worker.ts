/**
 * A worker process's side of the task queue: takes tasks from Redis, runs each on its own piscina thread
 * (so the process's main thread stays free to renew its locks and hear cancels), and hands the answer back
 * through the queue. It never opens the database. A task whose job was cancelled is ended (its thread is
 * stopped) on the broadcast, or refused if it is taken after it.
 */
import os from 'node:os';
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import { redisConnection } from './redis';
import { CANCEL_CHANNEL, TASK_QUEUE, cancelledKey, contextKey, lockSettings, type TaskData } from './task-queue';
import { createPiscinaPool, defaultThreads } from './worker-pool';

export interface QueueWorkerOptions {
  url: string;
  /** Tasks at once (default: TREADLE_WORKER_CONCURRENCY, else one per core). */
  concurrency?: number;
  /** Shown in the owner's queue view (default host name and process id). */
  name?: string;
  log?: (line: string) => void;
}

export interface QueueWorker {
  readonly name: string;
  readonly concurrency: number;
  close(): Promise<void>;
}

/** Most progress messages per task and second sent back through Redis. */
const PROGRESS_EVERY_MS = 250;
/** Shared contexts kept decoded-ready in memory (a dial-in's candidates all share one). */
const CONTEXTS_KEPT = 8;

export function workerConcurrency(env: NodeJS.ProcessEnv = process.env): number {
  const asked = Number(env.TREADLE_WORKER_CONCURRENCY);
  if (Number.isInteger(asked) && asked > 0) return asked;
  return defaultThreads({} as NodeJS.ProcessEnv);
}

export async function startQueueWorker(o: QueueWorkerOptions): Promise<QueueWorker> {
  const log = o.log ?? console.log;
  const concurrency = o.concurrency ?? workerConcurrency();
  const name = o.name ?? process.env.TREADLE_WORKER_NAME ?? `${os.hostname()}:${process.pid}`;
  const connection = redisConnection(o.url, `Treadle worker ${name}`, log);
  const subscriber = redisConnection(o.url, `Treadle worker ${name} (cancels)`, () => undefined);
  const pool = createPiscinaPool(concurrency);
  const contexts = new Map<string, unknown>();
  /** Task id → the job it belongs to, for the tasks this process is running. */
  const active = new Map<string, number | undefined>();

  async function contextOf(ref: string): Promise<unknown> {
    if (contexts.has(ref)) return contexts.get(ref);
    const raw = await connection.get(contextKey(ref));
    if (raw === null) throw new UnrecoverableError('the dial-in this task belongs to is no longer in Redis');
    const context = JSON.parse(raw);
    contexts.set(ref, context);
    if (contexts.size > CONTEXTS_KEPT) contexts.delete(contexts.keys().next().value!);
    return context;
  }

  async function processTask(job: Job<TaskData>, _token?: string, signal?: AbortSignal): Promise<unknown> {
    const { name: task, jobId, contextRef } = job.data;
    if (jobId !== undefined && (await connection.exists(cancelledKey(jobId)))) throw new UnrecoverableError('cancelled');
    const payload = contextRef ? { ...(job.data.payload as object), context: await contextOf(contextRef) } : job.data.payload;
    active.set(job.id!, jobId);
    let last = 0;
    const onMessage = (m: unknown) => {
      const now = Date.now();
      if (now - last < PROGRESS_EVERY_MS) return;
      last = now;
      void job.updateProgress(m as object).catch(() => undefined);
    };
    try {
      return await pool.run(task, payload, onMessage, signal ?? new AbortController().signal);
    } catch (err) {
      if (signal?.aborted) throw new UnrecoverableError('cancelled');
      throw err;
    } finally {
      active.delete(job.id!);
    }
  }

  const worker = new Worker<TaskData>(TASK_QUEUE, processTask, { connection, concurrency, name, ...lockSettings() });
  worker.on('error', () => undefined);
  await worker.waitUntilReady();

  subscriber.on('message', (_channel, message) => {
    let jobId: number | undefined;
    try {
      jobId = (JSON.parse(message) as { jobId?: number }).jobId;
    } catch {
      return;
    }
    for (const [taskId, of] of active) if (of === jobId) worker.cancelJob(taskId, 'cancelled');
  });
  await subscriber.subscribe(CANCEL_CHANNEL);

  return {
    name,
    concurrency,
    async close() {
      await worker.close();
      await pool.close();
      subscriber.disconnect();
      connection.disconnect();
    },
  };
}
