/**
 * The null-space bias (a secondary task): a joint velocity z that the solver
 * projects onto the null space of J, so it moves the leg without moving the
 * foot. Jacobian methods only (not CCD).
 */
import * as Q from '../math/quat';
import { DOF_BALL as DOF_BALL_, DOF_SLIDE as DOF_SLIDE_ } from './layout';
import type { IKWorkspace } from './workspace';

const toRotationVector = Q.toRotationVector;
const DOF_BALL = DOF_BALL_;
const DOF_SLIDE = DOF_SLIDE_;

/** Below this hip→foot length (m) the knee's pull is not made sideways (no line to be sideways to). */
const NO_HIP_FOOT_LINE_BELOW = 1e-12;

/** The bias z into ws.z, scaled by the weights w; false when the options ask for none. */
export function nullSpaceBias(ws: IKWorkspace, w: Float64Array): boolean {
  const ns = ws.options.nullSpace;
  if (!ns || ns.kind === 'none') return false;
  const n = ws.nDof;
  const z = ws.z;
  if (ns.kind === 'rest') {
    const g = ns.gain;
    for (let i = 0; i < n; i++) z[i] = ws.dKind[i] === DOF_BALL ? 0 : g * w[i] * (ws.restPose[i] - ws.pose[i]);
    for (let j = 0; j < ws.nJoints; j++) {
      const b = ws.jBall[j];
      if (b < 0) continue;
      const d = ws.jDof0[j];
      toRotationVector(ws.tmpN, d, ws.quat, 4 * b);
      for (let k = 0; k < 3; k++) z[d + k] = -g * w[d + k] * ws.tmpN[d + k];
    }
    return true;
  }
  // Pole: move the knee toward the pole, sideways to the hip→foot line.
  const k = Math.min(Math.max(ws.knee, 0), ws.nJoints - 1);
  const kx = ws.jPos[3 * k];
  const ky = ws.jPos[3 * k + 1];
  const kz = ws.jPos[3 * k + 2];
  let dx = ns.pole[0] - kx;
  let dy = ns.pole[1] - ky;
  let dz = ns.pole[2] - kz;
  let ux = ws.foot[0] - ws.jPos[0];
  let uy = ws.foot[1] - ws.jPos[1];
  let uz = ws.foot[2] - ws.jPos[2];
  const ul = Math.sqrt(ux * ux + uy * uy + uz * uz);
  if (ul > NO_HIP_FOOT_LINE_BELOW) {
    ux /= ul;
    uy /= ul;
    uz /= ul;
    const p = dx * ux + dy * uy + dz * uz;
    dx -= p * ux;
    dy -= p * uy;
    dz -= p * uz;
  }
  const g = ns.gain;
  for (let i = 0; i < n; i++) {
    if (ws.dJoint[i] >= k) {
      z[i] = 0;
      continue;
    }
    const ax = ws.dAxisW[3 * i];
    const ay = ws.dAxisW[3 * i + 1];
    const az = ws.dAxisW[3 * i + 2];
    let cx: number, cy: number, cz: number;
    if (ws.dKind[i] === DOF_SLIDE) {
      cx = ax;
      cy = ay;
      cz = az;
    } else {
      const pj = 3 * ws.dJoint[i];
      const rx = kx - ws.jPos[pj];
      const ry = ky - ws.jPos[pj + 1];
      const rz = kz - ws.jPos[pj + 2];
      cx = ay * rz - az * ry;
      cy = az * rx - ax * rz;
      cz = ax * ry - ay * rx;
    }
    z[i] = g * w[i] * (cx * dx + cy * dy + cz * dz);
  }
  return true;
}
