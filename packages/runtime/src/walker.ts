/**
 * The one place the package meets the engine's runtime (engine/profile/runtime.ts), so a change there is
 * followed here alone: the package's legs are the engine's createLegRuntime as it is, with characterMatrix
 * added. The package's own copies of engine shapes (types.ts) are checked against the engine's below: the
 * repository's type check fails when they drift.
 */
import type { Heightfield } from '../../../engine/course/heightfield';
import { createLegRuntime, RUNTIME_STUMBLE_KINDS, type BoundLegProfile as EngineBound, type GroundQuery as EngineGroundQuery, type LegRuntime as EngineLegRuntime, type LegRuntimeOptions as EngineOptions } from '../../../engine/profile/runtime';
import type { Skeleton as EngineSkeleton } from '../../../engine/rig/types';
import type { BoundLegProfile, GroundQuery, HeightfieldGround, LegRuntime, LegRuntimeOptions, Skeleton, StumbleKindName } from './types';

const heightfieldMatch: HeightfieldGround = {} as Heightfield;
const heightfieldBack: Heightfield = {} as HeightfieldGround;
const groundMatch: EngineGroundQuery = {} as GroundQuery;
const skeletonMatch: EngineSkeleton = {} as Skeleton;
const runtimeMatch: Omit<LegRuntime, 'characterMatrix'> = {} as EngineLegRuntime;
const runtimeBack: EngineLegRuntime = {} as LegRuntime;
const kindsMatch: readonly StumbleKindName[] = RUNTIME_STUMBLE_KINDS;
const kindsBack: readonly (typeof RUNTIME_STUMBLE_KINDS)[number][] = [] as StumbleKindName[];
const optionsMatch: EngineOptions = {} as LegRuntimeOptions;
void heightfieldMatch, heightfieldBack, groundMatch, skeletonMatch, runtimeMatch, runtimeBack, optionsMatch, kindsMatch, kindsBack;

/** The stumble kinds in the order stumbleCounts gives them. */
export const STUMBLE_KINDS: readonly StumbleKindName[] = RUNTIME_STUMBLE_KINDS;

/** The rotation of unit quaternion q and the translation t as a column-major 4×4 matrix. */
function rotationTranslation(q: ArrayLike<number>, t: ArrayLike<number>, out: Float64Array): Float64Array {
  const [x, y, z, w] = [q[0], q[1], q[2], q[3]];
  out[0] = 1 - 2 * (y * y + z * z);
  out[1] = 2 * (x * y + z * w);
  out[2] = 2 * (x * z - y * w);
  out[3] = 0;
  out[4] = 2 * (x * y - z * w);
  out[5] = 1 - 2 * (x * x + z * z);
  out[6] = 2 * (y * z + x * w);
  out[7] = 0;
  out[8] = 2 * (x * z + y * w);
  out[9] = 2 * (y * z - x * w);
  out[10] = 1 - 2 * (x * x + y * y);
  out[11] = 0;
  out[12] = t[0];
  out[13] = t[1];
  out[14] = t[2];
  out[15] = 1;
  return out;
}

/**
 * The package's legs: the engine runtime, plus where the character's rest space sits: the body's pose P, B
 * with the body origin O of rest space moved onto it, T(P)·R(B)·T(−O) (engine/gait/character-rig.ts).
 */
export function createProfileRuntime(bound: EngineBound, ground: HeightfieldGround | GroundQuery, options: LegRuntimeOptions, restOrigin: readonly [number, number, number]): LegRuntime {
  const legs = createLegRuntime(bound, ground as Heightfield | EngineGroundQuery, options);
  const p = new Float64Array(3);
  const q = new Float64Array(4);
  const runtime: LegRuntime = Object.create(legs);
  runtime.characterMatrix = (out = new Float64Array(16)) => {
    legs.bodyPosition(p);
    legs.bodyRotation(q);
    rotationTranslation(q, p, out);
    for (let r = 0; r < 3; r++) out[12 + r] = p[r] - (out[r] * restOrigin[0] + out[4 + r] * restOrigin[1] + out[8 + r] * restOrigin[2]);
    return out;
  };
  return runtime;
}

/** The package's bound profile is the engine's, with the rest-space origin beside it. */
export const engineBound = (b: BoundLegProfile): EngineBound => b as unknown as EngineBound;
