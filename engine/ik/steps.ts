/**
 * One step of each Jacobian method: dq = S(J) · e, written into `dq`.
 *
 * Weighted form: with per-DOF weights w (mobility, 0 = locked) the steps are
 * the weighted least-norm ones, e.g. DLS dq = W·Jᵀ(J·W·Jᵀ + λ²I)⁻¹·e
 * (Buss 2004 §5 with column scaling). J has one column per DOF, stride 6.
 */
import * as C from '../math/cholesky';
import * as SV from '../math/svd';
import { DOF_SLIDE as DOF_SLIDE_, S_LAMBDA2 as S_LAMBDA2_ } from './layout';
import type { IKWorkspace } from './workspace';

// Local bindings (transpiled imports are getter calls on every use).
const choleskyDecompose = C.choleskyDecompose;
const choleskySolve = C.choleskySolve;
const svdJacobi = SV.svdJacobi;
const DOF_SLIDE = DOF_SLIDE_;
const S_LAMBDA2 = S_LAMBDA2_;

/** A ← Σ w_i·j_i·j_iᵀ (m×m row-major). */
export function weightedGram(J: Float64Array, w: Float64Array, n: number, m: number, A: Float64Array): void {
  for (let k = 0; k < m * m; k++) A[k] = 0;
  for (let i = 0; i < n; i++) {
    const wi = w[i];
    if (wi === 0) continue;
    const c = 6 * i;
    for (let r = 0; r < m; r++) {
      const jr = wi * J[c + r];
      for (let q = r; q < m; q++) A[r * m + q] += jr * J[c + q];
    }
  }
  for (let r = 0; r < m; r++) for (let q = 0; q < r; q++) A[r * m + q] = A[q * m + r];
}

/**
 * DLS, position task (m = 3), fully unrolled: dq = W·Jᵀ·(JWJᵀ + λ²I)⁻¹·e.
 * Returns false if the damped matrix is not positive definite (λ = 0 at a singularity).
 */
export function dlsStep3(
  J: Float64Array,
  w: Float64Array,
  n: number,
  lambda2Arr: Float64Array,
  e: Float64Array,
  dq: Float64Array,
): boolean {
  // Doubles travel in typed arrays: passing them as arguments to a call that
  // is not inlined boxes each one (a heap allocation per call).
  const lambda2 = lambda2Arr[S_LAMBDA2];
  const e0 = e[0];
  const e1 = e[1];
  const e2 = e[2];
  let a00 = lambda2;
  let a01 = 0;
  let a02 = 0;
  let a11 = lambda2;
  let a12 = 0;
  let a22 = lambda2;
  for (let i = 0; i < n; i++) {
    const c = 6 * i;
    const wi = w[i];
    const x = J[c];
    const y = J[c + 1];
    const z = J[c + 2];
    const wx = wi * x;
    const wy = wi * y;
    a00 += wx * x;
    a01 += wx * y;
    a02 += wx * z;
    a11 += wy * y;
    a12 += wy * z;
    a22 += wi * z * z;
  }
  // Solve the SPD 3×3 by its adjugate: one division and a short dependency
  // chain (a Cholesky needs three square roots and three divisions in series).
  // With λ > 0 the matrix is well conditioned enough for this to be accurate.
  const c00 = a11 * a22 - a12 * a12;
  const c01 = a02 * a12 - a01 * a22;
  const c02 = a01 * a12 - a02 * a11;
  const det = a00 * c00 + a01 * c01 + a02 * c02;
  if (!(det > 1e-300)) return false;
  const c11 = a00 * a22 - a02 * a02;
  const c12 = a01 * a02 - a00 * a12;
  const c22 = a00 * a11 - a01 * a01;
  const inv = 1 / det;
  const y0 = (c00 * e0 + c01 * e1 + c02 * e2) * inv;
  const y1 = (c01 * e0 + c11 * e1 + c12 * e2) * inv;
  const y2 = (c02 * e0 + c12 * e1 + c22 * e2) * inv;
  for (let i = 0; i < n; i++) {
    const c = 6 * i;
    dq[i] = w[i] * (J[c] * y0 + J[c + 1] * y1 + J[c + 2] * y2);
  }
  return true;
}

/**
 * The position Jacobian (3 rows, into ws.J) and the DLS step in one pass: the
 * columns are accumulated into JWJᵀ as they are made (the column formula of
 * jacobian.ts, fused here for speed). λ² from ws.scalars[S_LAMBDA2].
 * Same result as jacobian(ws, 3) followed by dlsStepS(ws, w, 3, e, dq).
 */
export function jacobianDlsStep3(ws: IKWorkspace, w: Float64Array, e: Float64Array, dq: Float64Array): boolean {
  const n = ws.nDof;
  const J = ws.J;
  const AX = ws.dAxisW;
  const P = ws.jPos;
  const DJ = ws.dJoint;
  const K = ws.dKind;
  const fx = ws.foot[0];
  const fy = ws.foot[1];
  const fz = ws.foot[2];
  const lambda2 = ws.scalars[S_LAMBDA2];
  let a00 = lambda2;
  let a01 = 0;
  let a02 = 0;
  let a11 = lambda2;
  let a12 = 0;
  let a22 = lambda2;
  for (let i = 0; i < n; i++) {
    const ax = AX[3 * i];
    const ay = AX[3 * i + 1];
    const az = AX[3 * i + 2];
    let x: number, y: number, z: number;
    if (K[i] === DOF_SLIDE) {
      x = ax;
      y = ay;
      z = az;
    } else {
      const pj = 3 * DJ[i];
      const rx = fx - P[pj];
      const ry = fy - P[pj + 1];
      const rz = fz - P[pj + 2];
      x = ay * rz - az * ry;
      y = az * rx - ax * rz;
      z = ax * ry - ay * rx;
    }
    const c = 6 * i;
    J[c] = x;
    J[c + 1] = y;
    J[c + 2] = z;
    const wi = w[i];
    const wx = wi * x;
    const wy = wi * y;
    a00 += wx * x;
    a01 += wx * y;
    a02 += wx * z;
    a11 += wy * y;
    a12 += wy * z;
    a22 += wi * z * z;
  }
  const e0 = e[0];
  const e1 = e[1];
  const e2 = e[2];
  const c00 = a11 * a22 - a12 * a12;
  const c01 = a02 * a12 - a01 * a22;
  const c02 = a01 * a12 - a02 * a11;
  const det = a00 * c00 + a01 * c01 + a02 * c02;
  if (!(det > 1e-300)) return false;
  const c11 = a00 * a22 - a02 * a02;
  const c12 = a01 * a02 - a00 * a12;
  const c22 = a00 * a11 - a01 * a01;
  const inv = 1 / det;
  const y0 = (c00 * e0 + c01 * e1 + c02 * e2) * inv;
  const y1 = (c01 * e0 + c11 * e1 + c12 * e2) * inv;
  const y2 = (c02 * e0 + c12 * e1 + c22 * e2) * inv;
  for (let i = 0; i < n; i++) {
    const c = 6 * i;
    dq[i] = w[i] * (J[c] * y0 + J[c + 1] * y1 + J[c + 2] * y2);
  }
  return true;
}

/** DLS for any m (3 or 6) with damping λ²: dq = W·Jᵀ·(JWJᵀ + λ²I)⁻¹·e. */
export function dlsStep(ws: IKWorkspace, w: Float64Array, m: number, lambda2: number, e: Float64Array, dq: Float64Array): boolean {
  ws.scalars[S_LAMBDA2] = lambda2;
  return dlsStepS(ws, w, m, e, dq);
}

/** dlsStep with λ² taken from ws.scalars[S_LAMBDA2] (the solver's allocation-free path). */
export function dlsStepS(ws: IKWorkspace, w: Float64Array, m: number, e: Float64Array, dq: Float64Array): boolean {
  const n = ws.nDof;
  const J = ws.J;
  if (m === 3) return dlsStep3(J, w, n, ws.scalars, e, dq);
  const lambda2 = ws.scalars[S_LAMBDA2];
  const A = ws.A;
  weightedGram(J, w, n, m, A);
  for (let r = 0; r < m; r++) A[r * m + r] += lambda2;
  if (!choleskyDecompose(A, m)) return false;
  const y = ws.y;
  choleskySolve(A, m, e, y);
  for (let i = 0; i < n; i++) {
    let s = 0;
    const c = 6 * i;
    for (let r = 0; r < m; r++) s += J[c + r] * y[r];
    dq[i] = w[i] * s;
  }
  return true;
}

/**
 * Jacobian transpose with Buss's step length (Buss 2004 §4):
 * v = W·Jᵀe, α = ⟨e, Jv⟩ / ⟨Jv, Jv⟩, dq = α·v.
 */
export function transposeStep(ws: IKWorkspace, w: Float64Array, m: number, e: Float64Array, dq: Float64Array): void {
  const n = ws.nDof;
  const J = ws.J;
  const y = ws.y;
  for (let r = 0; r < m; r++) y[r] = 0;
  for (let i = 0; i < n; i++) {
    const c = 6 * i;
    let s = 0;
    for (let r = 0; r < m; r++) s += J[c + r] * e[r];
    s *= w[i];
    dq[i] = s;
    for (let r = 0; r < m; r++) y[r] += J[c + r] * s;
  }
  let num = 0;
  let den = 0;
  for (let r = 0; r < m; r++) {
    num += e[r] * y[r];
    den += y[r] * y[r];
  }
  const alpha = den > 1e-300 ? num / den : 0;
  for (let i = 0; i < n; i++) dq[i] *= alpha;
}

/**
 * SVD of the weighted Jacobian Jw = J·W^½ (m×n) via Jwᵀ = U·Σ·Vᵀ, so that
 * Jw = V·Σ·Uᵀ: joint-space singular vectors are U's columns (n each, in
 * ws.svdU), task-space ones V's columns (m each, in ws.svdV), σ in ws.svdS.
 */
export function weightedSvd(ws: IKWorkspace, sw: Float64Array, m: number): void {
  const n = ws.nDof;
  const J = ws.J;
  const A = ws.svdA;
  for (let r = 0; r < m; r++) for (let i = 0; i < n; i++) A[r * n + i] = J[6 * i + r] * sw[i];
  svdJacobi(A, n, m, ws.svdU, ws.svdS, ws.svdV);
}

/** Pseudoinverse (SVD, singular values ≤ threshold dropped): dq = W^½·Σ σ⁻¹·u_k·(v_kᵀe). */
export function pseudoinverseStep(
  ws: IKWorkspace,
  sw: Float64Array,
  m: number,
  threshold: number,
  e: Float64Array,
  dq: Float64Array,
): void {
  const n = ws.nDof;
  weightedSvd(ws, sw, m);
  const U = ws.svdU;
  const V = ws.svdV;
  const S = ws.svdS;
  for (let i = 0; i < n; i++) dq[i] = 0;
  for (let k = 0; k < m; k++) {
    const s = S[k];
    if (!(s > threshold)) continue;
    let a = 0;
    for (let r = 0; r < m; r++) a += V[k * m + r] * e[r];
    a /= s;
    for (let i = 0; i < n; i++) dq[i] += a * U[k * n + i];
  }
  for (let i = 0; i < n; i++) dq[i] *= sw[i];
}

/** Scale v (length n, from offset 0) so that max |v_i| ≤ limit. */
function clampMaxAbs(v: Float64Array, n: number, limit: number): void {
  let mx = 0;
  for (let i = 0; i < n; i++) {
    const a = Math.abs(v[i]);
    if (a > mx) mx = a;
  }
  if (mx > limit) {
    const k = limit / mx;
    for (let i = 0; i < n; i++) v[i] *= k;
  }
}

/**
 * Selectively damped least squares (Buss & Kim 2005, algorithm of §3/Fig. 2):
 * per singular triple, α_i = u_iᵀe, N_i = Σ_blocks ‖u_i block‖,
 * M_i = σ_i⁻¹·Σ_j |v_ji|·ρ_j (ρ_j = Σ_blocks ‖J block column j‖),
 * γ_i = min(1, N_i/M_i)·γmax, φ_i = ClampMaxAbs(σ_i⁻¹α_i·v_i, γ_i),
 * dq = ClampMaxAbs(Σ φ_i, γmax). Blocks: position (and orientation when m = 6).
 */
export function sdlsStep(ws: IKWorkspace, sw: Float64Array, m: number, gammaMax: number, e: Float64Array, dq: Float64Array): void {
  const n = ws.nDof;
  weightedSvd(ws, sw, m);
  const U = ws.svdU;
  const V = ws.svdV;
  const S = ws.svdS;
  const J = ws.J;
  const rho = ws.tmpN;
  for (let j = 0; j < n; j++) {
    const c = 6 * j;
    const s = sw[j];
    let r = Math.sqrt(J[c] * J[c] + J[c + 1] * J[c + 1] + J[c + 2] * J[c + 2]);
    if (m === 6) r += Math.sqrt(J[c + 3] * J[c + 3] + J[c + 4] * J[c + 4] + J[c + 5] * J[c + 5]);
    rho[j] = r * s;
  }
  for (let i = 0; i < n; i++) dq[i] = 0;
  const phi = ws.tmpN2;
  const smax = S[0];
  for (let k = 0; k < m; k++) {
    const s = S[k];
    if (!(s > 1e-12 * (smax > 0 ? smax : 1)) || s < 1e-300) continue;
    const vo = k * m;
    let alpha = 0;
    for (let r = 0; r < m; r++) alpha += V[vo + r] * e[r];
    let N = Math.sqrt(V[vo] * V[vo] + V[vo + 1] * V[vo + 1] + V[vo + 2] * V[vo + 2]);
    if (m === 6) N += Math.sqrt(V[vo + 3] * V[vo + 3] + V[vo + 4] * V[vo + 4] + V[vo + 5] * V[vo + 5]);
    let M = 0;
    const uo = k * n;
    for (let j = 0; j < n; j++) M += Math.abs(U[uo + j]) * rho[j];
    M /= s;
    const gamma = (M > N ? N / M : 1) * gammaMax;
    const a = alpha / s;
    for (let j = 0; j < n; j++) phi[j] = a * U[uo + j];
    clampMaxAbs(phi, n, gamma);
    for (let j = 0; j < n; j++) dq[j] += phi[j];
  }
  clampMaxAbs(dq, n, gammaMax);
  for (let i = 0; i < n; i++) dq[i] *= sw[i];
}

/** √det(J·W·Jᵀ) (manipulability, Yoshikawa), m = 3 or 6. Uses ws.A. */
export function manipulability(ws: IKWorkspace, w: Float64Array, m: number): number {
  const A = ws.A;
  weightedGram(ws.J, w, ws.nDof, m, A);
  if (m === 3) {
    const det =
      A[0] * (A[4] * A[8] - A[5] * A[7]) - A[1] * (A[3] * A[8] - A[5] * A[6]) + A[2] * (A[3] * A[7] - A[4] * A[6]);
    return Math.sqrt(Math.max(det, 0));
  }
  // Gaussian elimination with partial pivoting on the 6×6 copy.
  let det = 1;
  for (let c = 0; c < m; c++) {
    let p = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(A[r * m + c]) > Math.abs(A[p * m + c])) p = r;
    const pv = A[p * m + c];
    if (pv === 0) return 0;
    if (p !== c) {
      for (let k = 0; k < m; k++) {
        const t = A[c * m + k];
        A[c * m + k] = A[p * m + k];
        A[p * m + k] = t;
      }
      det = -det;
    }
    det *= pv;
    for (let r = c + 1; r < m; r++) {
      const f = A[r * m + c] / pv;
      if (f === 0) continue;
      for (let k = c; k < m; k++) A[r * m + k] -= f * A[c * m + k];
    }
  }
  return Math.sqrt(Math.max(det, 0));
}
