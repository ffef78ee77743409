/**
 * Trials on a turn: the gauntlet's turning course, a loop of radius 2 m, walked by every preset rig for a full
 * lap at its own walking speed.
 */
import { generateCourse } from '../../../engine/course';
import { GAUNTLET, TURN_RADIUS } from '../../../engine/course/gauntlet';
import { createTrial, defaultLegSetup, finishTrial, PRESET_RIG_NAMES, presetRig, resolveGait, runTrial, stepTrial, type Trial } from '../../../engine/gait';
import { detectStumbles } from '../../../engine/metrics/detect-series';

const turn = GAUNTLET.find((c) => c.name === 'turn: 2 m circle')!;

/**
 * Closest distance between segments p1q1 and p2q2 in 3D: the clamped closest-points method of Ericson,
 * Real-Time Collision Detection (2005), §5.1.9.
 */
function segmentDistance(p1: ArrayLike<number>, q1: ArrayLike<number>, p2: ArrayLike<number>, q2: ArrayLike<number>): number {
  const d1 = [q1[0] - p1[0], q1[1] - p1[1], q1[2] - p1[2]];
  const d2 = [q2[0] - p2[0], q2[1] - p2[1], q2[2] - p2[2]];
  const r = [p1[0] - p2[0], p1[1] - p2[1], p1[2] - p2[2]];
  const dot = (a: number[], b: number[]) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const a = dot(d1, d1);
  const e = dot(d2, d2);
  const f = dot(d2, r);
  const clamp = (x: number) => (x < 0 ? 0 : x > 1 ? 1 : x);
  let s: number;
  let t: number;
  if (a <= 1e-12 && e <= 1e-12) {
    s = 0;
    t = 0;
  } else if (a <= 1e-12) {
    s = 0;
    t = clamp(f / e);
  } else {
    const c = dot(d1, r);
    if (e <= 1e-12) {
      t = 0;
      s = clamp(-c / a);
    } else {
      const b = dot(d1, d2);
      const denom = a * e - b * b;
      s = denom > 1e-12 ? clamp((b * f - c * e) / denom) : 0;
      t = (b * s + f) / e;
      if (t < 0) {
        t = 0;
        s = clamp(-c / a);
      } else if (t > 1) {
        t = 1;
        s = clamp((b - c) / a);
      }
    }
  }
  const dx = p1[0] + d1[0] * s - (p2[0] + d2[0] * t);
  const dy = p1[1] + d1[1] * s - (p2[1] + d2[1] * t);
  const dz = p1[2] + d1[2] * s - (p2[2] + d2[2] * t);
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/** The leg as a polyline: its joints (hip first) and the sole. */
function legPoints(t: Trial, i: number): Float64Array[] {
  const ws = t.solvers[i];
  const pts: Float64Array[] = [];
  for (let k = 0; k < ws.nJoints; k++) pts.push(ws.jPos.slice(3 * k, 3 * k + 3));
  pts.push(ws.foot.slice());
  return pts;
}

function closestLegs(t: Trial): number {
  let least = Infinity;
  for (let i = 0; i < t.legs; i++) {
    const a = legPoints(t, i);
    for (let j = i + 1; j < t.legs; j++) {
      const b = legPoints(t, j);
      for (let u = 0; u + 1 < a.length; u++) for (let v = 0; v + 1 < b.length; v++) least = Math.min(least, segmentDistance(a[u], a[u + 1], b[v], b[v + 1]));
    }
  }
  return least;
}

describe('the segment distance used below', () => {
  it('matches hand-worked cases: crossing, parallel and end-to-end segments (textbook geometry)', () => {
    expect(segmentDistance([0, 0, 0], [1, 0, 0], [0.5, -1, 1], [0.5, 1, 1])).toBeCloseTo(1, 12);
    expect(segmentDistance([0, 0, 0], [1, 0, 0], [0, 0.3, 0], [1, 0.3, 0])).toBeCloseTo(0.3, 12);
    expect(segmentDistance([0, 0, 0], [1, 0, 0], [2, 0, 0], [3, 0, 0])).toBeCloseTo(1, 12);
    expect(segmentDistance([0, 0, 0], [1, 1, 0], [0, 1, 0], [1, 0, 0])).toBeCloseTo(0, 12);
  });
});

describe.each(PRESET_RIG_NAMES)('%s on a 2 m circle', (name) => {
  const rig = presetRig(name);
  const setup = defaultLegSetup(rig);
  const course = generateCourse(turn.recipe);
  let t: Trial;
  let r: ReturnType<typeof finishTrial>;
  let least = Infinity;
  let headingTurned = 0;
  beforeAll(() => {
    t = createTrial(rig, setup, course, { duration: 120, recordRate: 60 });
    let last = t.heading;
    // One lap: the body's distance along the loop reaches its length.
    while (t.motion.s < t.track!.length && stepTrial(t)) {
      least = Math.min(least, closestLegs(t));
      let d = t.heading - last;
      d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
      headingTurned += d;
      last = t.heading;
    }
    r = finishTrial(t);
  });

  it('walks a full lap at its walking speed, the body turning once round (textbook geometry: a lap is 2πr)', () => {
    expect(t.motion.s).toBeGreaterThanOrEqual(t.track!.length);
    expect(t.track!.length).toBeCloseTo(2 * Math.PI * TURN_RADIUS, 1);
    expect(Math.abs(Math.abs(headingTurned) - 2 * Math.PI)).toBeLessThan(0.05);
    // The body stays on the circle.
    expect(Math.abs(Math.hypot(t.bodyPos[0], t.bodyPos[2] - 3.5) - TURN_RADIUS)).toBeLessThan(0.01);
  });

  it('does not skid, and no leg passes within 2 cm of another (common practice, no source)', () => {
    expect(r.metrics.steps).toBeGreaterThan(4 * t.legs);
    expect(r.metrics.stumbles.skid.count).toBe(0);
    expect(least).toBeGreaterThan(0.02);
  });

});

describe('a setup that cannot keep its feet on a turn', () => {
  const rig = presetRig('quadruped');
  const setup = defaultLegSetup(rig);
  // One heavily damped iteration a frame: the stance feet lag behind the turning hips and are dragged.
  setup.solver.lambda = 2;
  setup.solver.maxIterations = 1;
  setup.solver.warmStart = 'previous';
  const course = generateCourse(turn.recipe);
  const r = runTrial(rig, setup, course, { duration: 10, recordRate: 60 });

  it('is caught skidding there (common practice, no source: a foot dragged round the turn is a skid)', () => {
    expect(r.metrics.stumbles.skid.count).toBeGreaterThan(0);
  });

  it('has its stumbles on the turn found again by the detector over its recorded series (the metrics hold on turns)', () => {
    const offline = detectStumbles(r.series, course);
    const key = (e: { kind: string; time: number; leg: number }) => `${e.kind}/${e.leg}/${Math.round(e.time * 60)}`;
    expect(offline.events().map(key)).toEqual(r.metrics.events.map(key));
    expect(offline.steps).toBe(r.metrics.steps);
  });
});

describe('a walk path with a speed of its own', () => {
  it.each(PRESET_RIG_NAMES)('%s walks an open S-path at its speed, the cadence by the rule, and stops at its end (Alexander 1976: cadence ∝ v^0.4)', (name) => {
    const rig = presetRig(name);
    const setup = defaultLegSetup(rig);
    const gait = resolveGait(setup.gait, rig);
    const speed = 0.7 * gait.speed;
    const course = generateCourse({
      width: 4,
      segments: [{ kind: 'flat', length: 14 }],
      walkPath: { points: [{ x: 0, z: 2 }, { x: 0.8, z: 5 }, { x: -0.8, z: 8 }, { x: 0, z: 11 }], speed },
    });
    const t = createTrial(rig, setup, course, { duration: 120 });
    let longest = 0;
    while (stepTrial(t)) longest = Math.max(longest, t.cycleTime);
    const r = finishTrial(t);
    // It ends where the path ends, having walked it at the path's speed (the pace only slows on rough ground).
    expect(t.motion.s).toBeGreaterThanOrEqual(t.track!.length);
    expect(t.motion.s).toBeLessThan(t.track!.length + speed / 30);
    expect(r.metrics.simSeconds).toBeCloseTo(t.track!.length / speed, 0);
    expect(Math.hypot(t.bodyPos[0], t.bodyPos[2] - 11)).toBeLessThan(0.05);
    // The cycle is T0·(v/v0)^−0.4 (the fastest foot a little faster on the bends), shortened on sharp turns.
    const rule = gait.cycleTime * Math.pow(0.7, -0.4);
    expect(longest).toBeLessThanOrEqual(rule + 1e-12);
    expect(longest).toBeGreaterThan(0.97 * rule);
    expect(r.metrics.stumbles.skid.count).toBe(0);
  });
});

describe('a walk path too short to walk', () => {
  it('is refused, naming its length and the stride (common practice, no source)', () => {
    const rig = presetRig('biped');
    const course = generateCourse({ segments: [{ kind: 'flat', length: 4 }], walkPath: { points: [{ x: 0, z: 1 }, { x: 0, z: 1.3 }] } });
    expect(() => createTrial(rig, defaultLegSetup(rig), course)).toThrow(/course too short: its walk path is 0\.30 m long, less than one 1\.\d\d m stride/);
  });
});
