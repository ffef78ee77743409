/**
 * The driven runtime: the same feet as a trial when driven the same way, any frame time, the game's own ground,
 * turning, stopping, and a ground callback that fails.
 */
import { createHeightfieldGrid, type Heightfield } from '../../../engine/course';
import { defaultLegSetup, PRESET_RIG_NAMES, presetRig, resolveGait, runTrial } from '../../../engine/gait';
import { mulberry32 } from '../../../engine/math/random';
import { createRigRuntime, type GroundQuery, type LegRuntime, type LegRuntimeError } from '../../../engine/profile/runtime';

const DEG = Math.PI / 180;

/** A flat heightfield w × l m. */
function flat(width: number, length: number, cell = 0.05): Heightfield {
  return createHeightfieldGrid(Math.round(width / cell) + 1, Math.round(length / cell) + 1, cell, 0);
}

/** A plane rising at `tilt` toward azimuth `toward` (rad about +Y from +Z): height and unit normal (plane geometry). */
function tiltedPlane(tilt: number, toward: number) {
  const gx = Math.tan(tilt) * Math.sin(toward);
  const gz = Math.tan(tilt) * Math.cos(toward);
  const n = 1 / Math.sqrt(gx * gx + 1 + gz * gz);
  const height = (x: number, z: number) => gx * x + gz * z;
  const query: GroundQuery = (x, z, normal) => {
    normal[0] = -gx * n;
    normal[1] = n;
    normal[2] = -gz * n;
    return height(x, z);
  };
  return { height, query };
}

function feet(legs: LegRuntime): number[] {
  const out: number[] = [];
  const f = new Float64Array(3);
  for (let i = 0; i < legs.legNames.length; i++) out.push(...legs.footPosition(i, f));
  return out;
}

describe.each(PRESET_RIG_NAMES)('the runtime driven straight, %s', (name) => {
  const rig = presetRig(name);
  const setup = defaultLegSetup(rig);
  const course = flat(2, 40);

  it('puts the feet exactly where a trial of record does, frame by frame (the trial is the reference)', () => {
    const trial = runTrial(rig, setup, course, { duration: 8, recordRate: 60 });
    const legs = createRigRuntime(rig, setup, course);
    const speed = resolveGait(setup.gait, rig).speed;
    const s = trial.series;
    for (let k = 1; k < s.length; k++) {
      legs.drive(0, speed, 0);
      legs.update(1 / 60);
      const f = feet(legs);
      // The series keeps float32 copies of the same doubles.
      for (let a = 0; a < f.length; a++) expect(Math.fround(f[a])).toBe(s.foot[k * s.legs * 3 + a]);
    }
    expect(legs.frame).toBe(s.length - 1);
  });

  it('draws the feet within 1 mm of the fixed-step walk at the same instants under random frame times (Fiedler 2004: fixed steps, blended)', () => {
    // The fixed-step walk: one step per call, feet kept per step (step k at time k/60).
    const fixed = createRigRuntime(rig, setup, course);
    const steps: number[][] = [feet(fixed)];
    for (let k = 0; k < 6 * 60; k++) {
      fixed.drive(0.2, 0.8, 0.3);
      fixed.step();
      steps.push(feet(fixed));
    }
    const legs = createRigRuntime(rig, setup, course);
    const rng = mulberry32(16);
    const h = legs.timeStep;
    let worst = 0;
    let frames = 0;
    while (legs.time < 5.5) {
      legs.drive(0.2, 0.8, 0.3);
      legs.update(rng.range(1 / 144, 1 / 20));
      const t = legs.time;
      const k = Math.min(Math.floor(t / h + 1e-9), steps.length - 2);
      const u = t / h - k;
      const f = feet(legs);
      for (let a = 0; a < f.length; a++) worst = Math.max(worst, Math.abs(f[a] - (steps[k][a] + (steps[k + 1][a] - steps[k][a]) * u)));
      frames++;
    }
    expect(frames).toBeGreaterThan(100);
    expect(worst).toBeLessThan(0.001);
  });
});

describe('the game\'s ground', () => {
  it.each(PRESET_RIG_NAMES)('%s: a callback of a plane tilted 10° gives the feet of that plane as a heightfield, within 1e-9 m', (name) => {
    const rig = presetRig(name);
    const setup = defaultLegSetup(rig);
    const plane = tiltedPlane(10 * DEG, 30 * DEG);
    // The plane sampled on a grid: bilinear interpolation of a plane is the plane itself (numerical analysis).
    const hf = flat(6, 24);
    for (let r = 0; r < hf.rows; r++) for (let c = 0; c < hf.cols; c++) hf.heights[r * hf.cols + c] = plane.height((c - (hf.cols - 1) / 2) * hf.cellSize, r * hf.cellSize);
    const options = { position: [0, 3] as const, groundSpacing: hf.cellSize };
    const a = createRigRuntime(rig, setup, hf, options);
    const b = createRigRuntime(rig, setup, plane.query, options);
    let worst = 0;
    for (let k = 0; k < 5 * 60; k++) {
      a.drive(0.1, 0.9, 0.2);
      b.drive(0.1, 0.9, 0.2);
      a.update(1 / 60);
      b.update(1 / 60);
      const fa = feet(a);
      const fb = feet(b);
      for (let j = 0; j < fa.length; j++) worst = Math.max(worst, Math.abs(fa[j] - fb[j]));
    }
    expect(a.lastError).toBeNull();
    expect(b.lastError).toBeNull();
    expect(worst).toBeLessThan(1e-9);
    // And the feet stand on the plane: the test is not two runtimes agreeing on nothing.
    const f = feet(b);
    let planted = 0;
    for (let i = 0; i < b.legNames.length; i++) {
      if (!b.inStance(i)) continue;
      planted++;
      expect(Math.abs(f[3 * i + 1] - plane.height(f[3 * i], f[3 * i + 2]))).toBeLessThan(0.01);
    }
    expect(planted).toBeGreaterThan(0);
  });

  it.each([
    ['throws', (): number => {
      throw new Error('no collider here');
    }, /threw.*no collider here/],
    ['returns NaN', (): number => NaN, /returned NaN/],
  ] as const)('a callback that %s is reported once, the last good pose is held and nothing is NaN (common practice, no source)', (_what, bad, message) => {
    const rig = presetRig('quadruped');
    const setup = defaultLegSetup(rig);
    let broken = false;
    const query: GroundQuery = (x, z, n) => (broken ? bad() : ((n[0] = 0), (n[1] = 1), (n[2] = 0), 0));
    const errors: LegRuntimeError[] = [];
    const legs = createRigRuntime(rig, setup, query, { onError: (e) => errors.push(e) });
    for (let k = 0; k < 60; k++) {
      legs.drive(0, 1, 0);
      legs.update(1 / 60);
    }
    const held = feet(legs);
    const body = Array.from(legs.bodyPosition());
    broken = true;
    for (let k = 0; k < 90; k++) {
      legs.drive(0, 1, 0);
      legs.update(1 / 60);
      const f = feet(legs);
      for (const v of [...f, ...legs.bodyPosition(), ...legs.bodyRotation()]) expect(Number.isFinite(v)).toBe(true);
      expect(f).toEqual(held);
      expect(Array.from(legs.bodyPosition())).toEqual(body);
      for (let i = 0; i < legs.legNames.length; i++) for (let j = 0; j < legs.jointIndices(i).length; j++) expect(legs.jointWorldMatrix(i, j).every(Number.isFinite)).toBe(true);
    }
    expect(errors).toHaveLength(1);
    expect(errors[0].message).toMatch(message);
    expect(legs.lastError?.message).toBe(errors[0].message);
    // The ground comes back: the walk goes on from where it was.
    broken = false;
    for (let k = 0; k < 30; k++) {
      legs.drive(0, 1, 0);
      legs.update(1 / 60);
    }
    expect(legs.bodyPosition()[2]).toBeGreaterThan(body[2] + 0.2);
    expect(errors).toHaveLength(1);
  });
});

describe.each(PRESET_RIG_NAMES)('driving %s', (name) => {
  const rig = presetRig(name);
  const setup = defaultLegSetup(rig);
  const gait = resolveGait(setup.gait, rig);
  const ground: GroundQuery = (x, z, n) => ((n[0] = 0), (n[1] = 1), (n[2] = 0), 0);

  function run(legs: LegRuntime, seconds: number, vx: number, vz: number, w: number) {
    for (let k = 0; k < seconds * 60; k++) {
      legs.drive(vx, vz, w);
      legs.update(1 / 60);
    }
  }

  it('follows a change of speed, the cycle following by the documented rule (Alexander 1976: cadence ∝ v^0.4)', () => {
    const legs = createRigRuntime(rig, setup, ground, { standing: true, watchStumbles: true });
    const slow = 0.5 * gait.speed;
    run(legs, 4, 0, slow, 0);
    // The body's speed is the command's, unless the ground asks for a slower pace (pace.ts).
    expect(Math.abs(legs.speed - slow)).toBeLessThan(0.02 * slow);
    // T(v) = T0·(v/v0)^(2·0.3 − 1), within [0.6, 2]·T0.
    expect(legs.cycleTime).toBeCloseTo(Math.min(2 * gait.cycleTime, gait.cycleTime * Math.pow(0.5, -0.4)), 9);
    run(legs, 4, 0, gait.speed, 0);
    expect(legs.cycleTime).toBeCloseTo(gait.cycleTime, 12);
    expect(Array.from(legs.stumbleCounts())).toEqual([0, 0, 0, 0, 0]);
  });

  it('turns in place, then comes to a planted rest when told to stop (common practice, no source)', () => {
    const legs = createRigRuntime(rig, setup, ground, { standing: true, watchStumbles: true });
    expect(legs.resting).toBe(true);
    const q = new Float64Array(4);
    run(legs, 4, 0, 0, 0.8);
    const heading = 2 * Math.atan2(legs.bodyRotation(q)[1], q[3]);
    expect(Math.abs(heading)).toBeGreaterThan(1.5);
    const at = Array.from(legs.bodyPosition());
    expect(Math.hypot(at[0], at[2])).toBeLessThan(0.02);
    expect(legs.resting).toBe(false);
    run(legs, 3, 0, 0, 0);
    expect(legs.resting).toBe(true);
    for (let i = 0; i < legs.legNames.length; i++) expect(legs.inStance(i)).toBe(true);
    // At rest the feet stay where they are planted (the body may still settle a little above them).
    const still = feet(legs);
    run(legs, 1, 0, 0, 0);
    feet(legs).forEach((v, k) => expect(Math.abs(v - still[k])).toBeLessThan(0.001));
    expect(Array.from(legs.stumbleCounts())).toEqual([0, 0, 0, 0, 0]);
  });

  it('walks a full lap of a 2 m circle driven by velocity and turn rate, without a skid (common practice, no source)', () => {
    const legs = createRigRuntime(rig, setup, ground, { watchStumbles: true });
    const v = Math.min(gait.speed, 1);
    const w = v / 2;
    const q = new Float64Array(4);
    for (let k = 0; k < Math.ceil(((2 * Math.PI) / w) * 60); k++) {
      const heading = 2 * Math.atan2(legs.bodyRotation(q)[1], q[3]);
      legs.drive(v * Math.sin(heading), v * Math.cos(heading), w);
      legs.update(1 / 60);
    }
    const skid = legs.stumbleCounts()[1];
    expect(skid).toBe(0);
  });

  it('follows the body pose the game gives it, stepping with it (common practice, no source)', () => {
    const legs = createRigRuntime(rig, setup, ground, { standing: true, position: [0, 0] });
    const v = 0.5 * gait.speed;
    let t = 0;
    for (let k = 0; k < 4 * 60; k++) {
      t += 1 / 60;
      legs.follow(0, v * t, 0);
      legs.update(1 / 60);
    }
    const p = legs.bodyPosition();
    expect(p[2]).toBeCloseTo(v * t, 1);
    let planted = 0;
    const f = feet(legs);
    for (let i = 0; i < legs.legNames.length; i++) {
      // The feet came along under the body.
      expect(Math.abs(f[3 * i + 2] - p[2])).toBeLessThan(rig.legs[i].chain.reach);
      if (legs.inStance(i)) planted++;
    }
    expect(planted).toBeGreaterThan(0);
  });
});
