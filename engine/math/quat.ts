/**
 * Quaternions [x, y, z, w] packed in typed arrays, in gl-matrix's style: the
 * output comes first, each array is followed by the offset of its quaternion,
 * nothing is allocated. Outputs may alias inputs.
 */

/** out ← a ⊗ b (Hamilton product: rotate by b, then by a). */
export function multiply(out: Float64Array, o: number, a: ArrayLike<number>, ao: number, b: ArrayLike<number>, bo: number): void {
  const ax = a[ao];
  const ay = a[ao + 1];
  const az = a[ao + 2];
  const aw = a[ao + 3];
  const bx = b[bo];
  const by = b[bo + 1];
  const bz = b[bo + 2];
  const bw = b[bo + 3];
  out[o] = aw * bx + ax * bw + ay * bz - az * by;
  out[o + 1] = aw * by - ax * bz + ay * bw + az * bx;
  out[o + 2] = aw * bz + ax * by - ay * bx + az * bw;
  out[o + 3] = aw * bw - ax * bx - ay * by - az * bz;
}

/**
 * q ← a ⊗ q for unit a and q, renormalised. |a ⊗ q|² = 1 + ε with ε at
 * rounding level, so the first-order 1/√(1+ε) ≈ 1 − ε/2 is exact to O(ε²)
 * without a square root or a division; the exact one is the fallback if ever far off.
 * The product is multiply's, written out: the solver calls this every iteration per ball joint.
 */
export function premultiplyUnit(q: Float64Array, o: number, a: ArrayLike<number>, ao: number): void {
  const ax = a[ao];
  const ay = a[ao + 1];
  const az = a[ao + 2];
  const aw = a[ao + 3];
  const bx = q[o];
  const by = q[o + 1];
  const bz = q[o + 2];
  const bw = q[o + 3];
  const x = aw * bx + ax * bw + ay * bz - az * by;
  const y = aw * by - ax * bz + ay * bw + az * bx;
  const z = aw * bz + ax * by - ay * bx + az * bw;
  const w = aw * bw - ax * bx - ay * by - az * bz;
  const n2 = x * x + y * y + z * z + w * w;
  const k = n2 > 0.999 && n2 < 1.001 ? 1.5 - 0.5 * n2 : 1 / Math.sqrt(n2);
  q[o] = x * k;
  q[o + 1] = y * k;
  q[o + 2] = z * k;
  q[o + 3] = w * k;
}

/** Below this squared angle (rad²) the exp map uses its Taylor series (no cancellation in sin(θ/2)/θ). */
const EXP_SERIES_BELOW = 1e-2;

/** out ← exp(v/2): the unit quaternion of the rotation vector v[vo..vo+2] (axis · angle, rad). */
export function fromRotationVector(out: Float64Array, o: number, v: ArrayLike<number>, vo: number): void {
  const x = v[vo];
  const y = v[vo + 1];
  const z = v[vo + 2];
  const t2 = x * x + y * y + z * z;
  let s: number;
  let c: number;
  if (t2 < EXP_SERIES_BELOW) {
    const h2 = t2 * 0.25;
    c = 1 - h2 / 2 + (h2 * h2) / 24 - (h2 * h2 * h2) / 720 + (h2 * h2 * h2 * h2) / 40320;
    s = 0.5 * (1 - h2 / 6 + (h2 * h2) / 120 - (h2 * h2 * h2) / 5040 + (h2 * h2 * h2 * h2) / 362880);
  } else {
    const t = Math.sqrt(t2);
    c = Math.cos(t / 2);
    s = Math.sin(t / 2) / t;
  }
  out[o] = x * s;
  out[o + 1] = y * s;
  out[o + 2] = z * s;
  out[o + 3] = c;
}

/** out[o..o+2] ← log(q): the rotation vector of unit q, the shorter way round (|angle| ≤ π). */
export function toRotationVector(out: Float64Array, o: number, q: ArrayLike<number>, qo: number): void {
  let x = q[qo];
  let y = q[qo + 1];
  let z = q[qo + 2];
  let w = q[qo + 3];
  if (w < 0) {
    x = -x;
    y = -y;
    z = -z;
    w = -w;
  }
  const sn = Math.sqrt(x * x + y * y + z * z);
  let k: number;
  if (sn < 1e-8) k = 2 / (w > 0 ? w : 1);
  else k = (2 * Math.atan2(sn, w)) / sn;
  out[o] = x * k;
  out[o + 1] = y * k;
  out[o + 2] = z * k;
}

/** out ← the unit quaternion of the rotation matrix m[mo..mo+8] (row-major; Shepperd's branch on the largest diagonal term). */
export function fromMat3(out: Float64Array | number[], o: number, m: ArrayLike<number>, mo: number): void {
  const m00 = m[mo];
  const m11 = m[mo + 4];
  const m22 = m[mo + 8];
  const tr = m00 + m11 + m22;
  let x: number, y: number, z: number, w: number;
  if (tr > 0) {
    const s = 0.5 / Math.sqrt(tr + 1);
    w = 0.25 / s;
    x = (m[mo + 7] - m[mo + 5]) * s;
    y = (m[mo + 2] - m[mo + 6]) * s;
    z = (m[mo + 3] - m[mo + 1]) * s;
  } else if (m00 > m11 && m00 > m22) {
    const s = 2 * Math.sqrt(1 + m00 - m11 - m22);
    w = (m[mo + 7] - m[mo + 5]) / s;
    x = 0.25 * s;
    y = (m[mo + 1] + m[mo + 3]) / s;
    z = (m[mo + 2] + m[mo + 6]) / s;
  } else if (m11 > m22) {
    const s = 2 * Math.sqrt(1 + m11 - m00 - m22);
    w = (m[mo + 2] - m[mo + 6]) / s;
    x = (m[mo + 1] + m[mo + 3]) / s;
    y = 0.25 * s;
    z = (m[mo + 5] + m[mo + 7]) / s;
  } else {
    const s = 2 * Math.sqrt(1 + m22 - m00 - m11);
    w = (m[mo + 3] - m[mo + 1]) / s;
    x = (m[mo + 2] + m[mo + 6]) / s;
    y = (m[mo + 5] + m[mo + 7]) / s;
    z = 0.25 * s;
  }
  out[o] = x;
  out[o + 1] = y;
  out[o + 2] = z;
  out[o + 3] = w;
}
