/**
 * Leg IK engine: per-leg workspaces, forward kinematics, Jacobians and the
 * solvers ('dls', 'sdls', 'transpose', 'pseudoinverse', 'adaptive', 'ccd').
 *
 * Per leg per frame:
 *   setRootTransform(ws, hipPos, hipQuat);   // the body moved
 *   const r = solve(ws, footTarget, groundNormal); // warm-started from the last pose
 *   footPosition(ws, out); r.pose; r.iterations; r.positionError; r.limitHits
 */
import { vec3 } from 'gl-matrix';
import type { IKWorkspace } from './workspace';

export type { IKWorkspace } from './workspace';
export type { SolverOptions, SolverMethod, AdaptiveMode, NullSpaceBias } from './options';
export type { SolveResult } from './solve';
export { SOLVER_METHODS, DEFAULT_OPTIONS } from './options';
export { createWorkspace, setOptions, setRootTransform, setRootMatrix, dofCount } from './workspace';
export { resetPose, setPose, getPose, setBallQuaternion, expRotationVector, logQuaternion } from './pose';
export { forwardKinematics, jointPosition, jointWorldMatrix, footRotation, toePosition } from './kinematics';
export { jacobian, finiteDifferenceJacobian } from './jacobian';
export { solve } from './solve';
export { dlsStep, transposeStep, pseudoinverseStep, sdlsStep, manipulability } from './steps';

import { createWorkspace } from './workspace';
/** Alias of createWorkspace: a per-leg solver state with preallocated buffers. */
export const createLegSolver = createWorkspace;

/** Sole (end effector) world position after the last FK / solve. */
export function footPosition(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(3)) {
  vec3.copy(out as vec3, ws.foot);
  return out;
}

/** Sole normal (world) after the last FK / solve. */
export function footNormal(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(3)) {
  vec3.copy(out as vec3, ws.footUp);
  return out;
}
