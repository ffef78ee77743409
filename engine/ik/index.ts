/**
 * Leg IK engine: per-leg workspaces, forward kinematics, Jacobians and the
 * solvers ('dls', 'sdls', 'transpose', 'pseudoinverse', 'adaptive', 'ccd').
 *
 * Per leg per frame:
 *   setRootTransform(ws, hipPos, hipQuat);   // the body moved
 *   const r = solve(ws, footTarget, groundNormal); // warm-started from the last pose
 *   footPosition(ws, out); r.pose; r.iterations; r.positionError; r.limitHits
 */
import type { IKWorkspace } from './workspace';

export type { IKWorkspace } from './workspace';
export type { SolverOptions, SolveResult, SolverMethod, AdaptiveMode, NullSpaceBias } from './types';
export { SOLVER_METHODS } from './types';
export {
  DEFAULT_OPTIONS,
  createWorkspace,
  setOptions,
  setRootTransform,
  setRootMatrix,
  resetPose,
  setPose,
  getPose,
  setBallQuaternion,
  dofCount,
  expRotationVector,
  logQuaternion,
} from './workspace';
export {
  forwardKinematics,
  jacobian,
  finiteDifferenceJacobian,
  jointPosition,
  jointWorldMatrix,
  footRotation,
  toePosition,
} from './kinematics';
export { solve } from './solve';
export { dlsStep, transposeStep, pseudoinverseStep, sdlsStep, manipulability } from './steps';

import { createWorkspace } from './workspace';
/** Alias of createWorkspace: a per-leg solver state with preallocated buffers. */
export const createLegSolver = createWorkspace;

/** Sole (end effector) world position after the last FK / solve. */
export function footPosition(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(3)) {
  out[0] = ws.foot[0];
  out[1] = ws.foot[1];
  out[2] = ws.foot[2];
  return out;
}

/** Sole normal (world) after the last FK / solve. */
export function footNormal(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(3)) {
  out[0] = ws.footUp[0];
  out[1] = ws.footUp[1];
  out[2] = ws.footUp[2];
  return out;
}
