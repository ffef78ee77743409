/**
 * treadle-runtime: a published leg profile plants a game character's feet with the same gait clock, foot
 * planner, body filter and leg solver that Treadle's trials scored. The API is engine/profile's runtime
 * (loadLegProfile, bindLegProfile, createLegRuntime) with the helpers a game needs around it.
 *
 *   const legs = createLegRuntime(bindLegProfile(loadLegProfile(profileJson), skeletonFromBones(bones)), courseGround(courseJson));
 *   function frame(dt) {
 *     legs.drive(vx, vz, turnRate);                              // or legs.follow(x, z, heading)
 *     legs.update(dt);                                           // any frame time; fixed steps inside
 *     legs.jointIndices(i).forEach((bone, k) => legs.jointWorldMatrix(i, k, matrices[bone]));
 *   }
 */
import { mat4, quat, vec3 } from 'gl-matrix';
import { rigOriginOf } from '../../../engine/gait/character-rig';
import { decodeCourse } from '../../../engine/course/encoding';
import { flatCourse } from '../../../engine/course/generators';
import { bindLegProfile as engineBind, loadLegProfile as engineLoad, LegProfileBindError as EngineBindError, LegProfileError as EngineProfileError } from '../../../engine/profile/runtime';
import { createProfileRuntime, engineBound, STUMBLE_KINDS as KINDS } from './walker';
import type { BoundLegProfile, ErrorClass, GroundQuery, HeightfieldGround, LegProfileFile, LegRuntime, LegRuntimeOptions, Skeleton, SkeletonJoint, StumbleKindName } from './types';

export type { BoundLegProfile, ErrorClass, GroundQuery, HeightfieldGround, LegProfileFile, LegRuntime, LegRuntimeError, LegRuntimeOptions, Skeleton, SkeletonJoint, StumbleKindName } from './types';
export { PROFILE_SCHEMA, PROFILE_SCHEMA_VERSION, RUNTIME_VERSION } from './version';

/** The stumble kinds, in the order stumbleCounts gives them. */
export const STUMBLE_KINDS: readonly StumbleKindName[] = KINDS;

/** Thrown by loadLegProfile when the file is not a valid leg profile; the message names each problem. */
export const LegProfileError: ErrorClass = EngineProfileError;
/** Thrown by bindLegProfile when the skeleton lacks joints the profile names; the message names every missing one. */
export const LegProfileBindError: ErrorClass = EngineBindError;

/** Reads a leg profile from its file text (or the parsed object) and validates it; a LegProfileError names each problem. */
export function loadLegProfile(input: string | object): LegProfileFile {
  return engineLoad(input) as unknown as LegProfileFile;
}

/** Binds the profile to the game's skeleton by joint names; a LegProfileBindError names every missing joint. */
export function bindLegProfile(profile: LegProfileFile, skeleton: Skeleton): BoundLegProfile {
  const checked = engineLoad(profile);
  const bound = engineBind(checked, skeleton);
  return Object.assign(bound, { restOrigin: rigOriginOf(skeleton, bound.legs) }) as unknown as BoundLegProfile;
}

/** The walking legs over the game's ground: a heightfield (courseGround, flatGround) or a height query of its own. */
export function createLegRuntime(bound: BoundLegProfile, ground: HeightfieldGround | GroundQuery, options: LegRuntimeOptions = {}): LegRuntime {
  return createProfileRuntime(engineBound(bound), ground, options, (bound as unknown as { restOrigin: [number, number, number] }).restOrigin);
}

/** A Treadle course file (GET /api/courses/:id, or its `encoding`) as ground; a CourseError names what is wrong. */
export function courseGround(course: string | object): HeightfieldGround {
  let value: unknown = typeof course === 'string' ? JSON.parse(course) : course;
  const nested = (value as { course?: { encoding?: unknown }; encoding?: unknown }) ?? {};
  value = nested.course?.encoding ?? nested.encoding ?? value;
  return decodeCourse(value as Parameters<typeof decodeCourse>[0]);
}

/** Level ground, `length` metres along +Z. */
export function flatGround(length = 40): HeightfieldGround {
  return flatCourse(length);
}

/** What skeletonFromBones reads of a bone and its ancestors: three.js's Object3D has all of it. */
export interface BoneLike {
  name: string;
  parent: BoneLike | null;
  position: { x: number; y: number; z: number };
  quaternion: { x: number; y: number; z: number; w: number };
  scale: { x: number; y: number; z: number };
}

// Full double precision: gl-matrix makes Float32Array unless given the array.
const m4 = () => new Float64Array(16) as unknown as mat4;
const local = (o: BoneLike): mat4 =>
  mat4.fromRotationTranslationScale(m4(), [o.quaternion.x, o.quaternion.y, o.quaternion.z, o.quaternion.w], [o.position.x, o.position.y, o.position.z], [o.scale.x, o.scale.y, o.scale.z]);

/**
 * The skeleton of a skin's bones in skin order (three.js: `skinnedMesh.skeleton.bones`), as Treadle reads it
 * from the glTF file: each joint's parent is the nearest ancestor that is also a bone, and nodes in between
 * (or above a root bone, up to the scene) are folded into the joint's rest transform (glTF 2.0 §3.7.3).
 */
export function skeletonFromBones(bones: readonly BoneLike[]): Skeleton {
  const index = new Map(bones.map((b, i) => [b, i]));
  const joints: SkeletonJoint[] = bones.map((bone, i) => {
    let m = local(bone);
    let parent = bone.parent;
    let folded = false;
    while (parent && !index.has(parent) && parent.parent) {
      m = mat4.multiply(m4(), local(parent), m);
      folded = true;
      parent = parent.parent;
    }
    const t = mat4.getTranslation(new Float64Array(3) as unknown as vec3, m);
    const s = mat4.getScaling(new Float64Array(3) as unknown as vec3, m);
    const r = folded ? quat.normalize(new Float64Array(4) as unknown as quat, mat4.getRotation(new Float64Array(4) as unknown as quat, m)) : [bone.quaternion.x, bone.quaternion.y, bone.quaternion.z, bone.quaternion.w];
    return {
      name: bone.name || `joint ${i}`,
      parent: parent && index.has(parent) ? index.get(parent)! : -1,
      translation: [t[0], t[1], t[2]],
      rotation: [r[0], r[1], r[2], r[3]],
      scale: [s[0], s[1], s[2]],
    };
  });
  return { joints };
}

interface GltfNode {
  name?: string;
  children?: number[];
  translation?: number[];
  rotation?: number[];
  scale?: number[];
  matrix?: number[];
}
interface GltfJson {
  nodes?: GltfNode[];
  skins?: { joints: number[] }[];
}

// Every browser and Node has it; the package's declarations name no DOM or Node library.
declare const TextDecoder: { new (): { decode(bytes: Uint8Array): string } };

const GLB_MAGIC = 0x46546c67; // "glTF"
const JSON_CHUNK = 0x4e4f534a; // "JSON"

/** The JSON of a .glb (binary glTF, glTF 2.0 §4.4) or of a .gltf's text. */
function gltfJsonOf(file: ArrayBuffer | Uint8Array | string | object): GltfJson {
  if (typeof file === 'string') return JSON.parse(file) as GltfJson;
  if (!(file instanceof ArrayBuffer) && !(file instanceof Uint8Array)) return file as GltfJson;
  const bytes = file instanceof Uint8Array ? file : new Uint8Array(file);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.byteLength < 20 || view.getUint32(0, true) !== GLB_MAGIC) throw new Error('not a .glb file: it does not start with "glTF"');
  const length = view.getUint32(12, true);
  if (view.getUint32(16, true) !== JSON_CHUNK || 20 + length > bytes.byteLength) throw new Error('the .glb file has no JSON chunk first');
  return JSON.parse(new TextDecoder().decode(bytes.subarray(20, 20 + length))) as GltfJson;
}

/**
 * The skeleton of a glTF file's skin (the one with the most joints unless `skin` is given), read straight from
 * the file the way Treadle's import reads it: for games that keep their own scene graph, and for Node.
 */
export function skeletonFromGltf(file: ArrayBuffer | Uint8Array | string | object, skin?: number): Skeleton {
  const json = gltfJsonOf(file);
  const skins = json.skins ?? [];
  if (!skins.length) throw new Error('the glTF file has no skin: export the armature with the mesh bound to it');
  const pick = skin ?? skins.reduce((best, s, i) => (s.joints.length > skins[best].joints.length ? i : best), 0);
  const nodes = json.nodes ?? [];
  const scene: BoneLike = { name: '', parent: null, position: { x: 0, y: 0, z: 0 }, quaternion: { x: 0, y: 0, z: 0, w: 1 }, scale: { x: 1, y: 1, z: 1 } };
  const like: BoneLike[] = nodes.map((n) => {
    let t = n.translation ?? [0, 0, 0];
    let r = n.rotation ?? [0, 0, 0, 1];
    let s = n.scale ?? [1, 1, 1];
    if (n.matrix) {
      const m = Float64Array.from(n.matrix) as unknown as mat4;
      t = [...mat4.getTranslation(new Float64Array(3) as unknown as vec3, m)];
      s = [...mat4.getScaling(new Float64Array(3) as unknown as vec3, m)];
      r = [...quat.normalize(new Float64Array(4) as unknown as quat, mat4.getRotation(new Float64Array(4) as unknown as quat, m))];
    }
    return { name: n.name ?? '', parent: scene, position: { x: t[0], y: t[1], z: t[2] }, quaternion: { x: r[0], y: r[1], z: r[2], w: r[3] }, scale: { x: s[0], y: s[1], z: s[2] } };
  });
  nodes.forEach((n, i) => n.children?.forEach((c) => like[c] && (like[c].parent = like[i])));
  return skeletonFromBones(skins[pick].joints.map((j, i) => {
    const bone = like[j];
    if (!bone) throw new Error(`skin joint ${i} names node ${j}, which the file does not have`);
    if (!bone.name) bone.name = `joint ${i}`;
    return bone;
  }));
}
