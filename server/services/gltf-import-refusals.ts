import { HttpError } from '../errors';

/** Why an upload was refused. Each code has its own message so the person knows what to fix. */
export type RefusalCode =
  | 'no_file'
  | 'too_large'
  | 'too_many_files'
  | 'empty_file'
  | 'not_gltf'
  | 'gltf_1'
  | 'unsupported_version'
  | 'truncated_glb'
  | 'broken_glb_chunk'
  | 'missing_buffer'
  | 'broken_buffer'
  | 'missing_image'
  | 'unsupported_extension'
  | 'bad_hierarchy'
  | 'too_deep'
  | 'bad_transform'
  | 'unreadable'
  | 'no_skin'
  | 'no_joints'
  | 'too_many_joints'
  | 'no_legs';

/** Deepest node hierarchy accepted; real rigs stay far below it (common practice, no source). */
export const MAX_NODE_DEPTH = 128;
/** Most joints in a skin (the cap; game engines commonly cap skins at 256–1024 bones). */
export const MAX_JOINTS = 512;

/** A refused upload: 413 when too large, 400 when nothing usable was sent, 422 when the file's content is the problem. */
export function refuse(code: RefusalCode, message: string): HttpError {
  const status = code === 'too_large' ? 413 : code === 'no_file' || code === 'too_many_files' ? 400 : 422;
  return new HttpError(status, code, message);
}
