/**
 * The glTF import as the rest of the server calls it: from uploaded files to a skeleton with detected legs and a
 * report, or a refusal that names the problem. The reading itself (gltf-import-analyse.ts) runs on a reader
 * thread (gltf-import-pool.ts), because the bytes are untrusted: nothing a file does there can stop the server.
 */
import type { ImportedCharacter } from './gltf-import-analyse';
import type { UploadedFile } from './gltf-import-container';
import { importOnWorker } from './gltf-import-pool';

export type { ImportedCharacter } from './gltf-import-analyse';
export type { UploadedFile } from './gltf-import-container';

/** Reads, validates and analyses an upload off the request thread; throws an HttpError refusal naming the problem. */
export function importGltf(files: UploadedFile[]): Promise<ImportedCharacter> {
  return importOnWorker(files);
}
