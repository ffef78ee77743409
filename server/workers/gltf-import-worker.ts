/**
 * Reads one upload on a worker thread: the glTF import's untrusted parsing and validation (gltf-import-analyse.ts).
 * Whatever the file does here (a refusal, an exception, a stack overflow, memory past the thread's resource
 * limits) ends at most this thread, never the server. A refusal goes back as plain data, because an HttpError
 * loses its status and code when it is cloned across threads.
 */
import { HttpError } from '../errors';
import { analyseUpload, type ImportedCharacter } from '../services/gltf-import-analyse';

export interface ImportTask {
  files: { originalname: string; bytes: Uint8Array }[];
  /** Deepest JSON nesting read (gltf-import-json-scan.ts); the default unless an operator set another. */
  jsonDepth?: number;
}

export type ImportTaskResult =
  | { ok: true; imported: ImportedCharacter }
  | { ok: false; status: number; code: string; message: string; fields?: Record<string, string> };

export async function runImportTask(task: ImportTask): Promise<ImportTaskResult> {
  const files = task.files.map((f) => ({ originalname: f.originalname, buffer: Buffer.from(f.bytes.buffer, f.bytes.byteOffset, f.bytes.byteLength) }));
  try {
    return { ok: true, imported: await analyseUpload(files, task.jsonDepth) };
  } catch (err) {
    if (err instanceof HttpError) return { ok: false, status: err.status, code: err.code, message: err.message, fields: err.fields };
    // Not a refusal the import foresaw, but still caused by this file: say so instead of answering 500.
    const name = files.find((f) => /\.(glb|gltf)$/i.test(f.originalname))?.originalname ?? files[0]?.originalname ?? 'The file';
    const message = `${name} could not be read (${(err as Error)?.message ?? String(err)}). The file is damaged or uses something Treadle cannot read; re-export it.`;
    return { ok: false, status: 422, code: 'unreadable', message, fields: { file: message } };
  }
}
