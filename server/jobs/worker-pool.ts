/**
 * The worker pool jobs run their engine work on: piscina threads loading server/workers/entry.cjs, which
 * registers tsx so the TypeScript workers load the same under `npm start` (tsx) and under jest (babel).
 * A task talks back over its own MessagePort (progress, best so far); aborting the signal ends it.
 */
import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { WorkerTaskName } from './job-runner';

type TransferList = NonNullable<Parameters<Piscina['run']>[1]>['transferList'];

/** Which job a task belongs to (a queue across machines uses it to cancel the job's tasks everywhere). */
export interface TaskMeta {
  jobId: number;
  teamId: number;
}

export interface TaskCounts {
  runner: 'embedded' | 'redis';
  workers: { name: string; address?: string }[];
  waiting: number;
  running: number;
  problem?: string;
}

export interface TaskPool {
  run<T>(name: WorkerTaskName, payload: unknown, onMessage: (message: unknown) => void, signal: AbortSignal, meta?: TaskMeta): Promise<T>;
  /** Threads in the pool (for a queue: tasks one server asks for at once). */
  readonly threads: number;
  /** Workers and tasks waiting and running, for the status view. */
  counts?(): Promise<TaskCounts>;
  close(): Promise<void>;
}

export const WORKER_ENTRY = path.join(__dirname, '..', 'workers', 'entry.cjs');

/** Threads: TREADLE_WORKERS, else one per core (at least one). */
export function defaultThreads(env: NodeJS.ProcessEnv = process.env): number {
  const asked = Number(env.TREADLE_WORKERS);
  if (Number.isInteger(asked) && asked > 0) return asked;
  return Math.max(1, os.availableParallelism?.() ?? os.cpus().length);
}

export function createPiscinaPool(threads = defaultThreads()): TaskPool & { eventLoopUtilization(): number[] } {
  // Started on the first task, so a server or test app that runs no job never spawns a thread.
  let started: Piscina | null = null;
  const pool = () => (started ??= new Piscina({ filename: WORKER_ENTRY, minThreads: threads, maxThreads: threads, idleTimeout: 60_000 }));
  let submitted = 0;
  return {
    threads,
    async run<T>(name: WorkerTaskName, payload: unknown, onMessage: (message: unknown) => void, signal: AbortSignal): Promise<T> {
      const channel = new MessageChannel();
      channel.port1.on('message', onMessage);
      submitted++;
      try {
        return (await pool().run({ payload, port: channel.port2 }, { name, transferList: [channel.port2] as unknown as TransferList, signal })) as T;
      } finally {
        submitted--;
        channel.port1.close();
      }
    },
    async counts(): Promise<TaskCounts> {
      const waiting = started?.queueSize ?? 0;
      return { runner: 'embedded', workers: Array.from({ length: threads }, (_, i) => ({ name: `thread ${i + 1} of the server` })), waiting, running: submitted - waiting };
    },
    /** Share of its life each worker thread spent running tasks (node:worker_threads eventLoopUtilization). */
    eventLoopUtilization() {
      return (started?.threads ?? []).map((w) => w.performance.eventLoopUtilization().utilization);
    },
    async close() {
      await started?.destroy();
      started = null;
    },
  };
}
