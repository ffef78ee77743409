/**
 * Robustness: out of reach, fully stretched (singular), joint limits at every
 * iteration, determinism. The damped-least-squares behaviour near
 * singularities is the one described by Buss 2004 §5 (DLS stays finite and
 * points the chain at an unreachable target where the pseudoinverse oscillates);
 * SDLS per Buss & Kim 2005.
 */
import {
  createWorkspace,
  forwardKinematics,
  getPose,
  resetPose,
  setPose,
  setRootTransform,
  solve,
  SOLVER_METHODS,
} from '../../../engine/ik';
import type { IKWorkspace } from '../../../engine/ik';
import { mulberry32 } from '../../../engine/math/random';
import { humanLeg, presetLeg, PRESET_NAMES } from '../../../engine/rig/presets';
import { randomQuat } from './helpers';

/** Reachable targets: FK of seeded random poses inside the limits. */
function reachableTargets(ws: IKWorkspace, count: number, seed: number): Float64Array[] {
  const rng = mulberry32(seed);
  const out: Float64Array[] = [];
  const pose = new Float64Array(ws.nDof);
  for (let k = 0; k < count; k++) {
    for (let i = 0; i < ws.nDof; i++) {
      const lo = Number.isFinite(ws.lo[i]) ? ws.lo[i] : -0.8;
      const hi = Number.isFinite(ws.hi[i]) ? ws.hi[i] : 0.8;
      pose[i] = rng.range(lo, hi);
    }
    setPose(ws, pose);
    out.push(Float64Array.from(forwardKinematics(ws)));
  }
  resetPose(ws);
  return out;
}

/** Swing and twist angles of ball b's quaternion about its twist axis. */
function swingTwist(ws: IKWorkspace, b: number): [number, number] {
  let [x, y, z, w] = Array.from(ws.quat.subarray(4 * b, 4 * b + 4));
  const a = ws.bAxis.subarray(3 * b, 3 * b + 3);
  let t = x * a[0] + y * a[1] + z * a[2];
  if (w < 0) {
    x = -x;
    y = -y;
    z = -z;
    w = -w;
    t = -t;
  }
  const nt = Math.sqrt(t * t + w * w);
  return [2 * Math.acos(Math.min(1, nt)), 2 * Math.atan2(t, w)];
}

/** Describes the first limit violation, or '' (plain loops: calling expect per DOF is slow). */
function limitViolation(ws: IKWorkspace): string {
  for (let i = 0; i < ws.nDof; i++) {
    if (!Number.isFinite(ws.pose[i])) return `dof ${i} not finite`;
    if (ws.dKind[i] === 1) continue;
    if (ws.pose[i] < ws.lo[i] || ws.pose[i] > ws.hi[i]) return `dof ${i} = ${ws.pose[i]} outside [${ws.lo[i]}, ${ws.hi[i]}]`;
  }
  for (let b = 0; b < ws.nBall; b++) {
    if (!ws.bLimited[b]) continue;
    const [sw, tw] = swingTwist(ws, b);
    if (sw > ws.bSwing[b] + 1e-9) return `ball ${b} swing ${sw}`;
    if (tw < ws.bTwistMin[b] - 1e-9 || tw > ws.bTwistMax[b] + 1e-9) return `ball ${b} twist ${tw}`;
  }
  return '';
}

function expectWithinLimits(ws: IKWorkspace) {
  expect(limitViolation(ws)).toBe('');
}

describe('out of reach', () => {
  const chain = humanLeg();
  test.each(['dls', 'sdls', 'adaptive', 'pseudoinverse', 'transpose', 'ccd'] as const)(
    '%s: no NaN; except the undamped pseudoinverse, the leg points at the target and the error stays bounded',
    (method) => {
      const rng = mulberry32(31);
      const ws = createWorkspace(chain, { method, maxIterations: 200, recordErrors: true });
      for (let k = 0; k < 40; k++) {
        resetPose(ws);
        // Below the hip, inside the hip cone, at 1.3–3× the reach.
        const dir = [rng.range(-0.4, 0.4), -1, rng.range(-0.5, 0.5)];
        const l = Math.hypot(dir[0], dir[1], dir[2]);
        const dist = chain.reach * rng.range(1.3, 3);
        const t = dir.map((v) => (v / l) * dist);
        const r = solve(ws, t);
        expect(Number.isFinite(r.positionError)).toBe(true);
        for (const v of r.pose) expect(Number.isFinite(v)).toBe(true);
        if (method === 'pseudoinverse') continue; // undamped: finite, but it may oscillate (Buss 2004 §5)
        const f = ws.foot;
        const cos = (f[0] * t[0] + f[1] * t[1] + f[2] * t[2]) / (Math.hypot(f[0], f[1], f[2]) * dist);
        // The sole offset is off the hip–ankle line, so allow a few degrees.
        expect(Math.acos(Math.min(1, cos))).toBeLessThan((method === 'transpose' ? 8 : 5) * (Math.PI / 180));
        expect(r.positionError).toBeLessThan(dist - chain.reach + 0.06);
        const h = r.errorHistory!;
        if (method === 'dls' || method === 'adaptive' || method === 'sdls') {
          // Damped: the error never blows up above the start.
          for (let i = 1; i < r.errorHistoryLength; i++) expect(h[i]).toBeLessThanOrEqual(h[0] + 1e-9);
        }
      }
    },
  );
});

describe('fully stretched (singular) legs stay finite', () => {
  test.each(SOLVER_METHODS.map((m) => [m]))('%s', (method) => {
    for (const name of PRESET_NAMES) {
      const chain = presetLeg(name);
      const ws = createWorkspace(chain, { method, maxIterations: 50 });
      // A straight pose (every scalar DOF at 0 clamped into range, balls identity), target along and beyond the leg.
      setPose(ws, new Float64Array(ws.nDof));
      const f = Float64Array.from(forwardKinematics(ws));
      for (const s of [1, 1.0001, 1.5]) {
        setPose(ws, new Float64Array(ws.nDof));
        const r = solve(ws, [f[0] * s, f[1] * s, f[2] * s]);
        expect(Number.isFinite(r.positionError)).toBe(true);
        for (const v of r.pose) expect(Number.isFinite(v)).toBe(true);
        for (const v of ws.quat) expect(Number.isFinite(v)).toBe(true);
      }
    }
  });
});

describe('joint limits hold at every iteration', () => {
  test.each(SOLVER_METHODS.map((m) => [m]))('%s on every preset', (method) => {
    const rng = mulberry32(555);
    for (const name of PRESET_NAMES) {
      const chain = presetLeg(name);
      const ws = createWorkspace(chain, { method, maxIterations: 1 });
      for (let k = 0; k < 30; k++) {
        // Anywhere around the hip, including unreachable and behind.
        const t = [rng.range(-1, 1), rng.range(-1.2, 0.5), rng.range(-1, 1)].map((v) => v * chain.reach);
        for (let it = 0; it < 25; it++) {
          solve(ws, t);
          const v = limitViolation(ws);
          if (v) expect(`${name} target ${k} iteration ${it}: ${v}`).toBe('');
        }
      }
    }
  });
});

describe('determinism', () => {
  test('same inputs give bit-identical outputs', () => {
    for (const method of SOLVER_METHODS) {
      const run = () => {
        const ws = createWorkspace(humanLeg(), { method });
        const rng = mulberry32(99);
        const out: number[] = [];
        for (let k = 0; k < 200; k++) {
          setRootTransform(ws, [rng.range(-0.1, 0.1), rng.range(0.8, 1), 0], randomQuat({ ...rng, range: (a, b) => a + (b - a) * 0.01 * rng.next() } as typeof rng));
          const r = solve(ws, [rng.range(-0.3, 0.3), rng.range(0, 0.3), rng.range(-0.3, 0.3)], k % 3 === 0 ? [0, 1, 0.1] : null);
          out.push(r.iterations, r.positionError, r.orientationError, r.limitHits, ...getPose(ws));
        }
        return out;
      };
      const a = run();
      const b = run();
      expect(a.length).toBe(b.length);
      for (let i = 0; i < a.length; i++) expect(Object.is(a[i], b[i])).toBe(true);
    }
  });
});

describe('presets: cold solves from the rest pose', () => {
  test.each(PRESET_NAMES.map((n) => [n]))('%s: DLS, pseudoinverse, SDLS and adaptive reach seeded reachable targets', (name) => {
    const chain = presetLeg(name);
    for (const method of ['dls', 'adaptive', 'sdls', 'pseudoinverse'] as const) {
      const ws = createWorkspace(chain, { method, maxIterations: 100 });
      const targets = reachableTargets(ws, 200, 1234);
      let ok = 0;
      for (const t of targets) {
        resetPose(ws);
        const r = solve(ws, t);
        if (r.positionError < 1e-3) ok++;
        const v = limitViolation(ws);
        if (v) expectWithinLimits(ws);
      }
      // Joint limits make some targets local-minimum traps from the rest pose.
      expect(ok / targets.length).toBeGreaterThanOrEqual(method === 'dls' || method === 'adaptive' ? 0.95 : 0.85);
    }
  });
});

describe('foot orientation (6-row task)', () => {
  test('human leg: sole normal aligns with a tilted ground normal while the sole reaches the target', () => {
    const chain = humanLeg();
    const ws = createWorkspace(chain, { method: 'dls', maxIterations: 100, tolerance: 1e-4, orientationTolerance: 1e-3 });
    const f = Float64Array.from(forwardKinematics(ws));
    for (const [nx, nz] of [
      [0.15, 0],
      [0, 0.2],
      [-0.1, -0.25],
    ]) {
      resetPose(ws);
      const r = solve(ws, [f[0] + 0.05, f[1] + 0.12, f[2] + 0.1], [nx, 1, nz]);
      expect(r.converged).toBe(true);
      expect(r.positionError).toBeLessThan(1e-4);
      expect(r.orientationError).toBeLessThan(1e-3);
    }
  });
});

describe('null-space bias', () => {
  test('pole target moves the knee toward the pole without giving up the foot', () => {
    const chain = humanLeg();
    const target = [0.05, -0.75, 0.15];
    const pole = [0.6, -0.45, 0.4] as [number, number, number];
    const plain = createWorkspace(chain, { maxIterations: 200, tolerance: 1e-5 });
    const biased = createWorkspace(chain, { maxIterations: 200, tolerance: 1e-5, nullSpace: { kind: 'pole', gain: 0.5, pole } });
    const r1 = solve(plain, target);
    const k1 = Array.from(plain.jPos.subarray(3, 6));
    const r2 = solve(biased, target);
    const k2 = Array.from(biased.jPos.subarray(3, 6));
    expect(r1.positionError).toBeLessThan(1e-4);
    expect(r2.positionError).toBeLessThan(2e-4);
    const d = (k: number[]) => Math.hypot(k[0] - pole[0], k[1] - pole[1], k[2] - pole[2]);
    expect(d(k2)).toBeLessThan(d(k1) - 0.01);
  });
  test('rest bias keeps the pose nearer the rest pose', () => {
    const chain = humanLeg();
    const target = [0.1, -0.8, 0.1];
    const plain = createWorkspace(chain, { maxIterations: 200, tolerance: 1e-5 });
    const biased = createWorkspace(chain, { maxIterations: 200, tolerance: 1e-5, nullSpace: { kind: 'rest', gain: 0.3 } });
    // Start both from a pose far from rest.
    const start = Float64Array.from([0.3, 0.4, -0.2, 1.2, 0.4, 0.3]);
    setPose(plain, start);
    setPose(biased, start);
    solve(plain, target);
    const r = solve(biased, target);
    expect(r.positionError).toBeLessThan(2e-4);
    const dist = (ws: IKWorkspace) => {
      let s = 0;
      const p = getPose(ws);
      for (let i = 0; i < ws.nDof; i++) s += (p[i] - ws.restPose[i]) ** 2;
      return Math.sqrt(s);
    };
    expect(dist(biased)).toBeLessThan(dist(plain));
  });
});
