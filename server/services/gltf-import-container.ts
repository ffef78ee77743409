/**
 * Reads the outer layer of an upload: which file is the glTF, GLB header and chunks, the JSON,
 * its version, and whether every buffer and image it names arrived. glTF 2.0 specification §4.4
 * (GLB: 12-byte header "glTF", version, length; chunks of length, type, data; JSON chunk first).
 */
import path from 'node:path';
import { refuse } from './gltf-import-refusals';

const GLB_MAGIC = 0x46546c67; // "glTF" little-endian
const CHUNK_JSON = 0x4e4f534a; // "JSON"
const CHUNK_BIN = 0x004e4942; // "BIN\0"

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

/** The glTF JSON as far as the importer relies on it before the full read. */
export interface GltfJson {
  asset?: { version?: unknown; minVersion?: unknown };
  buffers?: { uri?: string; byteLength?: number }[];
  bufferViews?: { buffer?: number; byteOffset?: number; byteLength?: number }[];
  images?: { uri?: string; bufferView?: number }[];
  nodes?: { name?: string; children?: unknown; translation?: unknown; rotation?: unknown; scale?: unknown; matrix?: unknown }[];
  skins?: { joints?: unknown; name?: string }[];
  extensionsRequired?: unknown;
  [key: string]: unknown;
}

export interface Container {
  format: 'glb' | 'gltf';
  /** The whole main file (the GLB, or the .gltf JSON text). */
  main: UploadedFile;
  json: GltfJson;
  /** GLB only: the BIN chunk, if any. */
  bin: Uint8Array | null;
  /** .gltf only: external files by the URI the JSON uses for them. */
  resources: Record<string, Uint8Array>;
}

function looksLikeGlb(bytes: Uint8Array): boolean {
  return bytes.length >= 4 && bytes[0] === 0x67 && bytes[1] === 0x6c && bytes[2] === 0x54 && bytes[3] === 0x46;
}

/** Picks the glTF among the uploaded files: the one with a .glb/.gltf name, else the one that looks like one. */
export function mainFileOf(files: UploadedFile[]): UploadedFile {
  const byName = files.filter((f) => /\.(glb|gltf)$/i.test(f.originalname));
  if (byName.length > 1) throw refuse('too_many_files', `Send one character at a time: ${byName.map((f) => f.originalname).join(', ')} are all glTF files.`);
  if (byName.length === 1) return byName[0];
  const sniffed = files.find((f) => looksLikeGlb(f.buffer) || f.buffer.subarray(0, 64).toString('utf8').trimStart().startsWith('{'));
  return sniffed ?? files[0];
}

function parseJson(text: string, where: string): GltfJson {
  let value: unknown;
  try {
    value = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (err) {
    if (/\b(NaN|-?Infinity)\b/.test(text)) {
      throw refuse('bad_transform', `${where} contains NaN or Infinity, which JSON (and so glTF) cannot hold. Re-export it; a transform probably went non-finite.`);
    }
    throw refuse('not_gltf', `${where} is not valid JSON (${(err as Error).message}). A glTF file is JSON or binary GLB.`);
  }
  if (!value || typeof value !== 'object' || Array.isArray(value)) throw refuse('not_gltf', `${where} is JSON but not a glTF object.`);
  return value as GltfJson;
}

function checkVersion(json: GltfJson, fileName: string): void {
  const version = json.asset?.version;
  if (typeof version !== 'string') {
    // glTF 1.0 kept version in asset too, but also used objects keyed by id instead of arrays.
    if (json.nodes && !Array.isArray(json.nodes)) throw refuse('gltf_1', `${fileName} is glTF 1.0. Treadle reads glTF 2.0: re-export it as glTF 2.0.`);
    throw refuse('not_gltf', `${fileName} has no asset.version, so it is not a glTF 2.0 file.`);
  }
  if (version.startsWith('1.')) throw refuse('gltf_1', `${fileName} is glTF ${version}. Treadle reads glTF 2.0: re-export it as glTF 2.0.`);
  if (!version.startsWith('2.')) throw refuse('unsupported_version', `${fileName} is glTF ${version}; Treadle reads glTF 2.0.`);
}

function readGlb(main: UploadedFile): Container {
  const bytes = main.buffer;
  const name = main.originalname;
  if (bytes.length < 12) throw refuse('truncated_glb', `${name} ends after ${bytes.length} bytes, inside the 12-byte GLB header.`);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (view.getUint32(0, true) !== GLB_MAGIC) throw refuse('not_gltf', `${name} does not start with GLB's magic bytes "glTF".`);
  const version = view.getUint32(4, true);
  if (version === 1) throw refuse('gltf_1', `${name} is a glTF 1.0 binary. Treadle reads glTF 2.0: re-export it as glTF 2.0.`);
  if (version !== 2) throw refuse('unsupported_version', `${name} is a GLB of version ${version}; Treadle reads GLB version 2.`);
  const declared = view.getUint32(8, true);
  if (declared > bytes.length) throw refuse('truncated_glb', `${name} is cut short: its header says ${declared} bytes but only ${bytes.length} arrived. Upload the whole file again.`);

  let offset = 12;
  let json: GltfJson | null = null;
  let bin: Uint8Array | null = null;
  for (let index = 0; offset < declared; index++) {
    if (offset + 8 > declared) throw refuse('broken_glb_chunk', `${name} has a chunk header cut off at byte ${offset}.`);
    const length = view.getUint32(offset, true);
    const type = view.getUint32(offset + 4, true);
    const start = offset + 8;
    if (start + length > declared) {
      throw refuse('broken_glb_chunk', `${name}: chunk ${index} claims ${length} bytes, more than the ${declared - start} left in the file.`);
    }
    const data = bytes.subarray(start, start + length);
    if (index === 0) {
      if (type !== CHUNK_JSON) throw refuse('broken_glb_chunk', `${name}: the first GLB chunk must be JSON.`);
      json = parseJson(Buffer.from(data).toString('utf8'), `The JSON chunk of ${name}`);
    } else if (type === CHUNK_BIN && bin === null) {
      bin = data;
    }
    offset = start + length;
  }
  if (!json) throw refuse('broken_glb_chunk', `${name} has no JSON chunk.`);
  checkVersion(json, name);
  return { format: 'glb', main, json, bin, resources: {} };
}

function readGltf(main: UploadedFile, files: UploadedFile[]): Container {
  const json = parseJson(main.buffer.toString('utf8'), main.originalname);
  checkVersion(json, main.originalname);
  const byBase = new Map(files.filter((f) => f !== main).map((f) => [path.basename(f.originalname), f]));
  const resources: Record<string, Uint8Array> = {};
  const find = (uri: string) => {
    let decoded = uri;
    try {
      decoded = decodeURIComponent(uri);
    } catch {
      // keep the raw URI
    }
    return byBase.get(path.basename(decoded)) ?? byBase.get(path.basename(uri));
  };
  for (const buffer of json.buffers ?? []) {
    if (!buffer.uri || buffer.uri.startsWith('data:')) continue;
    const file = find(buffer.uri);
    if (!file) throw refuse('missing_buffer', `${main.originalname} needs the buffer file "${buffer.uri}", which was not uploaded with it. Pick the .gltf together with its .bin.`);
    resources[buffer.uri] = new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength);
  }
  for (const image of json.images ?? []) {
    if (!image.uri || image.uri.startsWith('data:')) continue;
    const file = find(image.uri);
    if (!file) throw refuse('missing_image', `${main.originalname} needs the image "${image.uri}", which was not uploaded with it. Pick the .gltf together with its images.`);
    resources[image.uri] = new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength);
  }
  return { format: 'gltf', main, json, bin: null, resources };
}

/** Decodes a base64 data URI's length without decoding it twice; null when it is not a base64 data URI. */
function dataUriLength(uri: string): number | null {
  const m = /^data:[^,]*;base64,(.*)$/s.exec(uri);
  if (!m) return null;
  const body = m[1].replace(/\s/g, '');
  if (!/^[A-Za-z0-9+/]*={0,2}$/.test(body)) return null;
  const pad = body.endsWith('==') ? 2 : body.endsWith('=') ? 1 : 0;
  return (body.length * 3) / 4 - pad;
}

/** Every buffer must hold at least its declared byteLength and every buffer view must fit its buffer (glTF 2.0 §3.6.1, §3.6.2). */
function checkBuffers(c: Container): void {
  const name = c.main.originalname;
  const buffers = Array.isArray(c.json.buffers) ? c.json.buffers : [];
  const actual = buffers.map((b, i) => {
    const declared = typeof b.byteLength === 'number' ? b.byteLength : NaN;
    let have: number;
    if (!b.uri) {
      if (c.format !== 'glb' || i !== 0) throw refuse('broken_buffer', `${name}: buffer ${i} has no uri and is not the GLB's binary chunk.`);
      if (!c.bin) throw refuse('broken_buffer', `${name}: its buffer lives in the GLB's binary chunk, but the file has none.`);
      have = c.bin.length;
    } else if (b.uri.startsWith('data:')) {
      const len = dataUriLength(b.uri);
      if (len === null) throw refuse('broken_buffer', `${name}: buffer ${i} has a data URI that is not base64.`);
      have = len;
    } else if (c.format === 'glb') {
      throw refuse('missing_buffer', `${name} points at an outside file "${b.uri}" for buffer ${i}; a .glb must carry its data inside. Re-export as a self-contained .glb.`);
    } else {
      have = c.resources[b.uri]?.length ?? 0;
    }
    if (!(declared >= 0) || have < declared) {
      throw refuse('broken_buffer', `${name}: buffer ${i} declares ${b.byteLength} bytes but holds ${have}. The file or its .bin is damaged or from another export.`);
    }
    return declared;
  });
  (Array.isArray(c.json.bufferViews) ? c.json.bufferViews : []).forEach((v, i) => {
    const size = typeof v.buffer === 'number' ? actual[v.buffer] : undefined;
    const end = (v.byteOffset ?? 0) + (v.byteLength ?? 0);
    if (size === undefined || !(end <= size)) {
      throw refuse('broken_buffer', `${name}: buffer view ${i} reaches byte ${end} of buffer ${v.buffer}, which is only ${size ?? 0} bytes.`);
    }
  });
}

/** Sorts the upload into a container (GLB or .gltf with its parts) or refuses it with the reason. */
export function readContainer(files: UploadedFile[]): Container {
  const main = mainFileOf(files);
  if (main.buffer.length === 0) throw refuse('empty_file', `${main.originalname} is empty (0 bytes).`);
  let container: Container;
  if (looksLikeGlb(main.buffer)) container = readGlb(main);
  else if (/\.glb$/i.test(main.originalname)) throw refuse('not_gltf', `${main.originalname} does not start with GLB's magic bytes "glTF"; it is not a glTF binary.`);
  else container = readGltf(main, files);
  checkBuffers(container);
  return container;
}
