/**
 * Forward kinematics and Jacobians of a leg chain in a workspace.
 *
 * W_j = W_{j−1} · T(offset_j) · R(rest_j) · D_j(q), W_{−1} = root (hip socket).
 * Matrices are row-major 3×3 in Float64Array (R[r*3+c]).
 */
import type { IKWorkspace } from './workspace';
import {
  DOF_BALL,
  DOF_SLIDE,
  JOINT_BALL,
  JOINT_HINGE,
  JOINT_SLIDER,
  JOINT_UNIVERSAL,
  expRotationVector,
} from './workspace';

/** R[o..o+8] ← R[o..o+8] · Rot(axis a, angle with cosine c and sine s); a is a unit axis in the local frame. */
function rotateLocal(R: Float64Array, o: number, ax: number, ay: number, az: number, c: number, s: number): void {
  if (ay === 0 && az === 0) {
    const sg = ax > 0 ? s : -s;
    for (let r = 0; r < 9; r += 3) {
      const c1 = R[o + r + 1];
      const c2 = R[o + r + 2];
      R[o + r + 1] = c * c1 + sg * c2;
      R[o + r + 2] = c * c2 - sg * c1;
    }
    return;
  }
  if (ax === 0 && az === 0) {
    const sg = ay > 0 ? s : -s;
    for (let r = 0; r < 9; r += 3) {
      const c0 = R[o + r];
      const c2 = R[o + r + 2];
      R[o + r] = c * c0 - sg * c2;
      R[o + r + 2] = sg * c0 + c * c2;
    }
    return;
  }
  if (ax === 0 && ay === 0) {
    const sg = az > 0 ? s : -s;
    for (let r = 0; r < 9; r += 3) {
      const c0 = R[o + r];
      const c1 = R[o + r + 1];
      R[o + r] = c * c0 + sg * c1;
      R[o + r + 1] = c * c1 - sg * c0;
    }
    return;
  }
  // General axis: Rodrigues M = cI + s[a]× + (1−c)aaᵀ, R ← R·M.
  const t = 1 - c;
  const m00 = c + t * ax * ax;
  const m01 = t * ax * ay - s * az;
  const m02 = t * ax * az + s * ay;
  const m10 = t * ax * ay + s * az;
  const m11 = c + t * ay * ay;
  const m12 = t * ay * az - s * ax;
  const m20 = t * ax * az - s * ay;
  const m21 = t * ay * az + s * ax;
  const m22 = c + t * az * az;
  for (let r = 0; r < 9; r += 3) {
    const a0 = R[o + r];
    const a1 = R[o + r + 1];
    const a2 = R[o + r + 2];
    R[o + r] = a0 * m00 + a1 * m10 + a2 * m20;
    R[o + r + 1] = a0 * m01 + a1 * m11 + a2 * m21;
    R[o + r + 2] = a0 * m02 + a1 * m12 + a2 * m22;
  }
}

/**
 * Forward kinematics from the current pose: joint world frames, per-DOF world
 * axes and pivots, the sole point (ws.foot) and sole normal (ws.footUp).
 * `from` > 0 recomputes only joints from that index on (the earlier ones must be current).
 */
export function forwardKinematics(ws: IKWorkspace, from = 0): Float64Array {
  const nJ = ws.nJoints;
  const jPos = ws.jPos;
  const jRot = ws.jRot;
  const pose = ws.pose;
  const quat = ws.quat;
  const dAxis = ws.dAxis;
  const dAxisW = ws.dAxisW;
  const dPivot = ws.dPivot;
  const jOffset = ws.jOffset;
  const jRest = ws.jRest;
  for (let j = from; j < nJ; j++) {
    // Parent frame.
    let P: Float64Array;
    let po: number;
    let Rp: Float64Array;
    let ro: number;
    if (j === 0) {
      P = ws.rootPos;
      po = 0;
      Rp = ws.rootRot;
      ro = 0;
    } else {
      P = jPos;
      po = 3 * (j - 1);
      Rp = jRot;
      ro = 9 * (j - 1);
    }
    const ox = jOffset[3 * j];
    const oy = jOffset[3 * j + 1];
    const oz = jOffset[3 * j + 2];
    let px = P[po] + Rp[ro] * ox + Rp[ro + 1] * oy + Rp[ro + 2] * oz;
    let py = P[po + 1] + Rp[ro + 3] * ox + Rp[ro + 4] * oy + Rp[ro + 5] * oz;
    let pz = P[po + 2] + Rp[ro + 6] * ox + Rp[ro + 7] * oy + Rp[ro + 8] * oz;
    const o = 9 * j;
    if (ws.jRestIdentity[j]) {
      for (let k = 0; k < 9; k++) jRot[o + k] = Rp[ro + k];
    } else {
      for (let r = 0; r < 9; r += 3) {
        const a0 = Rp[ro + r];
        const a1 = Rp[ro + r + 1];
        const a2 = Rp[ro + r + 2];
        jRot[o + r] = a0 * jRest[o] + a1 * jRest[o + 3] + a2 * jRest[o + 6];
        jRot[o + r + 1] = a0 * jRest[o + 1] + a1 * jRest[o + 4] + a2 * jRest[o + 7];
        jRot[o + r + 2] = a0 * jRest[o + 2] + a1 * jRest[o + 5] + a2 * jRest[o + 8];
      }
    }
    const kind = ws.jKind[j];
    let d = ws.jDof0[j];
    if (kind === JOINT_HINGE || kind === JOINT_UNIVERSAL) {
      const nd = kind === JOINT_HINGE ? 1 : 2;
      for (let k = 0; k < nd; k++, d++) {
        const ax = dAxis[3 * d];
        const ay = dAxis[3 * d + 1];
        const az = dAxis[3 * d + 2];
        dAxisW[3 * d] = jRot[o] * ax + jRot[o + 1] * ay + jRot[o + 2] * az;
        dAxisW[3 * d + 1] = jRot[o + 3] * ax + jRot[o + 4] * ay + jRot[o + 5] * az;
        dAxisW[3 * d + 2] = jRot[o + 6] * ax + jRot[o + 7] * ay + jRot[o + 8] * az;
        dPivot[3 * d] = px;
        dPivot[3 * d + 1] = py;
        dPivot[3 * d + 2] = pz;
        const th = pose[d];
        rotateLocal(jRot, o, ax, ay, az, Math.cos(th), Math.sin(th));
      }
    } else if (kind === JOINT_BALL) {
      for (let k = 0; k < 3; k++) {
        dAxisW[3 * (d + k)] = jRot[o + k];
        dAxisW[3 * (d + k) + 1] = jRot[o + 3 + k];
        dAxisW[3 * (d + k) + 2] = jRot[o + 6 + k];
        dPivot[3 * (d + k)] = px;
        dPivot[3 * (d + k) + 1] = py;
        dPivot[3 * (d + k) + 2] = pz;
      }
      const qo = 4 * ws.jBall[j];
      const x = quat[qo];
      const y = quat[qo + 1];
      const z = quat[qo + 2];
      const w = quat[qo + 3];
      const m00 = 1 - 2 * (y * y + z * z);
      const m01 = 2 * (x * y - z * w);
      const m02 = 2 * (x * z + y * w);
      const m10 = 2 * (x * y + z * w);
      const m11 = 1 - 2 * (x * x + z * z);
      const m12 = 2 * (y * z - x * w);
      const m20 = 2 * (x * z - y * w);
      const m21 = 2 * (y * z + x * w);
      const m22 = 1 - 2 * (x * x + y * y);
      for (let r = 0; r < 9; r += 3) {
        const a0 = jRot[o + r];
        const a1 = jRot[o + r + 1];
        const a2 = jRot[o + r + 2];
        jRot[o + r] = a0 * m00 + a1 * m10 + a2 * m20;
        jRot[o + r + 1] = a0 * m01 + a1 * m11 + a2 * m21;
        jRot[o + r + 2] = a0 * m02 + a1 * m12 + a2 * m22;
      }
    } else if (kind === JOINT_SLIDER) {
      const ax = dAxis[3 * d];
      const ay = dAxis[3 * d + 1];
      const az = dAxis[3 * d + 2];
      const wx = jRot[o] * ax + jRot[o + 1] * ay + jRot[o + 2] * az;
      const wy = jRot[o + 3] * ax + jRot[o + 4] * ay + jRot[o + 5] * az;
      const wz = jRot[o + 6] * ax + jRot[o + 7] * ay + jRot[o + 8] * az;
      dAxisW[3 * d] = wx;
      dAxisW[3 * d + 1] = wy;
      dAxisW[3 * d + 2] = wz;
      const s = pose[d];
      px += wx * s;
      py += wy * s;
      pz += wz * s;
      dPivot[3 * d] = px;
      dPivot[3 * d + 1] = py;
      dPivot[3 * d + 2] = pz;
    }
    jPos[3 * j] = px;
    jPos[3 * j + 1] = py;
    jPos[3 * j + 2] = pz;
  }
  const o = 9 * (nJ - 1);
  const sx = ws.sole[0];
  const sy = ws.sole[1];
  const sz = ws.sole[2];
  const lp = 3 * (nJ - 1);
  ws.foot[0] = jPos[lp] + jRot[o] * sx + jRot[o + 1] * sy + jRot[o + 2] * sz;
  ws.foot[1] = jPos[lp + 1] + jRot[o + 3] * sx + jRot[o + 4] * sy + jRot[o + 5] * sz;
  ws.foot[2] = jPos[lp + 2] + jRot[o + 6] * sx + jRot[o + 7] * sy + jRot[o + 8] * sz;
  const nx = ws.soleNormal[0];
  const ny = ws.soleNormal[1];
  const nz = ws.soleNormal[2];
  ws.footUp[0] = jRot[o] * nx + jRot[o + 1] * ny + jRot[o + 2] * nz;
  ws.footUp[1] = jRot[o + 3] * nx + jRot[o + 4] * ny + jRot[o + 5] * nz;
  ws.footUp[2] = jRot[o + 6] * nx + jRot[o + 7] * ny + jRot[o + 8] * nz;
  return ws.foot;
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
  const P = ws.dPivot;
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
      const rx = fx - P[3 * i];
      const ry = fy - P[3 * i + 1];
      const rz = fz - P[3 * i + 2];
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
  let x = aw * bx + ax * bw + ay * bz - az * by;
  let y = aw * by - ax * bz + ay * bw + az * bx;
  let z = aw * bz + ax * by - ay * bx + az * bw;
  let w = aw * bw - ax * bx - ay * by - az * bz;
  const inv = 1 / Math.sqrt(x * x + y * y + z * z + w * w);
  x *= inv;
  y *= inv;
  z *= inv;
  w *= inv;
  q[o] = x;
  q[o + 1] = y;
  q[o + 2] = z;
  q[o + 3] = w;
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
