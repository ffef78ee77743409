/**
 * Cholesky factorisation of small symmetric positive definite matrices stored
 * row-major in Float64Array (m×m, stride m). No allocation.
 */

/**
 * In-place: the lower triangle of `a` becomes L with A = L·Lᵀ (the upper part is left untouched).
 * Returns false if A is not (numerically) positive definite.
 */
export function choleskyDecompose(a: Float64Array, m: number): boolean {
  for (let j = 0; j < m; j++) {
    let d = a[j * m + j];
    for (let k = 0; k < j; k++) {
      const l = a[j * m + k];
      d -= l * l;
    }
    if (!(d > 0)) return false;
    const ljj = Math.sqrt(d);
    a[j * m + j] = ljj;
    const inv = 1 / ljj;
    for (let i = j + 1; i < m; i++) {
      let s = a[i * m + j];
      for (let k = 0; k < j; k++) s -= a[i * m + k] * a[j * m + k];
      a[i * m + j] = s * inv;
    }
  }
  return true;
}

/** Solve L·Lᵀ·x = b given the factor from choleskyDecompose. `x` may alias `b`. */
export function choleskySolve(l: Float64Array, m: number, b: ArrayLike<number>, x: Float64Array): void {
  for (let i = 0; i < m; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i * m + k] * x[k];
    x[i] = s / l[i * m + i];
  }
  for (let i = m - 1; i >= 0; i--) {
    let s = x[i];
    for (let k = i + 1; k < m; k++) s -= l[k * m + i] * x[k];
    x[i] = s / l[i * m + i];
  }
}

/** det(A) from its Cholesky factor: (Π Lii)². */
export function choleskyDeterminant(l: Float64Array, m: number): number {
  let p = 1;
  for (let i = 0; i < m; i++) p *= l[i * m + i];
  return p * p;
}
