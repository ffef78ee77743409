/**
 * The leg-profile runtime for JavaScript and TypeScript games.
 *
 * API sketch (stable; the package in packages/runtime re-exports exactly this):
 *
 *   const profile = loadLegProfile(text);                  // validates; errors name each problem
 *   const bound = bindLegProfile(profile, skeleton);       // joints by name; names every missing one
 *   const legs = createLegRuntime(bound, ground, {         // ground: a Heightfield, or a GroundQuery callback
 *     position: [0, 0], heading: 0,                        //   where the body starts (x, z; rad about +Y, 0 faces +Z)
 *     standing: true,                                      //   start with every foot planted (else: walking, as a trial)
 *     onError: (e) => console.warn(e.message),             //   a ground callback that throws or gives NaN: once
 *   });
 *   // createRigRuntime(rig, legSetup, ground, options): the same for a rig and an unsaved leg setup (drive mode);
 *   // options.watchStumbles + legs.stumbleCounts(out) count stumbles as trials do (RUNTIME_STUMBLE_KINDS order).
 *   // each game frame, one of:
 *   legs.drive(vx, vz, turnRate);                          // desired planar velocity (world, m/s) and turn rate (rad/s)
 *   legs.follow(x, z, heading);                            // or: the body's world transform the game moved it to
 *   legs.update(dt);                                       // any frame time: fixed internal steps, interpolated for drawing
 *   for (let i = 0; i < legs.legNames.length; i++) {
 *     legs.footPosition(i, foot);                          // where the sole is (interpolated)
 *     for (let k = 0; k < legs.jointIndices(i).length; k++) legs.jointWorldMatrix(i, k, m); // pose the bones
 *   }
 *   legs.bodyPosition(p); legs.bodyRotation(q);            // the pelvis: height, pitch and roll follow the feet
 *
 *   type GroundQuery = (x: number, z: number, normal: Float64Array) => number;
 *     // returns the ground height under (x, z) and writes its unit normal into normal[0..2]
 *     // (like a physics raycast down); a query that leaves the normal untouched gets one estimated from heights.
 *     // While walking, a query that throws or returns a non-finite height undoes that step, is reported once
 *     // (onError and lastError) and the last good pose is held; while the feet are first placed (in
 *     // createLegRuntime) it throws a GroundQueryError naming the point instead.
 *
 * Until the game first calls drive() or follow(), the body walks straight ahead at the profile's gait speed,
 * exactly as Treadle's trials walk (`step()` advances one fixed step without interpolation, as before).
 *
 * How the gait follows speed: the stride at the profile's own speed v0 is the profile's; at another speed v the
 * cycle time is T(v) = T0 · (v / v0)^(−0.4), the relation Alexander (1976, Nature 261) fitted to walking animals
 * and people (relative stride ∝ Froude number^0.3, so cadence ∝ v^0.4). The speed is the fastest a foot moves
 * relative to the body (|v| + |turn rate| × the farthest foot's distance from the body's centre), so turning in
 * place steps too. The cycle is kept within [0.6, 2] × T0 (common practice, no source), and short enough on a
 * turn that one stance turns the body by at most 20°. The speed is at most the walk-to-run transition, Froude
 * number 0.5 (Kram, Domingo & Ferris 1997), or v0 if that is faster; speed ramps over two cycles, turn rate
 * over one, and both brake twice as fast. Below 2 % of v0 the walk stops: every foot already within a tenth of a stride of
 * where a step would put it stays planted, the others take one more step (engine/gait/walk-speed.ts).
 *
 * Each step runs the walk Treadle measures with (engine/gait/walk.ts: gait clock, foot planner, body, and the
 * profile's solver from engine/ik) and no trial recorder: a game sees the feet Treadle scored.
 */
import type { Heightfield } from '../course/heightfield';
import { rigFromCharacter, type CharacterRigOptions } from '../gait/character-rig';
import type { Rig } from '../gait/rig';
import type { LegMapping } from '../rig/leg-mapping';
import type { Skeleton } from '../rig/types';
import { scaledSkeleton } from '../rig/skeleton-scale';
import { LegProfileError, parseLegProfile } from './export';
import { legMappingsFor } from './rig-mapping';
import type { LegProfile } from './schema';
import { createDrivenWalk, type DrivenWalk } from './runtime-drive';
import { STUMBLE_KINDS } from '../metrics/stumble-thresholds';

export { LegProfileBindError } from './rig-mapping';
export { LegProfileError } from './export';

/** The game's ground: height under (x, z), its unit normal written into normal[0..2] (leave it to have it estimated). */
export type GroundQuery = (x: number, z: number, normal: Float64Array) => number;

/** Reads a profile from its file text (or an already parsed object) and validates it. */
export function loadLegProfile(input: string | unknown): LegProfile {
  let value = input;
  if (typeof input === 'string') {
    try {
      value = JSON.parse(input);
    } catch (err) {
      throw new LegProfileError(`the leg profile is not JSON: ${(err as Error).message}`);
    }
  }
  return parseLegProfile(value);
}

export interface BoundLegProfile {
  profile: LegProfile;
  /** The profile's legs with the game skeleton's joint indices. */
  legs: LegMapping[];
  rig: Rig;
}

/**
 * Binds the profile to the game's skeleton by joint names; throws a LegProfileBindError naming every missing joint.
 * The skeleton is read in the file's units and scaled by the profile's unit fix (rig.unitScale), so the rig, the
 * feet and the body are in metres, as Treadle measured them; divide by the fix to draw in the file's units.
 */
export function bindLegProfile(profile: LegProfile, skeleton: Skeleton, options: CharacterRigOptions = {}): BoundLegProfile {
  const legs = legMappingsFor(skeleton, profile.rig);
  const metres = scaledSkeleton(skeleton, profile.rig.unitScale ?? 1);
  return { profile, legs, rig: rigFromCharacter(metres, legs, { name: profile.character.name, ...options }) };
}

/** What went wrong with the game's ground; the runtime holds its last good pose meanwhile. */
export interface LegRuntimeError {
  kind: 'ground';
  message: string;
  /** Where the ground was asked. */
  x: number;
  z: number;
}

export interface LegRuntime {
  /** Leg names in the order every per-leg call uses (front to back, left before right). */
  readonly legNames: readonly string[];
  /** The fixed internal step, s. */
  readonly timeStep: number;
  /** Fixed steps taken so far. */
  readonly frame: number;
  /** Seconds of game time consumed by update() (and step()). */
  readonly time: number;
  /** Share of the way from the previous fixed step to the last that drawing shows, 0..1. */
  readonly alpha: number;
  /** The body's planar speed and turn rate the walk follows now (after the limits), m/s and rad/s. */
  readonly speed: number;
  readonly turnRate: number;
  /** Gait cycle time now, s (follows speed: see the rule above). */
  readonly cycleTime: number;
  /** Every foot planted and the body standing. */
  readonly resting: boolean;
  /** The first problem met (null: none); reported once through onError as well. */
  readonly lastError: LegRuntimeError | null;
  /** Desired planar velocity in world axes (m/s) and turn rate (rad/s, positive turns +Z toward +X); followed within the limits. */
  drive(vx: number, vz: number, turnRate: number): void;
  /** The body's world position (x, z) and heading (rad about +Y, 0 faces +Z) the game moved it to this frame. */
  follow(x: number, z: number, heading: number): void;
  /** Advance by a frame time of any length, s: fixed steps inside, drawing interpolated between the last two. */
  update(dt: number): void;
  /** Advances one fixed step (no interpolation); false once a walk without drive reached the end of a heightfield. */
  step(): boolean;
  inStance(leg: number): boolean;
  footPosition(leg: number, out?: Float64Array): Float64Array;
  footTarget(leg: number, out?: Float64Array): Float64Array;
  /** The game skeleton's joint indices of the leg's moving joints, hip first. */
  jointIndices(leg: number): readonly number[];
  /** World matrix (column-major 4×4, rest-space axes) of the leg's k-th moving joint, interpolated. */
  jointWorldMatrix(leg: number, k: number, out?: Float64Array): Float64Array;
  bodyPosition(out?: Float64Array): Float64Array;
  /** Body rotation [x, y, z, w]: heading, then roll and pitch from the feet. */
  bodyRotation(out?: Float64Array): Float64Array;
  /** Stumbles seen so far per kind, in the order of RUNTIME_STUMBLE_KINDS (all 0 unless options.watchStumbles). */
  stumbleCounts(out?: Int32Array): Int32Array;
}

/** Stumble kinds in the order stumbleCounts gives them. */
export const RUNTIME_STUMBLE_KINDS = STUMBLE_KINDS;

export interface LegRuntimeOptions {
  /** Internal fixed step, s (default 1/60). */
  timeStep?: number;
  /** Longest walk without drive, s (the ground's length usually ends it first). */
  duration?: number;
  /** Start position (x, z), m, and heading, rad. Default: where a trial of the heightfield starts, facing +Z. */
  position?: readonly [number, number];
  heading?: number;
  /** Spacing at which a GroundQuery is sampled along swing paths, m (default 0.02). */
  groundSpacing?: number;
  /** Start standing, every foot planted (a game's spawn); default: walking straight ahead as a trial does. */
  standing?: boolean;
  /** Count stumbles as Treadle's trials do (costs a ground query per foot and step); default off. */
  watchStumbles?: boolean;
  /** Called once when the ground starts failing (again after it has recovered). */
  onError?: (error: LegRuntimeError) => void;
}

export function createLegRuntime(bound: BoundLegProfile, ground: Heightfield | GroundQuery, options: LegRuntimeOptions = {}): LegRuntime {
  return createRigRuntime(bound.rig, bound.profile.legSetup, ground, options);
}

/**
 * The same runtime for a rig and a leg setup without a published profile (the app's drive mode walks the
 * unsaved setup); joint indices are the rig's skeleton joints (−1 where a joint has none).
 */
export function createRigRuntime(rig: Rig, setup: unknown, ground: Heightfield | GroundQuery, options: LegRuntimeOptions = {}): LegRuntime {
  const walk: DrivenWalk = createDrivenWalk(rig, setup, ground, options);
  const joints = rig.legs.map((l) => l.chain.joints.map((j) => j.skeletonJoint ?? -1));
  const legs = rig.legs.length;
  const check = (leg: number) => {
    if (!(leg >= 0 && leg < legs)) throw new RangeError(`leg ${leg} is out of range: the profile has ${legs} legs`);
  };
  return {
    legNames: rig.legs.map((l) => l.name),
    timeStep: walk.timeStep,
    get frame() {
      return walk.frame;
    },
    get time() {
      return walk.time;
    },
    get alpha() {
      return walk.alpha;
    },
    get speed() {
      return walk.speed;
    },
    get turnRate() {
      return walk.turnRate;
    },
    get cycleTime() {
      return walk.cycleTime;
    },
    get resting() {
      return walk.resting;
    },
    get lastError() {
      return walk.lastError;
    },
    drive: (vx, vz, turnRate) => walk.drive(vx, vz, turnRate),
    follow: (x, z, heading) => walk.follow(x, z, heading),
    update: (dt) => walk.update(dt),
    step: () => walk.step(),
    inStance: (leg) => (check(leg), walk.inStance(leg)),
    footPosition: (leg, out = new Float64Array(3)) => (check(leg), walk.footPosition(leg, out)),
    footTarget: (leg, out = new Float64Array(3)) => (check(leg), walk.footTarget(leg, out)),
    jointIndices: (leg) => (check(leg), joints[leg]),
    jointWorldMatrix: (leg, k, out = new Float64Array(16)) => {
      check(leg);
      if (!(k >= 0 && k < joints[leg].length)) throw new RangeError(`joint ${k} is out of range: leg ${leg} has ${joints[leg].length} moving joints`);
      return walk.jointWorldMatrix(leg, k, out);
    },
    bodyPosition: (out = new Float64Array(3)) => walk.bodyPosition(out),
    bodyRotation: (out = new Float64Array(4)) => walk.bodyRotation(out),
    stumbleCounts: (out = new Int32Array(STUMBLE_KINDS.length)) => walk.stumbleCounts(out),
  };
}
