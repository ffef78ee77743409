/**
 * Forward kinematics of a leg chain in a workspace, and what can be read off it.
 *
 * W_j = W_{j−1} · T(offset_j) · R(rest_j) · D_j(q), W_{−1} = root (hip socket).
 * Matrices are row-major 3×3 in Float64Array (R[r*3+c]).
 */
import { vec3 } from 'gl-matrix';
import * as M3 from '../math/mat3';
import * as Q from '../math/quat';
import { JOINT_HINGE as JOINT_HINGE_, JOINT_UNIVERSAL as JOINT_UNIVERSAL_, JOINT_BALL as JOINT_BALL_, JOINT_SLIDER as JOINT_SLIDER_, AXIS_NEGATIVE as AXIS_NEGATIVE_, AXIS_GENERAL as AXIS_GENERAL_ } from './layout';
import type { IKWorkspace } from './workspace';

// Local bindings: transpiled ES module imports become getter calls on every
// access, which costs more than the arithmetic here.
const fromAxisCosSin = M3.fromAxisCosSin;
const quatFromMat3 = Q.fromMat3;
const JOINT_HINGE = JOINT_HINGE_;
const JOINT_UNIVERSAL = JOINT_UNIVERSAL_;
const JOINT_BALL = JOINT_BALL_;
const JOINT_SLIDER = JOINT_SLIDER_;
const AXIS_NEGATIVE = AXIS_NEGATIVE_;
const AXIS_GENERAL = AXIS_GENERAL_;

/** Incremental cos/sin updates before an exact recompute. */
const TRIG_REFRESH = 64;
/** Angle changes below this (rad) advance the cached cos/sin by angle addition. */
const TRIG_SMALL_STEP = 0.05;

/**
 * Forward kinematics from the current pose: joint world frames, per-DOF world
 * axes, the sole point (ws.foot) and sole normal (ws.footUp). A rotational
 * DOF's pivot is its joint's position (ws.jPos).
 * `from` > 0 recomputes only joints from that index on (the earlier ones must be current).
 *
 * Per joint: T(offset), R(rest), each DOF's motion, then the frame is
 * stored. The running frame lives in locals (p, R row-major r00..r22) from
 * joint to joint: split into functions passing it through a typed array,
 * this function measured 1.2–2.3× slower, so its steps are sections here.
 */
export function forwardKinematics(ws: IKWorkspace, from = 0): Float64Array {
  const nJ = ws.nJoints;
  const jPos = ws.jPos;
  const jRot = ws.jRot;
  const pose = ws.pose;
  const quat = ws.quat;
  const dAxis = ws.dAxis;
  const dAxisCode = ws.dAxisCode;
  const dAxisW = ws.dAxisW;
  const jOffset = ws.jOffset;
  const jRest = ws.jRest;
  const jKind = ws.jKind;
  const jDof0 = ws.jDof0;
  const trigAngle = ws.trigAngle;
  const trigCos = ws.trigCos;
  const trigSin = ws.trigSin;
  const trigCount = ws.trigCount;
  const localRot = ws.localRot;
  let px: number, py: number, pz: number;
  let r00: number, r01: number, r02: number, r10: number, r11: number, r12: number, r20: number, r21: number, r22: number;
  if (from === 0) {
    const P = ws.rootPos;
    const Rr = ws.rootRot;
    px = P[0];
    py = P[1];
    pz = P[2];
    r00 = Rr[0];
    r01 = Rr[1];
    r02 = Rr[2];
    r10 = Rr[3];
    r11 = Rr[4];
    r12 = Rr[5];
    r20 = Rr[6];
    r21 = Rr[7];
    r22 = Rr[8];
  } else {
    const q = 3 * (from - 1);
    const o = 9 * (from - 1);
    px = jPos[q];
    py = jPos[q + 1];
    pz = jPos[q + 2];
    r00 = jRot[o];
    r01 = jRot[o + 1];
    r02 = jRot[o + 2];
    r10 = jRot[o + 3];
    r11 = jRot[o + 4];
    r12 = jRot[o + 5];
    r20 = jRot[o + 6];
    r21 = jRot[o + 7];
    r22 = jRot[o + 8];
  }
  for (let j = from; j < nJ; j++) {
    // T(offset): p ← p + R·offset.
    const ox = jOffset[3 * j];
    const oy = jOffset[3 * j + 1];
    const oz = jOffset[3 * j + 2];
    px += r00 * ox + r01 * oy + r02 * oz;
    py += r10 * ox + r11 * oy + r12 * oz;
    pz += r20 * ox + r21 * oy + r22 * oz;
    const o = 9 * j;
    // R(rest): R ← R·rest.
    if (!ws.jRestIdentity[j]) {
      const m00 = jRest[o], m01 = jRest[o + 1], m02 = jRest[o + 2];
      const m10 = jRest[o + 3], m11 = jRest[o + 4], m12 = jRest[o + 5];
      const m20 = jRest[o + 6], m21 = jRest[o + 7], m22 = jRest[o + 8];
      let a0 = r00, a1 = r01, a2 = r02;
      r00 = a0 * m00 + a1 * m10 + a2 * m20;
      r01 = a0 * m01 + a1 * m11 + a2 * m21;
      r02 = a0 * m02 + a1 * m12 + a2 * m22;
      a0 = r10;
      a1 = r11;
      a2 = r12;
      r10 = a0 * m00 + a1 * m10 + a2 * m20;
      r11 = a0 * m01 + a1 * m11 + a2 * m21;
      r12 = a0 * m02 + a1 * m12 + a2 * m22;
      a0 = r20;
      a1 = r21;
      a2 = r22;
      r20 = a0 * m00 + a1 * m10 + a2 * m20;
      r21 = a0 * m01 + a1 * m11 + a2 * m21;
      r22 = a0 * m02 + a1 * m12 + a2 * m22;
    }
    const kind = jKind[j];
    let d = jDof0[j];
    if (kind === JOINT_HINGE || kind === JOINT_UNIVERSAL) {
      const end = d + (kind === JOINT_HINGE ? 1 : 2);
      for (; d < end; d++) {
        // cos/sin cache: exact when the angle jumps, angle addition with a
        // short series when it moves a little (the solver's steps), exact
        // again every TRIG_REFRESH updates so rounding cannot accumulate.
        const th = pose[d];
        let c: number;
        let sn: number;
        const prev = trigAngle[d];
        if (th === prev) {
          c = trigCos[d];
          sn = trigSin[d];
        } else {
          const dd = th - prev;
          const cnt = trigCount[d];
          if (dd > -TRIG_SMALL_STEP && dd < TRIG_SMALL_STEP && cnt < TRIG_REFRESH) {
            const d2 = dd * dd;
            const sd = dd * (1 - d2 * (1 / 6 - d2 * (1 / 120 - d2 * (1 / 5040 - d2 / 362880))));
            const cd = 1 - d2 * (0.5 - d2 * (1 / 24 - d2 * (1 / 720 - d2 * (1 / 40320 - d2 / 3628800))));
            const c0 = trigCos[d];
            const s0 = trigSin[d];
            c = c0 * cd - s0 * sd;
            sn = s0 * cd + c0 * sd;
            trigCount[d] = cnt + 1;
          } else {
            c = Math.cos(th);
            sn = Math.sin(th);
            trigCount[d] = 0;
          }
          trigAngle[d] = th;
          trigCos[d] = c;
          trigSin[d] = sn;
        }
        const code = dAxisCode[d];
        if (code !== AXIS_GENERAL) {
          // Axis-aligned (±X, ±Y, ±Z): the world axis is a column of R; rotate two columns.
          const negative = code >= AXIS_NEGATIVE;
          const sg = negative ? -sn : sn;
          const sgn = negative ? -1 : 1;
          const ax = negative ? code - AXIS_NEGATIVE : code;
          if (ax === 0) {
            dAxisW[3 * d] = sgn * r00;
            dAxisW[3 * d + 1] = sgn * r10;
            dAxisW[3 * d + 2] = sgn * r20;
            let c1 = r01, c2 = r02;
            r01 = c * c1 + sg * c2;
            r02 = c * c2 - sg * c1;
            c1 = r11;
            c2 = r12;
            r11 = c * c1 + sg * c2;
            r12 = c * c2 - sg * c1;
            c1 = r21;
            c2 = r22;
            r21 = c * c1 + sg * c2;
            r22 = c * c2 - sg * c1;
          } else if (ax === 1) {
            dAxisW[3 * d] = sgn * r01;
            dAxisW[3 * d + 1] = sgn * r11;
            dAxisW[3 * d + 2] = sgn * r21;
            let c0 = r00, c2 = r02;
            r00 = c * c0 - sg * c2;
            r02 = sg * c0 + c * c2;
            c0 = r10;
            c2 = r12;
            r10 = c * c0 - sg * c2;
            r12 = sg * c0 + c * c2;
            c0 = r20;
            c2 = r22;
            r20 = c * c0 - sg * c2;
            r22 = sg * c0 + c * c2;
          } else {
            dAxisW[3 * d] = sgn * r02;
            dAxisW[3 * d + 1] = sgn * r12;
            dAxisW[3 * d + 2] = sgn * r22;
            let c0 = r00, c1 = r01;
            r00 = c * c0 + sg * c1;
            r01 = c * c1 - sg * c0;
            c0 = r10;
            c1 = r11;
            r10 = c * c0 + sg * c1;
            r11 = c * c1 - sg * c0;
            c0 = r20;
            c1 = r21;
            r20 = c * c0 + sg * c1;
            r21 = c * c1 - sg * c0;
          }
        } else {
          const ax = dAxis[3 * d];
          const ay = dAxis[3 * d + 1];
          const az = dAxis[3 * d + 2];
          dAxisW[3 * d] = r00 * ax + r01 * ay + r02 * az;
          dAxisW[3 * d + 1] = r10 * ax + r11 * ay + r12 * az;
          dAxisW[3 * d + 2] = r20 * ax + r21 * ay + r22 * az;
          // Rodrigues M = cI + s[a]× + (1−c)aaᵀ, R ← R·M.
          fromAxisCosSin(localRot, 0, dAxis, 3 * d, trigCos, trigSin, d);
          const m00 = localRot[0], m01 = localRot[1], m02 = localRot[2];
          const m10 = localRot[3], m11 = localRot[4], m12 = localRot[5];
          const m20 = localRot[6], m21 = localRot[7], m22 = localRot[8];
          let a0 = r00, a1 = r01, a2 = r02;
          r00 = a0 * m00 + a1 * m10 + a2 * m20;
          r01 = a0 * m01 + a1 * m11 + a2 * m21;
          r02 = a0 * m02 + a1 * m12 + a2 * m22;
          a0 = r10;
          a1 = r11;
          a2 = r12;
          r10 = a0 * m00 + a1 * m10 + a2 * m20;
          r11 = a0 * m01 + a1 * m11 + a2 * m21;
          r12 = a0 * m02 + a1 * m12 + a2 * m22;
          a0 = r20;
          a1 = r21;
          a2 = r22;
          r20 = a0 * m00 + a1 * m10 + a2 * m20;
          r21 = a0 * m01 + a1 * m11 + a2 * m21;
          r22 = a0 * m02 + a1 * m12 + a2 * m22;
        }
      }
    } else if (kind === JOINT_BALL) {
      // Jacobian axes: the rest frame's columns; pivot: the joint.
      dAxisW[3 * d] = r00;
      dAxisW[3 * d + 1] = r10;
      dAxisW[3 * d + 2] = r20;
      dAxisW[3 * d + 3] = r01;
      dAxisW[3 * d + 4] = r11;
      dAxisW[3 * d + 5] = r21;
      dAxisW[3 * d + 6] = r02;
      dAxisW[3 * d + 7] = r12;
      dAxisW[3 * d + 8] = r22;
      // mat3.fromUnitQuat, written out: through memory it cost a ball leg's FK a fifth more.
      const qo = 4 * ws.jBall[j];
      const x = quat[qo];
      const y = quat[qo + 1];
      const z = quat[qo + 2];
      const w = quat[qo + 3];
      const x2 = x + x;
      const y2 = y + y;
      const z2 = z + z;
      const xx = x * x2, yy = y * y2, zz = z * z2;
      const xy = x * y2, xz = x * z2, yz = y * z2;
      const wx = w * x2, wy = w * y2, wz = w * z2;
      const m00 = 1 - yy - zz;
      const m01 = xy - wz;
      const m02 = xz + wy;
      const m10 = xy + wz;
      const m11 = 1 - xx - zz;
      const m12 = yz - wx;
      const m20 = xz - wy;
      const m21 = yz + wx;
      const m22 = 1 - xx - yy;
      let a0 = r00, a1 = r01, a2 = r02;
      r00 = a0 * m00 + a1 * m10 + a2 * m20;
      r01 = a0 * m01 + a1 * m11 + a2 * m21;
      r02 = a0 * m02 + a1 * m12 + a2 * m22;
      a0 = r10;
      a1 = r11;
      a2 = r12;
      r10 = a0 * m00 + a1 * m10 + a2 * m20;
      r11 = a0 * m01 + a1 * m11 + a2 * m21;
      r12 = a0 * m02 + a1 * m12 + a2 * m22;
      a0 = r20;
      a1 = r21;
      a2 = r22;
      r20 = a0 * m00 + a1 * m10 + a2 * m20;
      r21 = a0 * m01 + a1 * m11 + a2 * m21;
      r22 = a0 * m02 + a1 * m12 + a2 * m22;
    } else {
      // Slider: p ← p + q·(R·axis).
      const ax = dAxis[3 * d];
      const ay = dAxis[3 * d + 1];
      const az = dAxis[3 * d + 2];
      const wx = r00 * ax + r01 * ay + r02 * az;
      const wy = r10 * ax + r11 * ay + r12 * az;
      const wz = r20 * ax + r21 * ay + r22 * az;
      dAxisW[3 * d] = wx;
      dAxisW[3 * d + 1] = wy;
      dAxisW[3 * d + 2] = wz;
      const sl = pose[d];
      px += wx * sl;
      py += wy * sl;
      pz += wz * sl;
    }
    // Store the joint's frame.
    jPos[3 * j] = px;
    jPos[3 * j + 1] = py;
    jPos[3 * j + 2] = pz;
    jRot[o] = r00;
    jRot[o + 1] = r01;
    jRot[o + 2] = r02;
    jRot[o + 3] = r10;
    jRot[o + 4] = r11;
    jRot[o + 5] = r12;
    jRot[o + 6] = r20;
    jRot[o + 7] = r21;
    jRot[o + 8] = r22;
  }
  const sx = ws.sole[0];
  const sy = ws.sole[1];
  const sz = ws.sole[2];
  const foot = ws.foot;
  foot[0] = px + r00 * sx + r01 * sy + r02 * sz;
  foot[1] = py + r10 * sx + r11 * sy + r12 * sz;
  foot[2] = pz + r20 * sx + r21 * sy + r22 * sz;
  const nx = ws.soleNormal[0];
  const ny = ws.soleNormal[1];
  const nz = ws.soleNormal[2];
  const up = ws.footUp;
  up[0] = r00 * nx + r01 * ny + r02 * nz;
  up[1] = r10 * nx + r11 * ny + r12 * nz;
  up[2] = r20 * nx + r21 * ny + r22 * nz;
  return foot;
}

/** World position of joint j (after forwardKinematics). */
export function jointPosition(ws: IKWorkspace, j: number, out: Float64Array | number[] = new Float64Array(3)) {
  vec3.set(out as vec3, ws.jPos[3 * j], ws.jPos[3 * j + 1], ws.jPos[3 * j + 2]);
  return out;
}

/** World 4×4 column-major matrix of joint j (after forwardKinematics). */
export function jointWorldMatrix(ws: IKWorkspace, j: number, out: Float64Array | number[] = new Float64Array(16)) {
  const Rj = ws.jRot;
  const o = 9 * j;
  out[0] = Rj[o];
  out[1] = Rj[o + 3];
  out[2] = Rj[o + 6];
  out[3] = 0;
  out[4] = Rj[o + 1];
  out[5] = Rj[o + 4];
  out[6] = Rj[o + 7];
  out[7] = 0;
  out[8] = Rj[o + 2];
  out[9] = Rj[o + 5];
  out[10] = Rj[o + 8];
  out[11] = 0;
  out[12] = ws.jPos[3 * j];
  out[13] = ws.jPos[3 * j + 1];
  out[14] = ws.jPos[3 * j + 2];
  out[15] = 1;
  return out;
}

/** World rotation of the foot (last joint) as a quaternion [x, y, z, w] (after forwardKinematics). */
export function footRotation(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(4)) {
  quatFromMat3(out, 0, ws.jRot, 9 * (ws.nJoints - 1));
  return out;
}

/** Toe tip in world coordinates (after forwardKinematics); null if the chain has no toe. */
export function toePosition(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(3)) {
  if (!ws.toe) return null;
  const Rj = ws.jRot;
  const o = 9 * (ws.nJoints - 1);
  const lp = 3 * (ws.nJoints - 1);
  const t = ws.toe;
  out[0] = ws.jPos[lp] + Rj[o] * t[0] + Rj[o + 1] * t[1] + Rj[o + 2] * t[2];
  out[1] = ws.jPos[lp + 1] + Rj[o + 3] * t[0] + Rj[o + 4] * t[1] + Rj[o + 5] * t[2];
  out[2] = ws.jPos[lp + 2] + Rj[o + 6] * t[0] + Rj[o + 7] * t[1] + Rj[o + 8] * t[2];
  return out;
}
