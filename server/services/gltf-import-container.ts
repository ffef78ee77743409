/**
 * Reads the outer layer of an upload: which file is the glTF, GLB header and chunks, the JSON,
 * its version, and whether every buffer and image it names arrived. glTF 2.0 specification §4.4
 * (GLB: 12-byte header "glTF", version, length; chunks of length, type, data; JSON chunk first).
 */
import path from 'node:path';
import { MAX_ACCESSOR_COUNT, MAX_OBJECTS, refuse } from './gltf-import-refusals';
import { DEFAULT_JSON_BOUNDS, scanJsonBounds, type JsonBounds } from './gltf-import-json-scan';

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

/** Bounds the JSON with a non-recursive scan first (gltf-import-json-scan.ts), then parses it. */
function parseJson(bytes: Uint8Array, where: string, bounds: JsonBounds): GltfJson {
  scanJsonBounds(bytes, where, bounds);
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8');
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

function readGlb(main: UploadedFile, bounds: JsonBounds): Container {
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
      json = parseJson(data, `The JSON chunk of ${name}`, bounds);
    } else if (type === CHUNK_BIN && bin === null) {
      bin = data;
    }
    offset = start + length;
  }
  if (!json) throw refuse('broken_glb_chunk', `${name} has no JSON chunk.`);
  checkVersion(json, name);
  checkShape(json, name);
  return { format: 'glb', main, json, bin, resources: {} };
}

function readGltf(main: UploadedFile, files: UploadedFile[], bounds: JsonBounds): Container {
  const json = parseJson(main.buffer, main.originalname, bounds);
  checkVersion(json, main.originalname);
  checkShape(json, main.originalname);
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
    if (!isIndex(declared) || have < declared) {
      throw refuse('broken_buffer', `${name}: buffer ${i} declares ${b.byteLength} bytes but holds ${have}. The file or its .bin is damaged or from another export.`);
    }
    return declared;
  });
  (Array.isArray(c.json.bufferViews) ? c.json.bufferViews : []).forEach((v, i) => {
    const size = isIndex(v.buffer) ? actual[v.buffer] : undefined;
    const offset = v.byteOffset ?? 0;
    if (!isIndex(offset) || !isIndex(v.byteLength) || v.byteLength < 1) {
      throw refuse('broken_buffer', `${name}: buffer view ${i} has a byteOffset or byteLength that is not a whole number of bytes.`);
    }
    const end = offset + v.byteLength;
    if (size === undefined || !(end <= size)) {
      throw refuse('broken_buffer', `${name}: buffer view ${i} reaches byte ${end} of buffer ${v.buffer}, which is only ${size ?? 0} bytes.`);
    }
  });
}

/** The glTF 2.0 top-level properties that hold arrays of objects (glTF 2.0 JSON schema, glTF.schema.json). */
const OBJECT_ARRAYS = ['accessors', 'animations', 'buffers', 'bufferViews', 'cameras', 'images', 'materials', 'meshes', 'nodes', 'samplers', 'scenes', 'skins', 'textures'] as const;

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  return typeof value === 'object' ? 'an object' : `a ${typeof value}`;
}

const isIndex = (v: unknown): v is number => Number.isInteger(v) && (v as number) >= 0;

/**
 * The shape the rest of the import relies on, and object counts under the caps, checked on the parsed JSON
 * before any heavy work: the Khronos validator and @gltf-transform only ever see a file that passed.
 */
function checkShape(json: GltfJson, name: string): void {
  if (!json.asset || typeof json.asset !== 'object' || Array.isArray(json.asset)) throw refuse('bad_structure', `${name}: "asset" must be an object.`);
  for (const key of OBJECT_ARRAYS) {
    const value = json[key];
    if (value === undefined) continue;
    if (!Array.isArray(value)) throw refuse('bad_structure', `${name}: "${key}" must be an array of objects (glTF 2.0), but it is ${describe(value)}.`);
    const bad = value.findIndex((item) => !item || typeof item !== 'object' || Array.isArray(item));
    if (bad >= 0) throw refuse('bad_structure', `${name}: ${key}[${bad}] must be an object, but it is ${describe(value[bad])}.`);
    const cap = (MAX_OBJECTS as Record<string, number>)[key];
    if (cap !== undefined && value.length > cap) {
      throw refuse(
        'too_many_objects',
        `${name} has ${value.length.toLocaleString('en')} ${key}; Treadle accepts at most ${cap.toLocaleString('en')}, far more than any game character has. The file is damaged or holds a whole scene: export only the character.`,
      );
    }
  }
  for (const key of ['extensionsUsed', 'extensionsRequired'] as const) {
    const value = json[key];
    if (value !== undefined && !(Array.isArray(value) && value.every((e) => typeof e === 'string'))) throw refuse('bad_structure', `${name}: "${key}" must be an array of extension names.`);
  }
  if (json.scene !== undefined && !(isIndex(json.scene) && json.scene < (Array.isArray(json.scenes) ? json.scenes.length : 0))) {
    throw refuse('bad_structure', `${name}: "scene" names scene ${String(json.scene)}, which does not exist.`);
  }
  const nodeCount = json.nodes?.length ?? 0;
  (json.scenes as { nodes?: unknown }[] | undefined)?.forEach((scene, i) => {
    if (scene.nodes !== undefined && !(Array.isArray(scene.nodes) && scene.nodes.every((n) => isIndex(n) && n < nodeCount))) {
      throw refuse('bad_structure', `${name}: scene ${i} lists a node that does not exist.`);
    }
  });
  (json.skins ?? []).forEach((skin, i) => {
    const joints = skin.joints;
    if (!Array.isArray(joints) || !joints.every((j) => isIndex(j) && j < nodeCount)) throw refuse('bad_structure', `${name}: skin ${i} lists a joint that is not a node of the file.`);
    // skin.schema.json: joints has uniqueItems; a reader that drops the repeat would shift every later joint's matrix.
    if (new Set(joints).size !== joints.length) throw refuse('bad_hierarchy', `${name}: skin ${i} lists the same joint twice. Each joint appears once in a skin (glTF 2.0, skin.joints).`);
    for (const key of ['inverseBindMatrices', 'skeleton'] as const) {
      const ref = (skin as Record<string, unknown>)[key];
      const limit = key === 'skeleton' ? nodeCount : (json.accessors as unknown[] | undefined)?.length ?? 0;
      if (ref !== undefined && !(isIndex(ref) && ref < limit)) throw refuse('bad_structure', `${name}: skin ${i} has a ${key} (${String(ref)}) that does not exist.`);
    }
  });
  (json.buffers ?? []).forEach((b, i) => {
    if (b.uri !== undefined && typeof b.uri !== 'string') throw refuse('bad_structure', `${name}: buffer ${i} has a uri that is not text.`);
  });
  (json.images ?? []).forEach((img, i) => {
    if (img.uri !== undefined && typeof img.uri !== 'string') throw refuse('bad_structure', `${name}: image ${i} has a uri that is not text.`);
  });
}

/** Bytes per component of each accessor componentType (glTF 2.0 §3.6.2.2). */
const COMPONENT_BYTES: Record<number, number> = { 5120: 1, 5121: 1, 5122: 2, 5123: 2, 5125: 4, 5126: 4 };
/** Components per element of each accessor type (glTF 2.0 §3.6.2.2). */
const TYPE_COMPONENTS: Record<string, number> = { SCALAR: 1, VEC2: 2, VEC3: 3, VEC4: 4, MAT2: 4, MAT3: 9, MAT4: 16 };

interface AccessorJson {
  bufferView?: unknown;
  byteOffset?: unknown;
  componentType?: unknown;
  type?: unknown;
  count?: unknown;
  sparse?: { count?: unknown; indices?: { bufferView?: unknown; byteOffset?: unknown; componentType?: unknown }; values?: { bufferView?: unknown; byteOffset?: unknown } };
}

/**
 * Every accessor must lie inside its buffer view: glTF 2.0 §3.6.2.4 requires accessor.byteOffset +
 * EFFECTIVE_BYTE_STRIDE × (count − 1) + SIZE_OF_COMPONENT × NUMBER_OF_COMPONENTS ≤ bufferView.byteLength.
 * A reader that trusts an accessor past its view reads another accessor's bytes, or past the end of the buffer.
 */
function checkAccessors(c: Container): void {
  const name = c.main.originalname;
  const views = (c.json.bufferViews ?? []) as { byteLength?: number; byteStride?: unknown }[];
  const fits = (viewIndex: unknown, offset: unknown, stride: number, count: number, element: number, what: string) => {
    if (!isIndex(viewIndex) || viewIndex >= views.length) throw refuse('broken_buffer', `${name}: ${what} names a buffer view ${String(viewIndex)} that does not exist.`);
    const start = offset === undefined ? 0 : offset;
    if (!isIndex(start)) throw refuse('broken_buffer', `${name}: ${what} has a byteOffset that is not a whole number of bytes.`);
    const end = start + stride * (count - 1) + element;
    const length = views[viewIndex].byteLength ?? 0;
    if (!(end <= length)) throw refuse('broken_buffer', `${name}: ${what} reaches byte ${end} of buffer view ${viewIndex}, which holds only ${length}. The file is damaged.`);
  };
  ((c.json.accessors ?? []) as AccessorJson[]).forEach((a, i) => {
    const size = COMPONENT_BYTES[a.componentType as number];
    const components = TYPE_COMPONENTS[a.type as string];
    if (!size || !components) throw refuse('broken_buffer', `${name}: accessor ${i} has an unknown componentType or type.`);
    if (!isIndex(a.count) || a.count < 1 || a.count > MAX_ACCESSOR_COUNT) {
      throw refuse('broken_buffer', `${name}: accessor ${i} declares ${String(a.count)} elements; an accessor holds 1 to ${MAX_ACCESSOR_COUNT.toLocaleString('en')}.`);
    }
    const element = size * components;
    if (a.bufferView !== undefined) {
      const declared = views[a.bufferView as number]?.byteStride;
      const stride = typeof declared === 'number' && declared > 0 ? declared : element;
      fits(a.bufferView, a.byteOffset, stride, a.count, element, `accessor ${i}`);
    }
    const sparse = a.sparse;
    if (sparse !== undefined) {
      if (!isIndex(sparse.count) || sparse.count < 1 || sparse.count > a.count) throw refuse('broken_buffer', `${name}: accessor ${i} has a sparse count outside 1–${a.count}.`);
      const indexSize = COMPONENT_BYTES[sparse.indices?.componentType as number];
      if (!indexSize) throw refuse('broken_buffer', `${name}: accessor ${i} has sparse indices of an unknown componentType.`);
      fits(sparse.indices?.bufferView, sparse.indices?.byteOffset, indexSize, sparse.count, indexSize, `the sparse indices of accessor ${i}`);
      fits(sparse.values?.bufferView, sparse.values?.byteOffset, element, sparse.count, element, `the sparse values of accessor ${i}`);
    }
  });
}

/** Sorts the upload into a container (GLB or .gltf with its parts) or refuses it with the reason. */
export function readContainer(files: UploadedFile[], bounds: JsonBounds = DEFAULT_JSON_BOUNDS): Container {
  const main = mainFileOf(files);
  if (main.buffer.length === 0) throw refuse('empty_file', `${main.originalname} is empty (0 bytes).`);
  let container: Container;
  if (looksLikeGlb(main.buffer)) container = readGlb(main, bounds);
  else if (/\.glb$/i.test(main.originalname)) throw refuse('not_gltf', `${main.originalname} does not start with GLB's magic bytes "glTF"; it is not a glTF binary.`);
  else container = readGltf(main, files, bounds);
  checkBuffers(container);
  checkAccessors(container);
  return container;
}
