/**
 * The leg-profile runtime for JavaScript and TypeScript games.
 *
 *   import { loadLegProfile, bindLegProfile, createLegRuntime } from 'treadle/engine/profile';
 *   const profile = loadLegProfile(await (await fetch(url)).text());   // validates; errors name each problem
 *   const bound = bindLegProfile(profile, skeleton);                    // joints by name; names every missing one
 *   const legs = createLegRuntime(bound, ground);                      // ground: an engine Heightfield of the level
 *   function frame() {
 *     legs.step();                                                     // one fixed step (1/60 s by default)
 *     for (let i = 0; i < legs.legNames.length; i++) {
 *       legs.footPosition(i, foot);                                    // where the sole is
 *       for (let k = 0; k < legs.jointIndices(i).length; k++) legs.jointWorldMatrix(i, k, m); // pose the bones
 *     }
 *   }
 *
 * Each step runs exactly the trial loop Treadle measures with (engine/gait stepTrial: gait clock, foot planner,
 * body filter, and the profile's solver from engine/ik), so a game sees the feet Treadle scored. The body walks
 * along +Z of the ground at the profile's gait speed; place the ground (and so the walk) where the level needs it.
 */
import type { Heightfield } from '../course/heightfield';
import { rigFromCharacter, type CharacterRigOptions } from '../gait/character-rig';
import type { Rig } from '../gait/rig';
import { createTrial, stepTrial, type Trial, type TrialOptionsInput } from '../gait/trial';
import { jointWorldMatrix as chainJointWorldMatrix } from '../ik/kinematics';
import type { Skeleton } from '../rig/types';
import type { LegMapping } from '../rig/leg-mapping';
import { LegProfileError, parseLegProfile } from './export';
import { legMappingsFor } from './rig-mapping';
import type { LegProfile } from './schema';

export { LegProfileBindError } from './rig-mapping';
export { LegProfileError } from './export';

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

/** Binds the profile to the game's skeleton by joint names; throws a LegProfileBindError naming every missing joint. */
export function bindLegProfile(profile: LegProfile, skeleton: Skeleton, options: CharacterRigOptions = {}): BoundLegProfile {
  const legs = legMappingsFor(skeleton, profile.rig);
  return { profile, legs, rig: rigFromCharacter(skeleton, legs, { name: profile.character.name, ...options }) };
}

export interface LegRuntime {
  /** Leg names in the order every per-leg call uses (front to back, left before right). */
  readonly legNames: readonly string[];
  readonly timeStep: number;
  /** Frames stepped so far. */
  readonly frame: number;
  /** Advances one fixed time step; false once the walk reached the end of the ground. */
  step(): boolean;
  inStance(leg: number): boolean;
  footPosition(leg: number, out?: Float64Array): Float64Array;
  footTarget(leg: number, out?: Float64Array): Float64Array;
  /** The game skeleton's joint indices of the leg's moving joints, hip first. */
  jointIndices(leg: number): readonly number[];
  /** World matrix (column-major 4×4, rest-space axes) of the leg's k-th moving joint after the last step. */
  jointWorldMatrix(leg: number, k: number, out?: Float64Array): Float64Array;
  bodyPosition(out?: Float64Array): Float64Array;
  /** Body rotation [x, y, z, w]. */
  bodyRotation(out?: Float64Array): Float64Array;
}

export interface LegRuntimeOptions {
  timeStep?: number;
  /** Longest walk, s (the ground's length usually ends it first). */
  duration?: number;
}

const copy3 = (src: ArrayLike<number>, o: number, out: Float64Array) => {
  out[0] = src[o];
  out[1] = src[o + 1];
  out[2] = src[o + 2];
  return out;
};

export function createLegRuntime(bound: BoundLegProfile, ground: Heightfield, options: LegRuntimeOptions = {}): LegRuntime {
  const trialOptions: TrialOptionsInput = { duration: options.duration ?? 600, ...(options.timeStep ? { timeStep: options.timeStep } : {}) };
  const trial: Trial = createTrial(bound.rig, bound.profile.legSetup, ground, trialOptions);
  const joints = bound.rig.legs.map((l) => l.chain.joints.map((j) => j.skeletonJoint ?? -1));
  const check = (leg: number) => {
    if (!(leg >= 0 && leg < trial.legs)) throw new RangeError(`leg ${leg} is out of range: the profile has ${trial.legs} legs`);
  };
  return {
    legNames: bound.rig.legs.map((l) => l.name),
    timeStep: trial.options.timeStep,
    get frame() {
      return trial.frame;
    },
    step: () => stepTrial(trial),
    inStance: (leg) => (check(leg), trial.stance[leg] === 1),
    footPosition: (leg, out = new Float64Array(3)) => (check(leg), copy3(trial.solvers[leg].foot, 0, out)),
    footTarget: (leg, out = new Float64Array(3)) => (check(leg), copy3(trial.target, 3 * leg, out)),
    jointIndices: (leg) => (check(leg), joints[leg]),
    jointWorldMatrix: (leg, k, out = new Float64Array(16)) => {
      check(leg);
      chainJointWorldMatrix(trial.solvers[leg], k, out);
      return out;
    },
    bodyPosition: (out = new Float64Array(3)) => copy3(trial.bodyPos, 0, out),
    bodyRotation: (out = new Float64Array(4)) => {
      out.set(trial.bodyRot);
      return out;
    },
  };
}
