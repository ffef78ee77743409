/**
 * Thin SVD of small dense matrices by one-sided Jacobi (Hestenes) rotations.
 *
 * A is r×c, column-major (column k at a[k*r .. k*r+r-1]). On return
 *   A = U · diag(s) · Vᵀ
 * with U r×c (column-major, in `u`; columns for zero singular values are 0),
 * s length c sorted descending, V c×c (column-major, in `v`).
 * No allocation: `u` (r·c), `s` (c) and `v` (c·c) are caller buffers; `u` may alias `a`.
 */
export function svdJacobi(
  a: ArrayLike<number>,
  r: number,
  c: number,
  u: Float64Array,
  s: Float64Array,
  v: Float64Array,
  maxSweeps = 40,
): number {
  if (u !== a) for (let i = 0; i < r * c; i++) u[i] = a[i];
  for (let i = 0; i < c * c; i++) v[i] = 0;
  for (let i = 0; i < c; i++) v[i * c + i] = 1;
  let sweep = 0;
  for (; sweep < maxSweeps; sweep++) {
    let rotated = false;
    for (let p = 0; p < c - 1; p++) {
      for (let q = p + 1; q < c; q++) {
        let alpha = 0;
        let beta = 0;
        let gamma = 0;
        const op = p * r;
        const oq = q * r;
        for (let i = 0; i < r; i++) {
          const x = u[op + i];
          const y = u[oq + i];
          alpha += x * x;
          beta += y * y;
          gamma += x * y;
        }
        if (gamma === 0 || Math.abs(gamma) <= 1e-15 * Math.sqrt(alpha * beta)) continue;
        rotated = true;
        const zeta = (beta - alpha) / (2 * gamma);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const cs = 1 / Math.sqrt(1 + t * t);
        const sn = cs * t;
        for (let i = 0; i < r; i++) {
          const x = u[op + i];
          const y = u[oq + i];
          u[op + i] = cs * x - sn * y;
          u[oq + i] = sn * x + cs * y;
        }
        const vp = p * c;
        const vq = q * c;
        for (let i = 0; i < c; i++) {
          const x = v[vp + i];
          const y = v[vq + i];
          v[vp + i] = cs * x - sn * y;
          v[vq + i] = sn * x + cs * y;
        }
      }
    }
    if (!rotated) break;
  }
  for (let k = 0; k < c; k++) {
    let n = 0;
    const o = k * r;
    for (let i = 0; i < r; i++) n += u[o + i] * u[o + i];
    n = Math.sqrt(n);
    s[k] = n;
    if (n > 0) {
      const inv = 1 / n;
      for (let i = 0; i < r; i++) u[o + i] *= inv;
    } else {
      for (let i = 0; i < r; i++) u[o + i] = 0;
    }
  }
  // Selection sort, descending (c is tiny).
  for (let k = 0; k < c - 1; k++) {
    let best = k;
    for (let j = k + 1; j < c; j++) if (s[j] > s[best]) best = j;
    if (best !== k) {
      const t = s[k];
      s[k] = s[best];
      s[best] = t;
      for (let i = 0; i < r; i++) {
        const x = u[k * r + i];
        u[k * r + i] = u[best * r + i];
        u[best * r + i] = x;
      }
      for (let i = 0; i < c; i++) {
        const x = v[k * c + i];
        v[k * c + i] = v[best * c + i];
        v[best * c + i] = x;
      }
    }
  }
  return sweep;
}
