/**
 * Our small dense linear algebra and solver steps against ml-matrix (solve,
 * SVD, pseudoInverse) on seeded random matrices: ml-matrix, a general-purpose
 * linear algebra library from npm, is the reference. DLS form from Buss 2004:
 * Δθ = Jᵀ(JJᵀ + λ²I)⁻¹e.
 */
import { Matrix, SingularValueDecomposition, pseudoInverse, solve as mlSolve } from 'ml-matrix';
import { createWorkspace, dlsStep, pseudoinverseStep } from '../../../engine/ik';
import { choleskyDecompose, choleskySolve } from '../../../engine/math/cholesky';
import { mulberry32 } from '../../../engine/math/random';
import { svdJacobi } from '../../../engine/math/svd';
import type { LegChain } from '../../../engine/rig/types';

function hingeChain(n: number): LegChain {
  return {
    name: 'h',
    kind: 'custom',
    joints: Array.from({ length: n }, (_, i) => ({
      name: `h${i}`,
      kind: 'hinge' as const,
      offset: [0, i === 0 ? 0 : -0.3, 0] as [number, number, number],
      rest: [0, 0, 0, 1] as [number, number, number, number],
      axes: [[1, 0, 0]] as [number, number, number][],
    })),
    sole: [0, -0.1, 0],
    soleNormal: [0, 1, 0],
    reach: 1,
  };
}

describe('Cholesky vs ml-matrix solve', () => {
  test('seeded SPD systems, m = 3 and 6', () => {
    const rng = mulberry32(11);
    for (let t = 0; t < 100; t++) {
      const m = t % 2 ? 3 : 6;
      const B = Matrix.zeros(m, m + 2);
      for (let i = 0; i < m; i++) for (let j = 0; j < m + 2; j++) B.set(i, j, rng.range(-1, 1));
      const A = B.mmul(B.transpose()).add(Matrix.eye(m).mul(0.01));
      const b = Array.from({ length: m }, () => rng.range(-1, 1));
      const ref = mlSolve(A, Matrix.columnVector(b)).to1DArray();
      const a = Float64Array.from(A.to1DArray());
      expect(choleskyDecompose(a, m)).toBe(true);
      const x = new Float64Array(m);
      choleskySolve(a, m, b, x);
      for (let i = 0; i < m; i++) expect(x[i]).toBeCloseTo(ref[i], 8);
    }
  });
  test('rejects an indefinite matrix', () => {
    expect(choleskyDecompose(Float64Array.from([1, 2, 2, 1]), 2)).toBe(false);
  });
});

describe('SVD (one-sided Jacobi) vs ml-matrix SVD', () => {
  test('seeded random matrices: singular values and reconstruction', () => {
    const rng = mulberry32(12);
    for (let t = 0; t < 100; t++) {
      const r = 2 + rng.int(7);
      const c = 1 + rng.int(6);
      const M = Matrix.zeros(r, c);
      for (let i = 0; i < r; i++) for (let j = 0; j < c; j++) M.set(i, j, rng.range(-1, 1));
      const a = new Float64Array(r * c);
      for (let j = 0; j < c; j++) for (let i = 0; i < r; i++) a[j * r + i] = M.get(i, j);
      const u = new Float64Array(r * c);
      const s = new Float64Array(c);
      const v = new Float64Array(c * c);
      svdJacobi(a, r, c, u, s, v);
      const ref = new SingularValueDecomposition(M, { autoTranspose: true }).diagonal;
      const k = Math.min(r, c);
      for (let i = 0; i < k; i++) expect(s[i]).toBeCloseTo(ref[i], 9);
      for (let i = k; i < c; i++) expect(s[i]).toBeLessThan(1e-9);
      for (let i = 0; i < r; i++)
        for (let j = 0; j < c; j++) {
          let acc = 0;
          for (let q = 0; q < c; q++) acc += u[q * r + i] * s[q] * v[q * c + j];
          expect(acc).toBeCloseTo(M.get(i, j), 10);
        }
    }
  });
});

describe('DLS and pseudoinverse steps vs ml-matrix on seeded random Jacobians', () => {
  test.each([
    [3, 3],
    [3, 6],
    [6, 5],
    [6, 8],
    [6, 4],
  ])('m = %i, n = %i', (m, n) => {
    const rng = mulberry32(1000 + 10 * m + n);
    const ws = createWorkspace(hingeChain(n));
    const w = new Float64Array(n).fill(1);
    const dq = new Float64Array(n);
    for (let t = 0; t < 50; t++) {
      const J = Matrix.zeros(m, n);
      for (let r = 0; r < m; r++) for (let i = 0; i < n; i++) J.set(r, i, rng.range(-1, 1));
      for (let i = 0; i < n; i++) for (let r = 0; r < 6; r++) ws.J[6 * i + r] = r < m ? J.get(r, i) : 0;
      const e = new Float64Array(6);
      for (let r = 0; r < m; r++) e[r] = rng.range(-0.2, 0.2);
      const ev = Matrix.columnVector(Array.from(e.subarray(0, m)));
      const lambda = rng.range(0.01, 0.5);
      // DLS: Jᵀ (JJᵀ + λ²I)⁻¹ e
      const A = J.mmul(J.transpose()).add(Matrix.eye(m).mul(lambda * lambda));
      const ref = J.transpose().mmul(mlSolve(A, ev)).to1DArray();
      expect(dlsStep(ws, w, m, lambda * lambda, e, dq)).toBe(true);
      for (let i = 0; i < n; i++) expect(dq[i]).toBeCloseTo(ref[i], 9);
      // Weighted DLS: W Jᵀ (J W Jᵀ + λ²I)⁻¹ e
      const wv = Array.from({ length: n }, () => rng.range(0.1, 2));
      const W = Matrix.diag(wv);
      const Aw = J.mmul(W).mmul(J.transpose()).add(Matrix.eye(m).mul(lambda * lambda));
      const refW = W.mmul(J.transpose()).mmul(mlSolve(Aw, ev)).to1DArray();
      dlsStep(ws, Float64Array.from(wv), m, lambda * lambda, e, dq);
      for (let i = 0; i < n; i++) expect(dq[i]).toBeCloseTo(refW[i], 9);
      // Pseudoinverse (full rank): J⁺ e
      const refP = pseudoInverse(J).mmul(ev).to1DArray();
      pseudoinverseStep(ws, w, m, 1e-10, e, dq);
      for (let i = 0; i < n; i++) expect(dq[i]).toBeCloseTo(refP[i], 7);
    }
  });

  test('pseudoinverse drops singular values below the threshold (rank-deficient J)', () => {
    const rng = mulberry32(77);
    const n = 5;
    const ws = createWorkspace(hingeChain(n));
    const w = new Float64Array(n).fill(1);
    const dq = new Float64Array(n);
    for (let t = 0; t < 30; t++) {
      // Rank 2 Jacobian, 3×5.
      const a = Matrix.zeros(3, 2);
      const b = Matrix.zeros(2, n);
      for (let i = 0; i < 3; i++) for (let j = 0; j < 2; j++) a.set(i, j, rng.range(-1, 1));
      for (let i = 0; i < 2; i++) for (let j = 0; j < n; j++) b.set(i, j, rng.range(-1, 1));
      const J = a.mmul(b);
      for (let i = 0; i < n; i++) for (let r = 0; r < 3; r++) ws.J[6 * i + r] = J.get(r, i);
      const e = Float64Array.from([rng.range(-1, 1), rng.range(-1, 1), rng.range(-1, 1), 0, 0, 0]);
      const refP = pseudoInverse(J, 1e-9).mmul(Matrix.columnVector([e[0], e[1], e[2]])).to1DArray();
      pseudoinverseStep(ws, w, 3, 1e-6, e, dq);
      for (let i = 0; i < n; i++) expect(dq[i]).toBeCloseTo(refP[i], 6);
    }
  });
});
