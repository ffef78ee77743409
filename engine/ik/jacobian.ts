/**
 * Jacobians of the sole with respect to the DOFs, at the current forward
 * kinematics: the analytic geometric one the solvers use, and a finite
 * difference one to check it against.
 */
import * as Q from '../math/quat';
import { forwardKinematics } from './kinematics';
import { DOF_BALL as DOF_BALL_, DOF_SLIDE as DOF_SLIDE_ } from './layout';
import { expRotationVector } from './pose';
import type { IKWorkspace } from './workspace';

const DOF_BALL = DOF_BALL_;
const DOF_SLIDE = DOF_SLIDE_;

/**
 * Analytic geometric Jacobian at the current FK (call forwardKinematics first).
 * Column i (stride 6 in `out`): rotation DOF → [ω × (p_sole − p_pivot); w_o·ω],
 * slider → [axis; 0]. `rows` 3 (position) or 6 (position + orientation, the
 * orientation rows scaled by `orientationWeight`, metres per radian).
 */
export function jacobian(
  ws: IKWorkspace,
  rows: 3 | 6 = 3,
  out: Float64Array = ws.J,
  orientationWeight = ws.options.orientationWeight,
): Float64Array {
  const n = ws.nDof;
  const fx = ws.foot[0];
  const fy = ws.foot[1];
  const fz = ws.foot[2];
  const A = ws.dAxisW;
  const P = ws.jPos;
  const DJ = ws.dJoint;
  const K = ws.dKind;
  for (let i = 0; i < n; i++) {
    const ax = A[3 * i];
    const ay = A[3 * i + 1];
    const az = A[3 * i + 2];
    const c = 6 * i;
    if (K[i] === DOF_SLIDE) {
      out[c] = ax;
      out[c + 1] = ay;
      out[c + 2] = az;
      if (rows === 6) {
        out[c + 3] = 0;
        out[c + 4] = 0;
        out[c + 5] = 0;
      }
    } else {
      const pj = 3 * DJ[i];
      const rx = fx - P[pj];
      const ry = fy - P[pj + 1];
      const rz = fz - P[pj + 2];
      out[c] = ay * rz - az * ry;
      out[c + 1] = az * rx - ax * rz;
      out[c + 2] = ax * ry - ay * rx;
      if (rows === 6) {
        out[c + 3] = orientationWeight * ax;
        out[c + 4] = orientationWeight * ay;
        out[c + 5] = orientationWeight * az;
      }
    }
  }
  return out;
}

/**
 * Finite-difference Jacobian (central differences, step h), for checking the
 * analytic one. Same layout as `jacobian`. Ball columns perturb the quaternion
 * by exp(±h·e_k) pre-multiplied in the rest frame, matching the solver's
 * update. Orientation rows: the change of the sole frame as a rotation vector.
 * Restores the pose and the FK afterwards. Allocates (checking only).
 */
export function finiteDifferenceJacobian(
  ws: IKWorkspace,
  rows: 3 | 6 = 3,
  h = 1e-6,
  out: Float64Array = new Float64Array(6 * ws.nDof),
  orientationWeight = ws.options.orientationWeight,
): Float64Array {
  const n = ws.nDof;
  const pose0 = Float64Array.from(ws.pose);
  const quat0 = Float64Array.from(ws.quat);
  const footP = new Float64Array(3);
  const footM = new Float64Array(3);
  const rotP = new Float64Array(9);
  const rotM = new Float64Array(9);
  const last = 9 * (ws.nJoints - 1);
  const dq = new Float64Array(4);
  const perturb = (i: number, s: number): void => {
    ws.pose.set(pose0);
    ws.quat.set(quat0);
    if (ws.dKind[i] === DOF_BALL) {
      const j = ws.dJoint[i];
      const k = i - ws.jDof0[j];
      const b = ws.jBall[j];
      expRotationVector(k === 0 ? s : 0, k === 1 ? s : 0, k === 2 ? s : 0, dq, 0);
      Q.premultiplyUnit(ws.quat, 4 * b, dq, 0);
    } else {
      ws.pose[i] += s;
    }
    forwardKinematics(ws);
  };
  for (let i = 0; i < n; i++) {
    perturb(i, h);
    footP.set(ws.foot);
    rotP.set(ws.jRot.subarray(last, last + 9));
    perturb(i, -h);
    footM.set(ws.foot);
    rotM.set(ws.jRot.subarray(last, last + 9));
    const c = 6 * i;
    for (let r = 0; r < 3; r++) out[c + r] = (footP[r] - footM[r]) / (2 * h);
    if (rows === 6) {
      // ω ≈ vee(Rp·Rmᵀ) / (2h) for small rotations: Rp·Rmᵀ ≈ I + [2h·ω]×.
      const m = new Float64Array(9);
      for (let r = 0; r < 3; r++)
        for (let q = 0; q < 3; q++) {
          let acc = 0;
          for (let k = 0; k < 3; k++) acc += rotP[r * 3 + k] * rotM[q * 3 + k];
          m[r * 3 + q] = acc;
        }
      out[c + 3] = (orientationWeight * (m[7] - m[5])) / 2 / (2 * h);
      out[c + 4] = (orientationWeight * (m[2] - m[6])) / 2 / (2 * h);
      out[c + 5] = (orientationWeight * (m[3] - m[1])) / 2 / (2 * h);
    }
  }
  ws.pose.set(pose0);
  ws.quat.set(quat0);
  forwardKinematics(ws);
  return out;
}
