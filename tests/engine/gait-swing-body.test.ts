import { curbCourse, flatCourse, generateCourse, heightAt, maxHeightAlong } from '../../engine/course';
import {
  CRITICAL_SETTLE_2PCT,
  createDampedState,
  createFoldGuard,
  createSwingPlan,
  omegaForSettleTime,
  planSwing,
  stepCriticallyDamped,
  swingPoint,
} from '../../engine/gait';
import { stepResponse, uniformTimes } from '../../engine/metrics';

function lowestClearance(course: ReturnType<typeof flatCourse>, plan: ReturnType<typeof createSwingPlan>) {
  const p = [0, 0, 0];
  let least = Infinity;
  for (let k = 1; k < 400; k++) {
    swingPoint(plan, k / 400, p);
    least = Math.min(least, p[1] - heightAt(course, p[0], p[2]));
  }
  return least;
}

describe('swing path (common practice, no source)', () => {
  it('starts and ends on the given points and rises to step height above the highest ground under it', () => {
    const course = curbCourse(4, 0.12, { cellSize: 0.02 });
    const plan = planSwing(course, createSwingPlan(), 0, 0, 1.5, 0, 0.12, 2.6, 0.08);
    expect(plan.apex).toBeCloseTo(maxHeightAlong(course, 0, 1.5, 0, 2.6) + 0.08, 12);
    const a = [0, 0, 0];
    swingPoint(plan, 0, a);
    expect(a).toEqual([0, 0, 1.5]);
    swingPoint(plan, 1, a);
    expect(a[1]).toBeCloseTo(0.12, 12);
    expect(a[2]).toBeCloseTo(2.6, 12);
    swingPoint(plan, 0.5, a);
    expect(a[1]).toBeCloseTo(0.2, 12);
  });
  it('never dips below the ground, even with a riser right after liftoff (boxier path)', () => {
    const course = curbCourse(4, 0.15, { cellSize: 0.02 });
    // Curb at z = 2; liftoff 2 cm before it.
    const plan = planSwing(course, createSwingPlan(), 0, 0, 1.98, 0, 0.15, 2.8, 0.05);
    expect(plan.boxiness).toBeGreaterThan(0);
    expect(lowestClearance(course, plan)).toBeGreaterThan(-1e-3);
    const flat = planSwing(flatCourse(4), createSwingPlan(), 0, 0, 1, 0, 0, 2, 0.05);
    expect(flat.boxiness).toBe(0);
  });
});

describe('a swing kept clear of the fold (common practice, no source: a leg is not asked to fold tighter than it can)', () => {
  // A quadruped's rear foot stepping from the flat onto a 20° ramp, its hip rising 17 cm over the swing:
  // held at the landing height plus the step height, the sole passes within 0.44 m of a hip that can fold to 0.49 m.
  const course = generateCourse({ cellSize: 0.04, segments: [{ kind: 'flat', length: 3 }, { kind: 'ramp', length: 3, angleDeg: 20 }] });
  const from = [-0.2, 0, 2.883] as const;
  const to = [-0.2, heightAt(course, -0.2, 3.787), 3.787] as const;
  const guard = createFoldGuard();
  guard.hip0.set([-0.185, 0.727, 3.209]);
  guard.hip1.set([-0.19, 0.897, 3.541]);
  guard.least = 0.49;
  /** Closest approach of the sole to the hip (moving evenly from hip0 to hip1) over the middle half of the swing. */
  function closest(plan: ReturnType<typeof createSwingPlan>): number {
    const a = [0, 0, 0];
    let least = Infinity;
    for (let k = 100; k <= 300; k++) {
      const tau = k / 400;
      swingPoint(plan, tau, a);
      const h = [0, 1, 2].map((c) => guard.hip0[c] + (guard.hip1[c] - guard.hip0[c]) * tau);
      least = Math.min(least, Math.hypot(a[0] - h[0], a[1] - h[1], a[2] - h[2]));
    }
    return least;
  }
  it('folds past the limit as a plain swing, and keeps outside it, over the ground, when guarded', () => {
    const plain = planSwing(course, createSwingPlan(), ...from, ...to, 0.072, 0.0129);
    expect(closest(plain)).toBeLessThan(guard.least - 0.02);
    const kept = planSwing(course, createSwingPlan(), ...from, ...to, 0.072, 0.0129, guard);
    expect(closest(kept)).toBeGreaterThan(guard.least - 1e-3);
    expect(lowestClearance(course, kept)).toBeGreaterThan(-1e-3);
    const end = [0, 0, 0];
    swingPoint(kept, 1, end);
    expect(end[1]).toBeCloseTo(to[1], 12);
  });
  it('leaves a swing that stays clear of the fold exactly as it was', () => {
    const far = createFoldGuard();
    far.hip0.set([-0.185, 1.5, 3.209]);
    far.hip1.set([-0.19, 1.7, 3.541]);
    far.least = 0.49;
    const plain = planSwing(course, createSwingPlan(), ...from, ...to, 0.072, 0.0129);
    expect(planSwing(course, createSwingPlan(), ...from, ...to, 0.072, 0.0129, far)).toEqual(plain);
  });
});

describe('body filter: critically damped second-order system (Ogata, Modern Control Engineering, §5-3)', () => {
  it('a step gives 0 % overshoot and settles (2 %) at the set time; ωn·t = 5.834 solves (1 + ωt)e^(−ωt) = 0.02', () => {
    expect((1 + CRITICAL_SETTLE_2PCT) * Math.exp(-CRITICAL_SETTLE_2PCT)).toBeCloseTo(0.02, 5);
    const dt = 1 / 240;
    const n = 2000;
    const s = createDampedState(0);
    const w = omegaForSettleTime(0.3);
    const y = new Float64Array(n);
    for (let i = 1; i < n; i++) {
      stepCriticallyDamped(s, 1, w, dt);
      y[i] = s.value;
    }
    const r = stepResponse(uniformTimes(n, dt), y, { initial: 0, final: 1 });
    expect(r.overshootPercent).toBe(0);
    expect(r.settlingTime).toBeCloseTo(0.3, 3);
  });
  it('matches the closed form x(t) = 1 − (1 + ωt)e^(−ωt) at every step, whatever the step size (Ogata §5-3)', () => {
    const w = 7;
    for (const dt of [1 / 30, 1 / 60, 0.2]) {
      const s = createDampedState(0);
      for (let i = 1; i <= 20; i++) {
        stepCriticallyDamped(s, 1, w, dt);
        const t = i * dt;
        expect(s.value).toBeCloseTo(1 - (1 + w * t) * Math.exp(-w * t), 12);
      }
    }
  });
});
