/**
 * Codes of the workspace's flattened chain (Int32Array entries): what a joint
 * is, how a DOF moves, and which way a DOF's axis points. Hot modules copy
 * them into local consts (a transpiled import is a getter call on each use).
 */

/** Joint kinds (ws.jKind). */
export const JOINT_HINGE = 0;
export const JOINT_UNIVERSAL = 1;
export const JOINT_BALL = 2;
export const JOINT_SLIDER = 3;

/** DOF motion kinds (ws.dKind). */
/** A hinge, or one axis of a universal joint: an angle, rad. */
export const DOF_ROT = 0;
/** One of the three rotation-vector components of a ball joint (the quaternion in ws.quat is the truth). */
export const DOF_BALL = 1;
/** A slider: a translation along its axis, m. */
export const DOF_SLIDE = 2;

/** DOF axis codes (ws.dAxisCode): +X, +Y, +Z are 0, 1, 2; the same axes negative are 3, 4, 5. */
export const AXIS_NEGATIVE = 3;
/** An axis along no coordinate axis (rotated by the general Rodrigues formula). */
export const AXIS_GENERAL = 6;

/**
 * Slots of ws.scalars: doubles handed between hot functions through a typed
 * array, since a double passed to or returned from a call that is not inlined
 * is boxed (a heap allocation per call).
 */
/** λ² of the next DLS step. */
export const S_LAMBDA2 = 0;
/** Angle between the sole normal and the target normal after the last task error, rad. */
export const S_ANGLE = 1;
/** Largest DOF change of the last iteration. */
export const S_CHANGE = 2;
/** Squared position error after the last task error, m². */
export const S_POSITION_ERROR2 = 3;
/** A CCD move of one DOF (rad or m). */
export const S_MOVE = 4;
/** Scale of the null-space bias in this solve (halved by every step that hits a limit). */
export const S_BIAS_SCALE = 7;
