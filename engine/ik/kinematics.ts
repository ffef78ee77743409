/**
 * Forward kinematics and Jacobians of a leg chain in a workspace.
 *
 * W_j = W_{j−1} · T(offset_j) · R(rest_j) · D_j(q), W_{−1} = root (hip socket).
 * Matrices are row-major 3×3 in Float64Array (R[r*3+c]).
 */
import type { IKWorkspace } from './workspace';
import { expRotationVector as expRotationVectorImport } from './workspace';

// Local copies of workspace constants and imports: transpiled ES module imports
// become getter calls on every access, which costs more than the arithmetic here.
const DOF_BALL = 1;
const DOF_SLIDE = 2;
const JOINT_HINGE = 0;
const JOINT_UNIVERSAL = 1;
const JOINT_BALL = 2;
const expRotationVector = expRotationVectorImport;
/** Incremental cos/sin updates before an exact recompute. */
const TRIG_REFRESH = 64;

/**
 * Forward kinematics from the current pose: joint world frames, per-DOF world
 * axes, the sole point (ws.foot) and sole normal (ws.footUp). A rotational
 * DOF's pivot is its joint's position (ws.jPos).
 * `from` > 0 recomputes only joints from that index on (the earlier ones must be current).
 *
 * The running frame lives in locals (p, R row-major r00..r22); each joint's
 * frame is stored once at its end.
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
    const ox = jOffset[3 * j];
    const oy = jOffset[3 * j + 1];
    const oz = jOffset[3 * j + 2];
    px += r00 * ox + r01 * oy + r02 * oz;
    py += r10 * ox + r11 * oy + r12 * oz;
    pz += r20 * ox + r21 * oy + r22 * oz;
    const o = 9 * j;
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
          if (dd > -0.05 && dd < 0.05 && cnt < TRIG_REFRESH) {
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
        if (code < 6) {
          // Axis-aligned (±X, ±Y, ±Z): the world axis is a column of R; rotate two columns.
          const sg = code < 3 ? sn : -sn;
          const sgn = code < 3 ? 1 : -1;
          const ax = code % 3;
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
          const t = 1 - c;
          const m00 = c + t * ax * ax;
          const m01 = t * ax * ay - sn * az;
          const m02 = t * ax * az + sn * ay;
          const m10 = t * ax * ay + sn * az;
          const m11 = c + t * ay * ay;
          const m12 = t * ay * az - sn * ax;
          const m20 = t * ax * az - sn * ay;
          const m21 = t * ay * az + sn * ax;
          const m22 = c + t * az * az;
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
      // Slider: translate along its axis.
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
      premultiplyQuat(dq, ws.quat, 4 * b);
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

/** q[o..o+3] ← d ⊗ q[o..o+3] (d a unit quaternion), renormalised. */
export function premultiplyQuat(d: ArrayLike<number>, q: Float64Array, o: number): void {
  const ax = d[0];
  const ay = d[1];
  const az = d[2];
  const aw = d[3];
  const bx = q[o];
  const by = q[o + 1];
  const bz = q[o + 2];
  const bw = q[o + 3];
  const x = aw * bx + ax * bw + ay * bz - az * by;
  const y = aw * by - ax * bz + ay * bw + az * bx;
  const z = aw * bz + ax * by - ay * bx + az * bw;
  const w = aw * bw - ax * bx - ay * by - az * bz;
  // Both factors are unit, so |q|² = 1 + ε with ε at rounding level: the
  // first-order renormalisation 1/√(1+ε) ≈ 1 − ε/2 is exact to O(ε²) without
  // a square root or a division; fall back to the exact one if ever far off.
  const n2 = x * x + y * y + z * z + w * w;
  const k = n2 > 0.999 && n2 < 1.001 ? 1.5 - 0.5 * n2 : 1 / Math.sqrt(n2);
  q[o] = x * k;
  q[o + 1] = y * k;
  q[o + 2] = z * k;
  q[o + 3] = w * k;
}

/** World position of joint j (after forwardKinematics). */
export function jointPosition(ws: IKWorkspace, j: number, out: Float64Array | number[] = new Float64Array(3)) {
  out[0] = ws.jPos[3 * j];
  out[1] = ws.jPos[3 * j + 1];
  out[2] = ws.jPos[3 * j + 2];
  return out;
}

/** World 4×4 column-major matrix of joint j (after forwardKinematics). */
export function jointWorldMatrix(ws: IKWorkspace, j: number, out: Float64Array | number[] = new Float64Array(16)) {
  const R = ws.jRot;
  const o = 9 * j;
  out[0] = R[o];
  out[1] = R[o + 3];
  out[2] = R[o + 6];
  out[3] = 0;
  out[4] = R[o + 1];
  out[5] = R[o + 4];
  out[6] = R[o + 7];
  out[7] = 0;
  out[8] = R[o + 2];
  out[9] = R[o + 5];
  out[10] = R[o + 8];
  out[11] = 0;
  out[12] = ws.jPos[3 * j];
  out[13] = ws.jPos[3 * j + 1];
  out[14] = ws.jPos[3 * j + 2];
  out[15] = 1;
  return out;
}

/** World rotation of the foot (last joint) as a quaternion [x, y, z, w] (after forwardKinematics). */
export function footRotation(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(4)) {
  const R = ws.jRot;
  const o = 9 * (ws.nJoints - 1);
  const m00 = R[o];
  const m11 = R[o + 4];
  const m22 = R[o + 8];
  const tr = m00 + m11 + m22;
  let x: number, y: number, z: number, w: number;
  if (tr > 0) {
    const s = 0.5 / Math.sqrt(tr + 1);
    w = 0.25 / s;
    x = (R[o + 7] - R[o + 5]) * s;
    y = (R[o + 2] - R[o + 6]) * s;
    z = (R[o + 3] - R[o + 1]) * s;
  } else if (m00 > m11 && m00 > m22) {
    const s = 2 * Math.sqrt(1 + m00 - m11 - m22);
    w = (R[o + 7] - R[o + 5]) / s;
    x = 0.25 * s;
    y = (R[o + 1] + R[o + 3]) / s;
    z = (R[o + 2] + R[o + 6]) / s;
  } else if (m11 > m22) {
    const s = 2 * Math.sqrt(1 + m11 - m00 - m22);
    w = (R[o + 2] - R[o + 6]) / s;
    x = (R[o + 1] + R[o + 3]) / s;
    y = 0.25 * s;
    z = (R[o + 5] + R[o + 7]) / s;
  } else {
    const s = 2 * Math.sqrt(1 + m22 - m00 - m11);
    w = (R[o + 3] - R[o + 1]) / s;
    x = (R[o + 2] + R[o + 6]) / s;
    y = (R[o + 5] + R[o + 7]) / s;
    z = 0.25 * s;
  }
  out[0] = x;
  out[1] = y;
  out[2] = z;
  out[3] = w;
  return out;
}

/** Toe tip in world coordinates (after forwardKinematics); null if the chain has no toe. */
export function toePosition(ws: IKWorkspace, out: Float64Array | number[] = new Float64Array(3)) {
  if (!ws.toe) return null;
  const R = ws.jRot;
  const o = 9 * (ws.nJoints - 1);
  const lp = 3 * (ws.nJoints - 1);
  const t = ws.toe;
  out[0] = ws.jPos[lp] + R[o] * t[0] + R[o + 1] * t[1] + R[o + 2] * t[2];
  out[1] = ws.jPos[lp + 1] + R[o + 3] * t[0] + R[o + 4] * t[1] + R[o + 5] * t[2];
  out[2] = ws.jPos[lp + 2] + R[o + 6] * t[0] + R[o + 7] * t[1] + R[o + 8] * t[2];
  return out;
}
