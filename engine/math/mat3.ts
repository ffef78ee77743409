/**
 * 3×3 rotation matrices packed in typed arrays, in gl-matrix's style (output
 * first, an offset after each array, no allocation; outputs may alias inputs),
 * but ROW-MAJOR: element (r, c) at m[o + 3r + c], unlike gl-matrix's
 * column-major mat3. The leg IK keeps its frames this way.
 */

/** out ← the rotation of quaternion q[qo..qo+3] ([x, y, z, w], normalised first; a zero quaternion gives the identity). */
export function fromQuat(out: Float64Array, o: number, q: ArrayLike<number>, qo: number): void {
  let x = q[qo];
  let y = q[qo + 1];
  let z = q[qo + 2];
  let w = q[qo + 3];
  const n = Math.sqrt(x * x + y * y + z * z + w * w) || 1;
  x /= n;
  y /= n;
  z /= n;
  w /= n;
  out[o] = 1 - 2 * (y * y + z * z);
  out[o + 1] = 2 * (x * y - z * w);
  out[o + 2] = 2 * (x * z + y * w);
  out[o + 3] = 2 * (x * y + z * w);
  out[o + 4] = 1 - 2 * (x * x + z * z);
  out[o + 5] = 2 * (y * z - x * w);
  out[o + 6] = 2 * (x * z - y * w);
  out[o + 7] = 2 * (y * z + x * w);
  out[o + 8] = 1 - 2 * (x * x + y * y);
}

/**
 * out ← the rotation by an angle about unit axis a[ao..ao+2], given its cosine
 * cs[i] and sine sn[i] (Rodrigues: cI + s[a]× + (1 − c)aaᵀ).
 */
export function fromAxisCosSin(
  out: Float64Array,
  o: number,
  a: ArrayLike<number>,
  ao: number,
  cs: ArrayLike<number>,
  sn: ArrayLike<number>,
  i: number,
): void {
  const ax = a[ao];
  const ay = a[ao + 1];
  const az = a[ao + 2];
  const c = cs[i];
  const s = sn[i];
  const t = 1 - c;
  out[o] = c + t * ax * ax;
  out[o + 1] = t * ax * ay - s * az;
  out[o + 2] = t * ax * az + s * ay;
  out[o + 3] = t * ax * ay + s * az;
  out[o + 4] = c + t * ay * ay;
  out[o + 5] = t * ay * az - s * ax;
  out[o + 6] = t * ax * az - s * ay;
  out[o + 7] = t * ay * az + s * ax;
  out[o + 8] = c + t * az * az;
}

/** out ← the rotation part of a rigid 4×4 column-major matrix m (gl-matrix / three.js layout). */
export function fromMat4(out: Float64Array, o: number, m: ArrayLike<number>): void {
  out[o] = m[0];
  out[o + 1] = m[4];
  out[o + 2] = m[8];
  out[o + 3] = m[1];
  out[o + 4] = m[5];
  out[o + 5] = m[9];
  out[o + 6] = m[2];
  out[o + 7] = m[6];
  out[o + 8] = m[10];
}
