/**
 * A leg's pose: the DOF values in ws.pose and, for ball joints, the
 * quaternions in ws.quat (the truth; their pose entries are rotation vectors,
 * refreshed by syncBallPose).
 */
import * as Q from '../math/quat';
import { DOF_BALL as DOF_BALL_ } from './layout';
import { clampBall } from './limits';
import type { IKWorkspace } from './workspace';

const DOF_BALL = DOF_BALL_;
const fromRotationVector = Q.fromRotationVector;
const toRotationVector = Q.toRotationVector;

// Scratch for the (x, y, z) entry point: one exp map for both forms, no allocation.
const ROTATION_VECTOR = new Float64Array(3);

/** Rotation vector (x, y, z) → unit quaternion at q[o..o+3] (exact exp map; quat.fromRotationVector reads it from an array). */
export function expRotationVector(x: number, y: number, z: number, q: Float64Array, o: number): void {
  ROTATION_VECTOR[0] = x;
  ROTATION_VECTOR[1] = y;
  ROTATION_VECTOR[2] = z;
  fromRotationVector(q, o, ROTATION_VECTOR, 0);
}

/** Unit quaternion at q[qo..qo+3] → rotation vector at out[o..o+2] (log map, shortest rotation; quat.toRotationVector with the output first). */
export function logQuaternion(q: ArrayLike<number>, qo: number, out: Float64Array, o: number): void {
  toRotationVector(out, o, q, qo);
}

/** Set the pose to the chain's rest pose (ball joints to identity). */
export function resetPose(ws: IKWorkspace): void {
  ws.pose.set(ws.restPose);
  for (let b = 0; b < ws.nBall; b++) {
    ws.quat[4 * b] = 0;
    ws.quat[4 * b + 1] = 0;
    ws.quat[4 * b + 2] = 0;
    ws.quat[4 * b + 3] = 1;
  }
}

/** Copy ball quaternions into the pose as rotation vectors. */
export function syncBallPose(ws: IKWorkspace): void {
  for (let j = 0; j < ws.nJoints; j++) {
    const b = ws.jBall[j];
    if (b >= 0) toRotationVector(ws.pose, ws.jDof0[j], ws.quat, 4 * b);
  }
}

/**
 * Set the pose from DOF values (ball entries are rotation vectors in the
 * joint's rest frame). Scalar DOFs are clamped to their limits and balls to
 * their cone/twist; returns the number of values that had to be clamped.
 */
export function setPose(ws: IKWorkspace, pose: ArrayLike<number>, clamp = true): number {
  if (pose.length !== ws.nDof) throw new Error(`pose: expected ${ws.nDof} values, got ${pose.length}`);
  let hits = 0;
  for (let i = 0; i < ws.nDof; i++) {
    let v = pose[i];
    if (clamp && ws.dKind[i] !== DOF_BALL) {
      if (v < ws.lo[i]) {
        v = ws.lo[i];
        hits++;
      } else if (v > ws.hi[i]) {
        v = ws.hi[i];
        hits++;
      }
    }
    ws.pose[i] = v;
  }
  for (let j = 0; j < ws.nJoints; j++) {
    const b = ws.jBall[j];
    if (b < 0) continue;
    const d = ws.jDof0[j];
    expRotationVector(pose[d], pose[d + 1], pose[d + 2], ws.quat, 4 * b);
    if (clamp && clampBall(ws, b)) hits++;
    toRotationVector(ws.pose, d, ws.quat, 4 * b);
  }
  return hits;
}

/** Copy of the current pose (ball entries as rotation vectors). */
export function getPose(ws: IKWorkspace, out: Float64Array = new Float64Array(ws.nDof)): Float64Array {
  syncBallPose(ws);
  out.set(ws.pose);
  return out;
}

/** Set a ball joint's quaternion directly ([x, y, z, w], relative to its rest frame). */
export function setBallQuaternion(ws: IKWorkspace, joint: number, q: ArrayLike<number>): void {
  const b = ws.jBall[joint];
  if (b < 0) throw new Error(`joint ${joint} is not a ball joint`);
  const n = Math.hypot(q[0], q[1], q[2], q[3]) || 1;
  for (let i = 0; i < 4; i++) ws.quat[4 * b + i] = q[i] / n;
  toRotationVector(ws.pose, ws.jDof0[joint], ws.quat, 4 * b);
}
