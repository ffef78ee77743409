/**
 * The state of a walk: everything the gait clock, the foot planner, the body
 * and the leg solves read and write, allocated once. A trial is a walk with a
 * recorder observing it (trial-state.ts); the game runtime is a walk alone.
 */
import type { Ground } from '../course/ground';
import type { PathTrack } from '../course/walk-path';
import type { IKWorkspace } from '../ik';
import type { CriticalFilter, DampedState } from './body-filter';
import type { GaitParams } from './gait-params';
import type { LegSetup } from './leg-setup';
import type { Rig } from './rig';
import type { SwingPlan } from './swing-path';

/** The body follows a path (a course's walk path, or straight ahead along +Z). */
export const DRIVE_PATH = 0;
/** The body follows a desired velocity and turn rate, within the walk's limits. */
export const DRIVE_VELOCITY = 1;
/** The body is where the game put it (position and heading given each step). */
export const DRIVE_POSE = 2;

/** How the body moves, and what the foot planner predicts from. */
export interface BodyMotion {
  mode: number;
  /** Path mode: the sampled path (null: straight ahead along +Z at x = 0), distance along it, and speed along it, m and m/s. */
  readonly track: PathTrack | null;
  s: number;
  pathSpeed: number;
  /** Gait velocity in world axes (before the terrain pace), m/s; turn rate, rad/s (positive turns +Z toward +X). */
  vx: number;
  vz: number;
  turnRate: number;
  /** Velocity mode: the command; pose mode: the pose for the coming step. */
  wantVx: number;
  wantVz: number;
  wantTurn: number;
  poseX: number;
  poseZ: number;
  poseHeading: number;
}

export interface Walk {
  readonly rig: Rig;
  readonly setup: LegSetup;
  readonly ground: Ground;
  /** The gait as the setup gives it, at its own speed. */
  readonly gait: GaitParams;
  readonly legs: number;
  readonly solvers: IKWorkspace[];
  /** Per leg: 1 = the solve also turns the sole to the ground normal. */
  readonly orient: Uint8Array;
  readonly timeStep: number;
  /** A swing starts from where the foot really is when it is this far off its plant, m. */
  readonly replanDistance: number;
  /** Fixed steps taken. */
  frame: number;
  /** False while the walk places the feet (before the first solve). */
  started: boolean;
  /** Share of the gait speed the body walks at now (pace.ts), through its filter. */
  readonly pace: DampedState;
  readonly paceFilter: CriticalFilter;
  /** Neutral body height above the footholds (walk-height.ts), m. */
  readonly walkHeight: number;
  /** Highest body height that keeps every stance leg inside its reach this frame (body-pose.ts), m. */
  heightCap: number;
  /** Per leg: half the sole's length, for the foothold footprint, m. */
  readonly soleHalf: Float64Array;
  /** Per leg: the joint speed limit as a largest change per frame, rad; and the scratch pose it is applied in. */
  readonly maxJointStep: Float64Array;
  readonly limitedPose: Float64Array[];
  /** Share of the way back to rest a lost leg moves per frame. */
  readonly recoverRate: number;
  /** Per leg: the tightest fold it reaches, as a share of its reach (reach.ts). */
  readonly foldLimit: Float64Array;
  /** Per leg: the knee's DOF index (−1: none), and its straight value and bending sign (2 per leg). */
  readonly kneeDof: Int32Array;
  readonly kneeStraight: Float64Array;
  /** Per leg: 1 = this swing met a straight knee, and the knee is preshaped until touchdown. */
  readonly kneeShaping: Uint8Array;
  /** Per leg: 1 = the leg ends in a knee and an ankle (universal or ball): its knee is preshaped through every swing. */
  readonly ankleFoot: Uint8Array;
  /** Farthest neutral foot spot from the body's centre, m (how fast a turn moves the feet). */
  readonly turnRadius: number;

  // Gait clock: cycles = clockCycles + (frame − clockFrame)·timeStep / cycleTime.
  /** Cycle time and stride now: they follow the speed (walk-speed.ts), s and m. */
  cycleTime: number;
  stride: number;
  clockCycles: number;
  clockFrame: number;
  /** The walk is coming to a stop: legs whose foot is already where a step would put it stay planted. */
  stopping: boolean;

  // Per leg state (index = leg).
  /** Gait phase this frame: 0 at touchdown, dutyFactor at liftoff. */
  readonly phase: Float64Array;
  readonly stance: Uint8Array;
  /** 1 = planted at rest: stays in stance whatever the clock says, until the walk goes on. */
  readonly resting: Uint8Array;
  /** Planted foot (stance target) and the ground normal there: 3 per leg. */
  readonly plant: Float64Array;
  readonly plantNormal: Float64Array;
  /** Last planted height of each leg: what the body follows. */
  readonly support: Float64Array;
  readonly swings: SwingPlan[];
  /** Normals at liftoff and at the coming touchdown: 3 per leg. */
  readonly liftNormal: Float64Array;
  readonly landNormal: Float64Array;
  /** Current target and target normal, actual foot (after the solve): 3 per leg. */
  readonly target: Float64Array;
  readonly targetNormal: Float64Array;
  /** Views of leg i's target and target normal (made once: subarray allocates). */
  readonly targetOf: Float64Array[];
  readonly targetNormalOf: Float64Array[];
  readonly foot: Float64Array;
  /** Poses of the last two frames (joint speed, extrapolated warm start). */
  readonly prevPose: Float64Array[];
  readonly olderPose: Float64Array[];
  /** Per leg: 1 = extrapolated warm start. */
  readonly extrapolate: Uint8Array;
  /** Per leg this frame: fastest joint, °/s; solver iterations; |aim − foot| after the motion limits, m. */
  readonly jointSpeed: Float64Array;
  readonly iterations: Int32Array;
  readonly error: Float64Array;
  /** Per leg this frame: the solver's own final error, m, and 1 if it converged. */
  readonly solveError: Float64Array;
  readonly converged: Uint8Array;

  // Body.
  readonly bodyPos: Float64Array;
  readonly bodyRot: Float64Array;
  /** Rad about +Y; 0 faces +Z. */
  heading: number;
  readonly height: DampedState;
  readonly pitch: DampedState;
  readonly roll: DampedState;
  /** Body height the chosen footholds ask for once every swinging foot has landed. */
  heightTarget: number;
  /** This frame's body height target (what the filter followed). */
  heightGoal: number;
  /** A touchdown or a liftoff happened this frame (heightTarget was recomputed). */
  supportChanged: boolean;
  readonly filter: CriticalFilter;
  readonly motion: BodyMotion;
}
