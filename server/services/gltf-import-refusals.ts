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
  | 'no_legs'
  | 'skeleton_invalid'
  | 'json_too_deep'
  | 'json_too_large'
  | 'bad_structure'
  | 'too_many_objects'
  | 'import_busy';

/** Deepest node hierarchy accepted; real rigs stay far below it (common practice, no source). */
export const MAX_NODE_DEPTH = 128;
/** Most joints in a skin. Game engines commonly cap a skin at 256–1024 bones (from memory); a walking character needs far fewer. */
export const MAX_JOINTS = 512;

/** Deepest nesting of arrays and objects in the glTF JSON; glTF itself needs about a dozen (common practice, no source). */
export const MAX_JSON_DEPTH = 64;
/** Largest glTF JSON text read (a .gltf with base64 buffers inside is mostly one long string). */
export const MAX_JSON_BYTES = 64 * 1024 * 1024;
/** Most JSON values (array items and object members) in one glTF JSON. */
export const MAX_JSON_ITEMS = 2_000_000;

/**
 * Most objects of each kind in one file. Game characters stay one to two orders of magnitude below these
 * (a detailed hero rig has a few hundred nodes, tens of meshes, a handful of skins; common practice, no source),
 * so a file past them is broken or hostile, and refusing it early keeps the reader's work bounded.
 */
export const MAX_OBJECTS = {
  nodes: 10_000,
  accessors: 50_000,
  bufferViews: 50_000,
  meshes: 2_000,
  skins: 64,
  animations: 2_000,
  materials: 2_000,
  images: 1_000,
  textures: 1_000,
} as const;

/** Most elements one accessor may declare (2^24, a sixteen-million-vertex mesh, is far past any character). */
export const MAX_ACCESSOR_COUNT = 16_777_216;

/** A refused upload: 413 when too large, 400 when nothing usable was sent, 503 when the reader is saturated, 422 when the file's content is the problem. */
export function refuse(code: RefusalCode, message: string, fields?: Record<string, string>): HttpError {
  const status = code === 'too_large' ? 413 : code === 'no_file' || code === 'too_many_files' ? 400 : code === 'import_busy' ? 503 : 422;
  // The upload form has one field, the file, so that is where the message belongs.
  return new HttpError(status, code, message, fields ?? { file: message });
}
