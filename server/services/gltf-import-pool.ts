/**
 * The threads that read uploads: a small piscina pool of its own (apart from the jobs' pool, so a queue of
 * trials never delays an upload and an upload never takes a trial's thread), each thread with V8 resource limits.
 * A file that overflows the stack, runs out of memory or loops ends its thread; piscina starts a fresh one, and
 * the person gets a refusal that says what happened. The pool starts with the first upload and its idle threads
 * neither run nor keep the process alive.
 */
import path from 'node:path';
import { Piscina } from 'piscina';
import { HttpError } from '../errors';
import type { ImportedCharacter } from './gltf-import-analyse';
import type { UploadedFile } from './gltf-import-container';
import { refuse } from './gltf-import-refusals';
import type { ImportTask, ImportTaskResult } from '../workers/gltf-import-worker';

const ENTRY = path.join(__dirname, '..', 'workers', 'gltf-import-entry.cjs');

function envNumber(name: string, fallback: number): number {
  const value = Number(process.env[name]);
  return Number.isFinite(value) && value > 0 ? value : fallback;
}

/** Reader threads (TREADLE_IMPORT_WORKERS, default 2), memory per thread in MB, and the longest one read may take. */
export const importPoolSettings = () => ({
  threads: Math.round(envNumber('TREADLE_IMPORT_WORKERS', 2)),
  heapMb: envNumber('TREADLE_IMPORT_HEAP_MB', 1024),
  timeoutMs: envNumber('TREADLE_IMPORT_TIMEOUT_S', 120) * 1000,
  /** Uploads waiting for a thread before new ones are turned away with 503. */
  maxQueue: 16,
});

let pool: Piscina | null = null;

function importPool(): Piscina {
  if (pool) return pool;
  const s = importPoolSettings();
  pool = new Piscina({
    filename: ENTRY,
    name: 'importGltf',
    minThreads: 0,
    maxThreads: s.threads,
    idleTimeout: 60_000,
    maxQueue: s.maxQueue,
    // stackSizeMb stays at Node's default (4): the JSON scan already bounds nesting, this bounds the rest.
    resourceLimits: { maxOldGenerationSizeMb: s.heapMb, maxYoungGenerationSizeMb: 64, stackSizeMb: 4 },
  });
  return pool;
}

function mainName(files: UploadedFile[]): string {
  return files.find((f) => /\.(glb|gltf)$/i.test(f.originalname))?.originalname ?? files[0]?.originalname ?? 'The file';
}

/** Why a reader thread gave no answer, as a refusal the person can act on. */
function threadFailure(err: unknown, files: UploadedFile[], timeoutMs: number): HttpError {
  const name = mainName(files);
  const e = err as { name?: string; code?: string; message?: string };
  if (e?.message === 'Task queue is at limit') return refuse('import_busy', 'Treadle is reading many uploads right now. Try again in a minute.');
  if (e?.name === 'AbortError' || e?.name === 'TimeoutError') {
    return refuse('unreadable', `Reading ${name} took longer than ${Math.round(timeoutMs / 1000)} s, so Treadle stopped. A character file reads in seconds; this one is damaged or far too complex.`);
  }
  if (e?.code === 'ERR_WORKER_OUT_OF_MEMORY') return refuse('unreadable', `Reading ${name} needed more memory than Treadle gives one upload. The file is damaged or far too large for a character.`);
  if (e instanceof RangeError || /call stack/i.test(e?.message ?? '')) return refuse('unreadable', `${name} is nested too deeply to read. The file is damaged or hostile; re-export it.`);
  return refuse('unreadable', `${name} stopped the file reader (${e?.message ?? 'no reason given'}). The file is damaged; re-export it.`);
}

/** Reads an upload on a reader thread; resolves with the import or throws the refusal. */
export async function importOnWorker(files: UploadedFile[]): Promise<ImportedCharacter> {
  const s = importPoolSettings();
  const depth = Number(process.env.TREADLE_IMPORT_JSON_DEPTH);
  const jsonDepth = Number.isInteger(depth) && depth > 0 ? depth : undefined;
  const task: ImportTask = { files: files.map((f) => ({ originalname: f.originalname, bytes: f.buffer })), jsonDepth };
  let result: ImportTaskResult;
  try {
    result = (await importPool().run(task, { signal: AbortSignal.timeout(s.timeoutMs) })) as ImportTaskResult;
  } catch (err) {
    throw threadFailure(err, files, s.timeoutMs);
  }
  if (!result.ok) throw new HttpError(result.status, result.code, result.message, result.fields);
  return result.imported;
}

/** Stops the reader threads (tests, and a server shutting down). */
export async function closeImportPool(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}
