/** The state of a running trial: everything the loop reads and writes, allocated once. */
import type { Heightfield } from '../course/heightfield';
import type { IKWorkspace } from '../ik/workspace';
import type { ResponseSummary, ResponseWindow } from '../metrics/response-window';
import type { StumbleDetector } from '../metrics/stumble-detector';
import type { TrialMetrics } from '../metrics/trial-metrics';
import type { CriticalFilter, DampedState } from './body-filter';
import type { GaitParams } from './gait-params';
import type { LegSetup } from './leg-setup';
import type { Rig } from './rig';
import type { TrialSeries } from './series';
import type { SwingPlan } from './swing-path';
import type { TrialOptions } from './trial-options';

export interface TrialResult {
  rig: string;
  legNames: string[];
  gait: GaitParams;
  metrics: TrialMetrics;
  series: TrialSeries;
}

export interface Trial {
  readonly rig: Rig;
  readonly setup: LegSetup;
  readonly course: Heightfield;
  readonly options: TrialOptions;
  readonly gait: GaitParams;
  readonly legs: number;
  readonly solvers: IKWorkspace[];
  /** Per leg: 1 = the solve also turns the sole to the ground normal. */
  readonly orient: Uint8Array;
  /** Frames to run and frames run so far. */
  readonly totalFrames: number;
  frame: number;
  readonly startZ: number;
  /** The walk ends when the body reaches this far along it, m. */
  readonly lastBodyZ: number;
  /** Share of the gait speed the body walks at now (pace.ts), through its filter. */
  readonly pace: DampedState;
  readonly paceFilter: CriticalFilter;
  /** False while createTrial places the feet (before the first solve). */
  started: boolean;
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

  // Per leg state (index = leg).
  /** Gait phase this frame: 0 at touchdown, dutyFactor at liftoff. */
  readonly phase: Float64Array;
  readonly stance: Uint8Array;
  /** Planted foot (stance target) and the ground normal there: 3 per leg. */
  readonly plant: Float64Array;
  readonly plantNormal: Float64Array;
  /** Last planted height of each leg: what the body follows. */
  readonly support: Float64Array;
  readonly swings: SwingPlan[];
  /** Normals at liftoff and at the coming touchdown: 3 per leg. */
  readonly liftNormal: Float64Array;
  readonly landNormal: Float64Array;
  /** Current target and target normal, actual foot: 3 per leg. */
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
  readonly jointSpeed: Float64Array;
  readonly iterations: Int32Array;
  readonly error: Float64Array;

  // Body.
  readonly bodyPos: Float64Array;
  readonly bodyRot: Float64Array;
  readonly height: DampedState;
  readonly pitch: DampedState;
  readonly roll: DampedState;
  /** Body height the chosen footholds ask for once every swinging foot has landed (step-up windows). */
  heightTarget: number;
  readonly filter: CriticalFilter;

  // Metrics.
  readonly detector: StumbleDetector;
  readonly touchdownWindows: ResponseWindow[];
  readonly touchdownSummary: ResponseSummary;
  readonly bodyWindow: ResponseWindow;
  readonly bodySummary: ResponseSummary;
  /** Ground height under each sole this frame. */
  readonly ground: Float64Array;
  /** Sum of squared tracking errors and the largest error (a typed array: no boxed doubles per frame). */
  readonly tracking: Float64Array;
  trackCount: number;
  solves: number;
  iterationSum: number;
  frameIterationsMax: number;
  /** Sum and largest of the solvers' final position errors. */
  readonly solverError: Float64Array;
  unconverged: number;

  readonly series: TrialSeries;
}
