/**
 * The solver's options: every one, its meaning and its default, in this one
 * file. A leg setup stores a subset of them (engine/gait/leg-setup.ts keys its
 * table by this interface, so the type checker finds any option it forgets).
 */

export type SolverMethod = 'transpose' | 'pseudoinverse' | 'dls' | 'sdls' | 'adaptive' | 'ccd';

export const SOLVER_METHODS: readonly SolverMethod[] = ['dls', 'sdls', 'transpose', 'pseudoinverse', 'adaptive', 'ccd'];

/**
 * 'manipulability': λ² = λ0²·(1 − w/w0)² when w = √det(JJᵀ) < w0, else 0
 *   (Nakamura & Hanafusa 1986).
 * 'error': Levenberg–Marquardt with λ² = E + w̄, E = ½·|e|² the error energy
 *   (Sugihara 2011).
 */
export type AdaptiveMode = 'manipulability' | 'error';

/** Null-space bias (secondary task), applied by the Jacobian methods (not CCD). */
export type NullSpaceBias =
  | { kind: 'none' }
  /** Pull every DOF toward its rest value with gain `gain` (per iteration, 0..1). */
  | { kind: 'rest'; gain: number }
  /**
   * Pull the knee joint (chain.knee) toward a pole point given in world
   * coordinates, with gain `gain` (metres of knee motion asked per iteration per metre of miss).
   */
  | { kind: 'pole'; gain: number; pole: [number, number, number] };

export interface SolverOptions {
  method: SolverMethod;
  /** Cap on solver iterations (steps). */
  maxIterations: number;
  /** Position tolerance, metres (default 0.5 mm, half the benchmark's 1 mm success criterion): converged when |foot − target| ≤ tolerance (and orientation within its tolerance). */
  tolerance: number;
  /** Orientation tolerance, radians (used only with an orientation target). */
  orientationTolerance: number;
  /** Largest change of any rotational DOF in one iteration, radians (the whole step is scaled down). */
  maxStepAngle: number;
  /** Largest change of any slider DOF in one iteration, metres. */
  maxStepLength: number;
  /**
   * Target clamp (Buss 2004; Buss & Kim 2005): the position error used for a
   * step is clamped to this length, metres. 0 = auto (a tenth of the chain's
   * reach); Infinity = off.
   */
  clampDistance: number;
  /** Orientation rows weight, metres per radian. */
  orientationWeight: number;
  /** DLS damping λ (metres). Also the base λ0 for adaptive 'manipulability'. */
  lambda: number;
  /** Pseudoinverse: singular values below this are dropped. */
  svdThreshold: number;
  /** SDLS γmax, radians (Buss & Kim 2005 use π/4). */
  gammaMax: number;
  adaptiveMode: AdaptiveMode;
  /** Adaptive 'manipulability': threshold w0 on √det(JJᵀ) (units m^m). */
  manipulabilityThreshold: number;
  /** Adaptive 'error': the bias w̄ added to E (metres²). */
  lmBias: number;
  /** Per-DOF weights (length = chain DOF count); overrides the chain's joint weights. null = use the chain's. */
  weights: Float64Array | number[] | null;
  nullSpace: NullSpaceBias;
  /** Stop when the largest DOF change of an iteration is below this (stalled, e.g. out of reach). */
  minStep: number;
  /** Re-solve without saturated DOFs when a step hits joint limits. */
  resolveSaturated: boolean;
  /** Record the error after each iteration into result.errorHistory. */
  recordErrors: boolean;
  /**
   * The pose a solve starts from: 'current' = the workspace's pose (the last
   * solve's result: a warm start), 'rest' = the chain's rest pose, or explicit
   * DOF values (ball entries as rotation vectors). Not the leg setup's
   * `warmStart`, which is how a walk guesses each frame's start ahead of the solve.
   */
  startPose: 'current' | 'rest' | ArrayLike<number>;
}

/** Default target clamp as a fraction of the chain's reach (clampDistance = 0). */
export const CLAMP_REACH_FRACTION = 0.1;

export const DEFAULT_OPTIONS: SolverOptions = {
  method: 'dls',
  maxIterations: 32,
  tolerance: 5e-4,
  orientationTolerance: 1e-3,
  maxStepAngle: 0.6,
  maxStepLength: 0.1,
  clampDistance: 0,
  orientationWeight: 0.1,
  lambda: 0.05,
  svdThreshold: 1e-4,
  gammaMax: Math.PI / 4,
  adaptiveMode: 'error',
  manipulabilityThreshold: 1e-2,
  lmBias: 1e-4,
  weights: null,
  nullSpace: { kind: 'none' },
  minStep: 1e-9,
  resolveSaturated: true,
  recordErrors: false,
  startPose: 'current',
};
