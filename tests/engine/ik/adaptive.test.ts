/**
 * Adaptive damping. Nakamura & Hanafusa 1986: λ² = λ0²(1 − w/w0)² for
 * manipulability w = √det(JJᵀ) below w0, 0 above. Sugihara 2011 (IEEE T-RO
 * 27(5)): Levenberg–Marquardt with damping E + w̄, E = ½eᵀe the error energy.
 * One adaptive step must equal a DLS step with that damping.
 */
import {
  createWorkspace,
  dlsStep,
  forwardKinematics,
  getPose,
  jacobian,
  manipulability,
  setPose,
  solve,
} from '../../../engine/ik';
import { mulberry32 } from '../../../engine/math/random';
import { humanLeg } from '../../../engine/rig/presets';
import { deg, planarArm } from './helpers';

function oneStep(mode: 'error' | 'manipulability', start: number[], target: number[], opts = {}) {
  const chain = planarArm([1, 1]);
  const ws = createWorkspace(chain, { method: 'adaptive', adaptiveMode: mode, maxIterations: 1, maxStepAngle: 10, clampDistance: Infinity, tolerance: 0, ...opts });
  setPose(ws, start);
  solve(ws, target);
  const after = Array.from(getPose(ws));
  // Reference: the same step by hand.
  const ref = createWorkspace(chain);
  setPose(ref, start);
  const f = forwardKinematics(ref);
  jacobian(ref, 3);
  const e = Float64Array.from([target[0] - f[0], target[1] - f[1], target[2] - f[2], 0, 0, 0]);
  return { ws, ref, e, after, start };
}

describe('adaptive damping', () => {
  test("'error' (Sugihara 2011): the step is DLS with λ² = ½‖e‖² + w̄", () => {
    const { ref, e, after, start } = oneStep('error', [deg(30), deg(90)], [0.5, 1.2, 0], { lmBias: 1e-3 });
    const l2 = 0.5 * (e[0] * e[0] + e[1] * e[1] + e[2] * e[2]) + 1e-3;
    const dq = new Float64Array(2);
    dlsStep(ref, Float64Array.from([1, 1]), 3, l2 + 1e-14, e, dq);
    expect(after[0]).toBeCloseTo(start[0] + dq[0], 12);
    expect(after[1]).toBeCloseTo(start[1] + dq[1], 12);
  });

  test("'manipulability' (Nakamura & Hanafusa 1986): no damping above w0, λ0²(1 − w/w0)² below", () => {
    const chain = humanLeg();
    const start = [0.1, 0.05, -0.1, 0.6, -0.2, 0.05];
    const target = [0.03, -0.8, 0.12];
    const ref = createWorkspace(chain);
    setPose(ref, start);
    const f = forwardKinematics(ref);
    jacobian(ref, 3);
    const e = Float64Array.from([target[0] - f[0], target[1] - f[1], target[2] - f[2], 0, 0, 0]);
    const w = manipulability(ref, ref.weight, 3);
    expect(w).toBeGreaterThan(0);
    for (const [w0, l2] of [
      [w / 2, 0], // above the threshold: undamped
      [2 * w, 0.3 * 0.3 * 0.25], // below: λ0²(1 − w/w0)² with w/w0 = 1/2
    ]) {
      const ws = createWorkspace(chain, {
        method: 'adaptive',
        adaptiveMode: 'manipulability',
        manipulabilityThreshold: w0,
        lambda: 0.3,
        maxIterations: 1,
        maxStepAngle: 10,
        clampDistance: Infinity,
        tolerance: 0,
        resolveSaturated: false,
      });
      setPose(ws, start);
      solve(ws, target);
      const dq = new Float64Array(6);
      dlsStep(ref, ref.weight, 3, l2 + 1e-14, e, dq);
      // Scalar DOFs (3: knee, 4–5: ankle) move by exactly the step.
      for (const i of [3, 4, 5]) expect(ws.pose[i]).toBeCloseTo(start[i] + dq[i], 12);
    }
  });

  test('both modes reach seeded targets on the human leg and stay finite near full stretch', () => {
    for (const mode of ['error', 'manipulability'] as const) {
      const ws = createWorkspace(humanLeg(), { method: 'adaptive', adaptiveMode: mode, maxIterations: 100 });
      const rng = mulberry32(8);
      let ok = 0;
      for (let k = 0; k < 50; k++) {
        const t = [rng.range(-0.2, 0.2), rng.range(-0.9, -0.6), rng.range(-0.2, 0.3)];
        const r = solve(ws, t);
        expect(Number.isFinite(r.positionError)).toBe(true);
        if (r.positionError < 1e-3) ok++;
      }
      expect(ok).toBeGreaterThanOrEqual(48);
      const r = solve(ws, [0, -3, 0]);
      expect(Number.isFinite(r.positionError)).toBe(true);
      for (const v of r.pose) expect(Number.isFinite(v)).toBe(true);
    }
  });
});
