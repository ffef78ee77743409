/**
 * Planar arms against textbook closed forms.
 * Sources: Spong, Hutchinson & Vidyasagar, Robot Modeling and Control, ch. 1 & 5;
 * Craig, Introduction to Robotics; Buss 2004 (transpose α, DLS); Lynch & Park,
 * Modern Robotics (2017) ch. 6 (3-link exercise). Check values are computed from
 * those closed forms (l1 = l2 = 1 for the 2-link arm).
 */
import {
  createWorkspace,
  dlsStep,
  forwardKinematics,
  jacobian,
  pseudoinverseStep,
  sdlsStep,
  setPose,
  solve,
  transposeStep,
} from '../../../engine/ik';
import { mulberry32 } from '../../../engine/math/random';
import { svdJacobi } from '../../../engine/math/svd';
import { deg, planarArm, wrap } from './helpers';

/** Law of cosines IK (Spong et al. ch. 1; Craig). */
function analytic2(x: number, y: number, l1: number, l2: number, elbow: 1 | -1): [number, number] {
  const D = (x * x + y * y - l1 * l1 - l2 * l2) / (2 * l1 * l2);
  const t2 = Math.atan2(elbow * Math.sqrt(Math.max(0, 1 - D * D)), D);
  const t1 = Math.atan2(y, x) - Math.atan2(l2 * Math.sin(t2), l1 + l2 * Math.cos(t2));
  return [t1, t2];
}

describe('2-link planar arm (Spong et al. ch. 1 & 5; Craig)', () => {
  const l1 = 1;
  const l2 = 1;
  const chain = planarArm([l1, l2]);

  test('FK at (30°, 90°) gives (0.3660, 1.3660) (Spong et al. ch. 1: x = c1 + c12, y = s1 + s12)', () => {
    const ws = createWorkspace(chain);
    setPose(ws, [deg(30), deg(90)]);
    const f = forwardKinematics(ws);
    expect(f[0]).toBeCloseTo(0.366, 4);
    expect(f[1]).toBeCloseTo(1.366, 4);
    // (120°, −90°) reaches the same point.
    setPose(ws, [deg(120), deg(-90)]);
    forwardKinematics(ws);
    expect(ws.foot[0]).toBeCloseTo(0.366, 4);
    expect(ws.foot[1]).toBeCloseTo(1.366, 4);
  });

  test('Jacobian at (30°, 90°) equals the textbook matrix; det = l1·l2·sin θ2; σ = 1.618, 0.618', () => {
    const ws = createWorkspace(chain);
    const t1 = deg(30);
    const t2 = deg(90);
    setPose(ws, [t1, t2]);
    forwardKinematics(ws);
    const J = jacobian(ws, 3);
    const s1 = Math.sin(t1);
    const c1 = Math.cos(t1);
    const s12 = Math.sin(t1 + t2);
    const c12 = Math.cos(t1 + t2);
    const book = [
      [-l1 * s1 - l2 * s12, -l2 * s12],
      [l1 * c1 + l2 * c12, l2 * c12],
    ];
    for (let r = 0; r < 2; r++) for (let c = 0; c < 2; c++) expect(J[6 * c + r]).toBeCloseTo(book[r][c], 12);
    // Quoted values.
    expect(J[0]).toBeCloseTo(-1.366, 4);
    expect(J[6]).toBeCloseTo(-0.866, 4);
    expect(J[1]).toBeCloseTo(0.366, 4);
    expect(J[7]).toBeCloseTo(-0.5, 4);
    expect(J[2]).toBe(0);
    const det = J[0] * J[7] - J[6] * J[1];
    expect(det).toBeCloseTo(l1 * l2 * Math.sin(t2), 12);
    // Singular values of the 2×2 block.
    const a = Float64Array.from([J[0], J[1], J[6], J[7]]); // column-major 2×2
    const u = new Float64Array(4);
    const s = new Float64Array(2);
    const v = new Float64Array(4);
    svdJacobi(a, 2, 2, u, s, v);
    expect(s[0]).toBeCloseTo(1.618, 3);
    expect(s[1]).toBeCloseTo(0.618, 3);
  });

  test('DLS step example: e = (0.1, 0), λ = 0.1 → (−0.049865, −0.036374); inverse → (−0.05, −0.036603) (Buss 2004)', () => {
    const ws = createWorkspace(chain);
    setPose(ws, [deg(30), deg(90)]);
    forwardKinematics(ws);
    jacobian(ws, 3);
    const e = Float64Array.from([0.1, 0, 0, 0, 0, 0]);
    const dq = new Float64Array(2);
    const w = Float64Array.from([1, 1]);
    expect(dlsStep(ws, w, 3, 0.1 * 0.1, e, dq)).toBe(true);
    expect(dq[0]).toBeCloseTo(-0.049865, 6);
    expect(dq[1]).toBeCloseTo(-0.036374, 6);
    // Plain inverse: pseudoinverse of a square full-rank J.
    pseudoinverseStep(ws, w, 3, 1e-9, e, dq);
    expect(dq[0]).toBeCloseTo(-0.05, 6);
    expect(dq[1]).toBeCloseTo(-0.036603, 6);
  });

  test('SDLS (Buss & Kim 2005): with a large γmax it is the pseudoinverse step; no component exceeds γmax', () => {
    const ws = createWorkspace(chain);
    setPose(ws, [deg(30), deg(90)]);
    forwardKinematics(ws);
    jacobian(ws, 3);
    const w = Float64Array.from([1, 1]);
    const e = Float64Array.from([0.1, 0, 0, 0, 0, 0]);
    const a = new Float64Array(2);
    const b = new Float64Array(2);
    sdlsStep(ws, w, 3, 100, e, a);
    pseudoinverseStep(ws, w, 3, 1e-12, e, b);
    expect(a[0]).toBeCloseTo(b[0], 12);
    expect(a[1]).toBeCloseTo(b[1], 12);
    const big = Float64Array.from([1.5, -2, 0, 0, 0, 0]);
    sdlsStep(ws, w, 3, deg(45), big, a);
    expect(Math.max(Math.abs(a[0]), Math.abs(a[1]))).toBeLessThanOrEqual(deg(45) + 1e-12);
  });

  test('Jacobian transpose step uses α = ⟨e, JJᵀe⟩/⟨JJᵀe, JJᵀe⟩ (Buss 2004)', () => {
    const ws = createWorkspace(chain);
    setPose(ws, [deg(30), deg(90)]);
    forwardKinematics(ws);
    const J = jacobian(ws, 3);
    const e = Float64Array.from([0.1, -0.03, 0, 0, 0, 0]);
    const dq = new Float64Array(2);
    transposeStep(ws, Float64Array.from([1, 1]), 3, e, dq);
    // By hand: v = Jᵀe, JJᵀe = J v.
    const v = [J[0] * e[0] + J[1] * e[1], J[6] * e[0] + J[7] * e[1]];
    const jv = [J[0] * v[0] + J[6] * v[1], J[1] * v[0] + J[7] * v[1]];
    const alpha = (e[0] * jv[0] + e[1] * jv[1]) / (jv[0] * jv[0] + jv[1] * jv[1]);
    expect(dq[0]).toBeCloseTo(alpha * v[0], 14);
    expect(dq[1]).toBeCloseTo(alpha * v[1], 14);
  });

  test('100 seeded reachable targets reached within 1e-6 m, matching the analytic branch (Spong et al.)', () => {
    const rng = mulberry32(20260301);
    const ws = createWorkspace(chain, { method: 'dls', lambda: 1e-3, tolerance: 1e-8, maxIterations: 100, maxStepAngle: 0.5 });
    let reached = 0;
    for (let k = 0; k < 100; k++) {
      // Reachable annulus 0.2 < r < 1.95, any direction.
      const r = Math.sqrt(rng.range(0.2 * 0.2, 1.95 * 1.95));
      const a = rng.range(-Math.PI, Math.PI);
      const x = r * Math.cos(a);
      const y = r * Math.sin(a);
      const elbow: 1 | -1 = k % 2 === 0 ? 1 : -1;
      const [t1, t2] = analytic2(x, y, l1, l2, elbow);
      // A suitable start: the right branch, perturbed.
      setPose(ws, [t1 + rng.range(-0.4, 0.4), elbow * Math.max(0.3, Math.abs(t2) + rng.range(-0.3, 0.3))]);
      const res = solve(ws, [x, y, 0]);
      expect(Number.isFinite(res.positionError)).toBe(true);
      expect(res.positionError).toBeLessThan(1e-6);
      expect(Math.abs(wrap(res.pose[0] - t1))).toBeLessThan(1e-5);
      expect(Math.abs(wrap(res.pose[1] - t2))).toBeLessThan(1e-5);
      if (res.positionError < 1e-6) reached++;
    }
    expect(reached).toBe(100);
  });

  test('both elbow branches of one target are reachable from suitable starts', () => {
    const ws = createWorkspace(chain, { method: 'dls', lambda: 1e-3, tolerance: 1e-9, maxIterations: 100 });
    const target = [0.366025403784, 1.366025403784, 0];
    setPose(ws, [deg(20), deg(60)]);
    let r = solve(ws, target);
    expect(r.positionError).toBeLessThan(1e-6);
    expect(wrap(r.pose[0])).toBeCloseTo(deg(30), 5);
    expect(wrap(r.pose[1])).toBeCloseTo(deg(90), 5);
    setPose(ws, [deg(140), deg(-60)]);
    r = solve(ws, target);
    expect(r.positionError).toBeLessThan(1e-6);
    expect(wrap(r.pose[0])).toBeCloseTo(deg(120), 5);
    expect(wrap(r.pose[1])).toBeCloseTo(deg(-90), 5);
  });

  test('every Jacobian method reaches seeded targets on the 2-link arm', () => {
    const rng = mulberry32(7);
    for (const method of ['dls', 'pseudoinverse', 'sdls', 'adaptive', 'transpose', 'ccd'] as const) {
      const ws = createWorkspace(chain, { method, tolerance: 1e-6, maxIterations: method === 'transpose' ? 2000 : 300 });
      for (let k = 0; k < 20; k++) {
        const r = Math.sqrt(rng.range(0.3 * 0.3, 1.9 * 1.9));
        const a = rng.range(-Math.PI, Math.PI);
        setPose(ws, [a + 0.3, 0.8]);
        const res = solve(ws, [r * Math.cos(a), r * Math.sin(a), 0]);
        expect(res.positionError).toBeLessThan(1e-6);
      }
    }
  });
});

describe('planar 3-link (3, 2, 1) to (x, y, φ) = (4, 2, 0) (Lynch & Park, Modern Robotics, ch. 6)', () => {
  const chain = planarArm([3, 2, 1]);
  const solutions = [
    [0, 90, -90],
    [67.38, -90, 22.62],
  ].map((s) => s.map(deg));

  test.each([
    ['dls', [deg(10), deg(60), deg(-60)]],
    ['dls', [deg(60), deg(-60), deg(10)]],
    ['pseudoinverse', [deg(10), deg(70), deg(-70)]],
    ['adaptive', [deg(50), deg(-80), deg(30)]],
    ['sdls', [deg(10), deg(60), deg(-60)]],
  ] as const)('%s from %j converges to one of the two published solutions', (method, start) => {
    const ws = createWorkspace(chain, {
      method,
      lambda: 1e-3,
      tolerance: 1e-7,
      orientationTolerance: 1e-7,
      orientationWeight: 1,
      maxIterations: 500,
    });
    setPose(ws, start as unknown as number[]);
    // φ = 0: the last link (sole normal = +X of the last frame) along +X.
    const r = solve(ws, [4, 2, 0], [1, 0, 0]);
    expect(r.positionError).toBeLessThan(1e-6);
    expect(r.orientationError).toBeLessThan(1e-6);
    const dist = solutions.map((s) => Math.max(...s.map((v, i) => Math.abs(wrap(r.pose[i] - v)))));
    // Published values are given to 0.001° (3 decimals).
    expect(Math.min(...dist)).toBeLessThan(deg(0.001));
  });
});
