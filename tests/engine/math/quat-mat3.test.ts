/**
 * engine/math/quat.ts and mat3.ts against gl-matrix 3 (npm), the reference
 * whose conventions they follow: quaternions [x, y, z, w] (Hamilton product),
 * gl-matrix's mat3/mat4 column-major where ours is row-major (so ours is the
 * transpose of gl-matrix's), and exp/log of a rotation vector against
 * quat.setAxisAngle / quat.getAxisAngle. Seeded random inputs; tolerance 1e-12
 * (double rounding over a handful of operations).
 */
import { glMatrix, mat3 as glMat3, mat4 as glMat4, quat as glQuat } from 'gl-matrix';
import * as M3 from '../../../engine/math/mat3';
import * as Q from '../../../engine/math/quat';
import { mulberry32 } from '../../../engine/math/random';

glMatrix.setMatrixArrayType(Array); // doubles, not gl-matrix's default Float32Array

const rng = mulberry32(2026);
function randomUnitQuat(): number[] {
  const q = [rng.range(-1, 1), rng.range(-1, 1), rng.range(-1, 1), rng.range(-1, 1)];
  const n = Math.hypot(q[0], q[1], q[2], q[3]);
  return q.map((v) => v / n);
}
function randomUnitAxis(): [number, number, number] {
  const a = [rng.range(-1, 1), rng.range(-1, 1), rng.range(-1, 1)];
  const n = Math.hypot(a[0], a[1], a[2]);
  return [a[0] / n, a[1] / n, a[2] / n];
}
/** gl-matrix column-major 3×3 → row-major. */
function rowMajor(m: ArrayLike<number>): number[] {
  return [m[0], m[3], m[6], m[1], m[4], m[7], m[2], m[5], m[8]];
}
function expectClose(a: ArrayLike<number>, b: ArrayLike<number>, tol = 1e-12) {
  expect(a.length).toBe(b.length);
  for (let i = 0; i < a.length; i++) expect(Math.abs(a[i] - b[i])).toBeLessThan(tol);
}
/** q and −q are the same rotation. */
function expectSameRotation(a: ArrayLike<number>, b: ArrayLike<number>) {
  const sign = a[0] * b[0] + a[1] * b[1] + a[2] * b[2] + a[3] * b[3] < 0 ? -1 : 1;
  expectClose(Array.from(a), Array.from(b, (v) => sign * v));
}

describe('quat against gl-matrix', () => {
  it('multiply is gl-matrix quat.multiply, at offsets into packed arrays and in place', () => {
    for (let t = 0; t < 200; t++) {
      const a = randomUnitQuat();
      const b = randomUnitQuat();
      const ref = glQuat.multiply([0, 0, 0, 0] as unknown as glQuat, a as glQuat, b as glQuat);
      const packed = new Float64Array([9, ...a, 9, ...b]);
      const out = new Float64Array(6);
      Q.multiply(out, 2, packed, 1, packed, 6);
      expectClose(out.subarray(2), ref);
      // out aliasing b, as premultiplyUnit uses it
      Q.multiply(packed, 6, packed, 1, packed, 6);
      expectClose(packed.subarray(6), ref);
    }
  });

  it('premultiplyUnit is a ⊗ q normalised (gl-matrix multiply then normalize)', () => {
    for (let t = 0; t < 200; t++) {
      const a = randomUnitQuat();
      const q = Float64Array.from(randomUnitQuat());
      const ref = glQuat.normalize([0, 0, 0, 0] as unknown as glQuat, glQuat.multiply([0, 0, 0, 0] as unknown as glQuat, a as glQuat, Array.from(q) as glQuat));
      Q.premultiplyUnit(q, 0, a, 0);
      expectClose(q, ref);
    }
    // far off unit length it falls back to the exact normalisation
    const q = new Float64Array([0, 0, 0, 2]);
    Q.premultiplyUnit(q, 0, [0, 0, 0, 1], 0);
    expectClose(q, [0, 0, 0, 1]);
  });

  it('fromRotationVector is quat.setAxisAngle(axis, |v|), small and large angles', () => {
    for (const scale of [1e-7, 1e-3, 0.04, 0.3, 1, 3]) {
      for (let t = 0; t < 50; t++) {
        const axis = randomUnitAxis();
        const angle = scale * rng.range(0.5, 1);
        const ref = glQuat.setAxisAngle([0, 0, 0, 0] as unknown as glQuat, axis, angle);
        const out = new Float64Array(4);
        Q.fromRotationVector(out, 0, axis.map((v) => v * angle), 0);
        expectClose(out, ref);
      }
    }
  });

  it('toRotationVector is axis · angle from quat.getAxisAngle, the shorter way round', () => {
    for (let t = 0; t < 200; t++) {
      const q = randomUnitQuat();
      const axis = [0, 0, 0];
      let angle = glQuat.getAxisAngle(axis as unknown as [number, number, number], q as glQuat);
      // getAxisAngle gives [0, 2π); the log map takes the rotation of at most π
      const a = angle > Math.PI ? -1 : 1;
      if (angle > Math.PI) angle = 2 * Math.PI - angle;
      const out = new Float64Array(3);
      Q.toRotationVector(out, 0, q, 0);
      expectClose(out, axis.map((v) => a * v * angle), 1e-9);
      expect(Math.hypot(out[0], out[1], out[2])).toBeLessThanOrEqual(Math.PI + 1e-12);
    }
  });

  it('fromMat3 inverts gl-matrix mat3.fromQuat (row-major input)', () => {
    for (let t = 0; t < 200; t++) {
      const q = randomUnitQuat();
      const m = rowMajor(glMat3.fromQuat([0, 0, 0, 0, 0, 0, 0, 0, 0] as unknown as glMat3, q as glQuat));
      const out = [0, 0, 0, 0];
      Q.fromMat3(out, 0, [7, ...m], 1);
      expectSameRotation(out, q);
    }
  });
});

describe('mat3 (row-major) against gl-matrix', () => {
  it('fromQuat is the transpose of gl-matrix mat3.fromQuat, normalising its input', () => {
    for (let t = 0; t < 200; t++) {
      const q = randomUnitQuat();
      const ref = rowMajor(glMat3.fromQuat([0, 0, 0, 0, 0, 0, 0, 0, 0] as unknown as glMat3, q as glQuat));
      const out = new Float64Array(10);
      M3.fromQuat(out, 1, q.map((v) => 3 * v), 0);
      expectClose(out.subarray(1), ref);
    }
    const id = new Float64Array(9);
    M3.fromQuat(id, 0, [0, 0, 0, 0], 0);
    expectClose(id, [1, 0, 0, 0, 1, 0, 0, 0, 1]);
  });

  it('fromAxisCosSin is the rotation part of gl-matrix mat4.fromRotation', () => {
    for (let t = 0; t < 200; t++) {
      const axis = randomUnitAxis();
      const angle = rng.range(-Math.PI, Math.PI);
      const m4 = glMat4.fromRotation(new Array(16).fill(0) as unknown as glMat4, angle, axis) as unknown as number[];
      const ref = [m4[0], m4[4], m4[8], m4[1], m4[5], m4[9], m4[2], m4[6], m4[10]];
      const out = new Float64Array(9);
      M3.fromAxisCosSin(out, 0, [0, ...axis], 1, [Math.cos(angle)], [Math.sin(angle)], 0);
      expectClose(out, ref);
    }
  });

  it('fromMat4 takes the rotation of a column-major 4×4 (gl-matrix mat4.fromRotationTranslation)', () => {
    for (let t = 0; t < 50; t++) {
      const q = randomUnitQuat();
      const m4 = glMat4.fromRotationTranslation(new Array(16).fill(0) as unknown as glMat4, q as glQuat, [1, 2, 3]);
      const out = new Float64Array(9);
      M3.fromMat4(out, 0, m4 as unknown as number[]);
      expectClose(out, rowMajor(glMat3.fromQuat([0, 0, 0, 0, 0, 0, 0, 0, 0] as unknown as glMat3, q as glQuat)));
    }
  });
});
