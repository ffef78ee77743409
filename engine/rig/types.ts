/**
 * Rig model: skeletons and leg chains.
 *
 * Conventions (shared with glTF and three.js): metres, right-handed, +Y up,
 * quaternions stored as [x, y, z, w], matrices column-major.
 */

import type { DofKind } from './dof-kinds';

export type Vec3Like = readonly [number, number, number] | ArrayLike<number>;
export type QuatLike = readonly [number, number, number, number] | ArrayLike<number>;

/** A joint of a full skeleton (as imported from glTF). */
export interface SkeletonJoint {
  name: string;
  /** Index of the parent joint in Skeleton.joints, or -1 for a root. */
  parent: number;
  /** Rest (bind) local transform relative to the parent. */
  translation: [number, number, number];
  rotation: [number, number, number, number];
  scale: [number, number, number];
}

export interface Skeleton {
  joints: SkeletonJoint[];
}

/** Kinds of leg joint and their DOF counts live in dof-kinds.ts. */
export { DOF_COUNT, type DofKind } from './dof-kinds';

/** A closed range for one DOF: radians for rotations, metres for sliders. */
export interface DofLimit {
  min: number;
  max: number;
}

/**
 * Ball joint limit: a swing cone around `twistAxis` (the bone direction in the
 * joint's rest frame) with half-angle `swing` (radians), plus a twist range
 * around that same axis.
 */
export interface BallLimit {
  twistAxis: [number, number, number];
  swing: number;
  twistMin: number;
  twistMax: number;
}

/**
 * One joint of a leg chain.
 *
 * World transform of joint j:
 *   W_j = W_parent · T(offset) · R(rest) · D_j
 * where W_parent is the previous chain joint (or the chain root, i.e. the hip
 * socket frame given every frame by the body), and D_j is the DOF motion:
 *  - hinge:     R(axes[0], q0)
 *  - universal: R(axes[0], q0) · R(axes[1], q1)   (axes in the joint rest frame)
 *  - ball:      R(quat) with quat updated by small rotation vectors; the three
 *               Jacobian columns are the rest frame's x, y, z axes.
 *  - slider:    T(axes[0] · q0)
 */
export interface ChainJoint {
  name: string;
  kind: DofKind;
  /** Translation from the parent chain joint (or root) in the parent frame, metres. */
  offset: [number, number, number];
  /** Rest rotation relative to the parent frame, [x, y, z, w]. */
  rest: [number, number, number, number];
  /** Unit axes in the joint's rest frame: hinge/slider 1, universal 2, ball 0 (ignored). */
  axes: [number, number, number][];
  /** Per-DOF limits (hinge/universal/slider); for a ball, use `ball`. Omitted = free. */
  limits?: DofLimit[];
  /** Ball joint limit (swing cone + twist). Omitted = free. */
  ball?: BallLimit;
  /** Per-DOF weights (mobility; 0 locks a DOF). Omitted = 1 each. */
  weights?: number[];
  /** Rest DOF values (hinge/universal/slider); ball rest is the identity rotation. Omitted = 0. */
  restValues?: number[];
  /** Index of the matching joint in a Skeleton, when the chain came from one. */
  skeletonJoint?: number;
}

/** Optional toe: a point beyond the sole used by the gait planner (toe-off, clearance). */
export interface ToeSpec {
  /** Toe tip in the last joint's frame, metres. */
  offset: [number, number, number];
}

export interface LegChain {
  name: string;
  /** Preset or source kind, e.g. 'human', 'digitigrade', 'insect', 'piston', 'custom'. */
  kind: string;
  /** Ordered joints hip → foot. */
  joints: ChainJoint[];
  /** End effector: the sole point, in the last joint's frame. */
  sole: [number, number, number];
  /** The sole's up direction in the last joint's frame (aligned to the ground normal). */
  soleNormal: [number, number, number];
  toe?: ToeSpec;
  /** Index (into joints) of the joint whose position the pole / knee-direction bias acts on. */
  knee?: number;
  /** Default knee direction in the root (hip) frame: where the knee should point. */
  kneeDirection?: [number, number, number];
  /** Sum of segment lengths, metres (reach from the first joint with everything straight). */
  reach: number;
}
