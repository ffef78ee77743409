/**
 * Joint limits: scalar DOFs between lo and hi; ball joints inside a swing
 * cone about their twist axis and a twist range (swing–twist decomposition).
 */
import * as Q from '../math/quat';
import { DOF_BALL as DOF_BALL_ } from './layout';
import type { IKWorkspace } from './workspace';

const DOF_BALL = DOF_BALL_;
const multiply = Q.multiply;

/** Below this |q| of the twist part, the twist is taken as 0 (a swing of π: the twist is undefined). */
const TWIST_UNDEFINED_BELOW = 1e-12;

// Swing and twist parts while a ball is clamped ([x, y, z, w] each).
const SWING = new Float64Array(4);
const TWIST = new Float64Array(4);
const QUAT = new Float64Array(4);

/**
 * Clamp ball b's quaternion to its swing cone and twist range (swing–twist
 * decomposition about the twist axis). Returns true if it was changed.
 */
export function clampBall(ws: IKWorkspace, b: number): boolean {
  if (!ws.bLimited[b]) return false;
  const q = ws.quat;
  const o = 4 * b;
  let x = q[o];
  let y = q[o + 1];
  let z = q[o + 2];
  let w = q[o + 3];
  const ax = ws.bAxis[3 * b];
  const ay = ws.bAxis[3 * b + 1];
  const az = ws.bAxis[3 * b + 2];
  let t = x * ax + y * ay + z * az;
  if (w < 0 || (w === 0 && t < 0)) {
    x = -x;
    y = -y;
    z = -z;
    w = -w;
    t = -t;
  }
  const nt2 = t * t + w * w; // = (swing's w)² = cos²(swing/2)
  const ch = ws.bCosHalfSwing[b];
  const tmin = ws.bTwistMin[b];
  const tmax = ws.bTwistMax[b];
  const swingOk = ch <= 0 || nt2 >= ch * ch;
  // twist/2 = atan2(t, w) ∈ [−π/2, π/2] (w ≥ 0). In range without an atan2:
  // twist ≤ tmax ⟺ sin(twist/2 − tmax/2) ≤ 0 ⟺ t·cos(tmax/2) − w·sin(tmax/2) ≤ 0.
  const twistOk =
    t * ws.bCosHalfTwistMax[b] - w * ws.bSinHalfTwistMax[b] <= 0 &&
    t * ws.bCosHalfTwistMin[b] - w * ws.bSinHalfTwistMin[b] >= 0;
  if (swingOk && twistOk) return false;
  const nt = Math.sqrt(nt2);
  const defined = nt > TWIST_UNDEFINED_BELOW;
  const twist = defined ? 2 * Math.atan2(t, w) : 0;
  // The conjugate of the twist tw = (a·t, w)/nt, so that swing = q ⊗ conj(tw).
  const tw = defined ? w / nt : 1;
  TWIST[0] = defined ? -((ax * t) / nt) : -0;
  TWIST[1] = defined ? -((ay * t) / nt) : -0;
  TWIST[2] = defined ? -((az * t) / nt) : -0;
  TWIST[3] = tw;
  QUAT[0] = x;
  QUAT[1] = y;
  QUAT[2] = z;
  QUAT[3] = w;
  multiply(SWING, 0, QUAT, 0, TWIST, 0);
  if (!swingOk) {
    const sx = SWING[0];
    const sy = SWING[1];
    const sz = SWING[2];
    const sn = Math.sqrt(sx * sx + sy * sy + sz * sz);
    const h = ws.bSwing[b] / 2;
    const k = sn > 1e-15 ? Math.sin(h) / sn : 0;
    SWING[0] = sx * k;
    SWING[1] = sy * k;
    SWING[2] = sz * k;
    SWING[3] = Math.cos(h);
  }
  if (twistOk) {
    TWIST[0] = -TWIST[0];
    TWIST[1] = -TWIST[1];
    TWIST[2] = -TWIST[2];
  } else {
    const tc = (twist < tmin ? tmin : tmax) / 2;
    const s = Math.sin(tc);
    TWIST[0] = ax * s;
    TWIST[1] = ay * s;
    TWIST[2] = az * s;
    TWIST[3] = Math.cos(tc);
  }
  // q = swing ⊗ twist
  multiply(q, o, SWING, 0, TWIST, 0);
  return true;
}

/** Does pose + dq leave the limits on some scalar DOF not locked in ws.locked? */
export function stepLeavesLimits(ws: IKWorkspace): boolean {
  const n = ws.nDof;
  for (let i = 0; i < n; i++) {
    if (ws.locked[i] || ws.dKind[i] === DOF_BALL) continue;
    const v = ws.pose[i] + ws.dq[i];
    if (v < ws.lo[i] || v > ws.hi[i]) return true;
  }
  return false;
}
