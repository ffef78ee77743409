/**
 * Walking on structured ground: where feet are set down on stairs and across gaps, how swings clear
 * nosings, and how a leg recovers after it has lost its target.
 */
import { CODE_STAIRS, generateCourse, heightAt, heightfieldGround, type Heightfield } from '../../engine/course';
import { createTrial, defaultLegSetup, presetRig, stepTrial, type PresetRigName, type Trial } from '../../engine/gait';
import { PIT_GRADE, pitDepth } from '../../engine/gait/foothold';

const LEAD = 3;
const STEPS = 8;
/** IBC 2021 §1011.5.2 geometry: 178 mm riser, 279 mm tread. */
function codeStairs(direction: 'up' | 'down'): Heightfield {
  return generateCourse({ cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'stairs', steps: STEPS, ...CODE_STAIRS, direction }, { kind: 'flat', length: LEAD }] });
}
/** Nosing positions along the walk: the edges at the start of each tread. */
const NOSINGS = Array.from({ length: STEPS }, (_, k) => LEAD + k * CODE_STAIRS.tread);

/** Run a trial frame by frame, calling `each` after every frame. */
function walk(t: Trial, each: (t: Trial) => void): void {
  while (stepTrial(t)) each(t);
}

describe.each<[PresetRigName, 'up' | 'down']>([
  ['biped', 'up'],
  ['quadruped', 'down'],
  ['hexapod', 'down'],
])('%s on code stairs %s', (name, direction) => {
  const rig = presetRig(name);
  const course = codeStairs(direction);
  const t = createTrial(rig, defaultLegSetup(rig), course, { duration: 40 });
  let nearestPlant = Infinity;
  let leastClearance = Infinity;
  let touchdowns = 0;
  const wasStance = Uint8Array.from(t.stance);
  walk(t, (tr) => {
    for (let i = 0; i < tr.legs; i++) {
      const z = tr.plant[3 * i + 2];
      if (tr.stance[i] && !wasStance[i]) {
        touchdowns++;
        for (const n of NOSINGS) nearestPlant = Math.min(nearestPlant, Math.abs(z - n));
      }
      wasStance[i] = tr.stance[i];
      if (!tr.stance[i]) {
        // Over a nosing: the sole's height above the tread edge it passes.
        const f = tr.solvers[i].foot;
        for (const n of NOSINGS) {
          if (Math.abs(f[2] - n) < 0.01) leastClearance = Math.min(leastClearance, f[1] - heightAt(course, f[0], n + 0.005));
        }
      }
    }
  });
  it('sets every foot down with its sole centre more than 3 cm from a nosing (common practice, no source)', () => {
    expect(touchdowns).toBeGreaterThan(4 * rig.legs.length);
    expect(nearestPlant).toBeGreaterThan(0.03);
  });
  it('clears every nosing it swings over by at least 1.29 cm (Winter 1992, minimum toe clearance)', () => {
    expect(leastClearance).toBeGreaterThanOrEqual(0.0129);
  });
});

describe('a gap narrower than the leg can reach across', () => {
  // Two 25 cm gaps, 60 cm deep (deeper than any preset leg reaches from its hip): no foot may land inside.
  const course = generateCourse({ cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'trench', length: 1.5, width: 0.25, depth: 0.6 }, { kind: 'flat', length: 1.5 }, { kind: 'trench', length: 1.5, width: 0.25, depth: 0.6 }, { kind: 'flat', length: LEAD }] });
  const gaps = [LEAD + 0.625, LEAD + 3 + 0.625].map((a) => [a, a + 0.25]);
  it.each<PresetRigName>(['biped', 'quadruped'])('%s: no foothold is chosen inside a gap (common practice, no source)', (name) => {
    const rig = presetRig(name);
    const t = createTrial(rig, defaultLegSetup(rig), course, { duration: 40 });
    let inside = 0;
    let plants = 0;
    const was = Uint8Array.from(t.stance);
    walk(t, (tr) => {
      for (let i = 0; i < tr.legs; i++) {
        if (tr.stance[i] && !was[i]) {
          plants++;
          const z = tr.plant[3 * i + 2];
          if (gaps.some(([a, b]) => z > a && z < b)) inside++;
        }
        was[i] = tr.stance[i];
      }
    });
    expect(plants).toBeGreaterThan(10);
    expect(inside).toBe(0);
  });
});

describe('a trench the legs could reach down into', () => {
  // Two 20 cm trenches, 30 cm deep: shallow enough that every preset leg reaches the floor from its hip, so
  // reach alone does not keep a foot out; nothing under a sole in the middle is an edge either. The pit term
  // of the foothold cost must (common practice, no source: a foot is not set down in a trench it can step over).
  const course = generateCourse({ cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'trench', length: 1.5, width: 0.2, depth: 0.3 }, { kind: 'flat', length: 1.5 }, { kind: 'trench', length: 1.5, width: 0.2, depth: 0.3 }, { kind: 'flat', length: LEAD }] });
  const trenches = [LEAD + 0.65, LEAD + 3 + 0.65].map((a) => [a, a + 0.2]);
  it('pit depth: in the middle of a 20 cm trench the sole lies its depth less the grade allowance below the rims; a ramp, a stair run and flat ground are no pit', () => {
    // Worked by hand: the probe reaches 20 cm; its first sample outside the 10 cm half-width is at 2/3 of that.
    const ground = heightfieldGround(course);
    const centre = LEAD + 0.75;
    expect(pitDepth(ground, 0, centre, ground.height(0, centre), 0.2)).toBeCloseTo(0.3 - PIT_GRADE * (0.2 * 2) / 3, 3);
    expect(pitDepth(ground, 0, LEAD - 1, 0, 0.2)).toBe(0);
    const ramp = heightfieldGround(generateCourse({ cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'ramp', length: 3, angleDeg: 20 }, { kind: 'flat', length: LEAD }] }));
    expect(pitDepth(ramp, 0, LEAD + 1.5, ramp.height(0, LEAD + 1.5), 0.2)).toBe(0);
    const stairs = heightfieldGround(codeStairs('up'));
    const tread = LEAD + 2.5 * CODE_STAIRS.tread;
    expect(pitDepth(stairs, 0, tread, stairs.height(0, tread), 0.2)).toBe(0);
  });
  it.each<PresetRigName>(['biped', 'quadruped', 'hexapod'])('%s: no foothold is chosen inside a trench (common practice, no source)', (name) => {
    const rig = presetRig(name);
    const t = createTrial(rig, defaultLegSetup(rig), course, { duration: 40 });
    let inside = 0;
    let plants = 0;
    let pastBoth = 0;
    const was = Uint8Array.from(t.stance);
    walk(t, (tr) => {
      for (let i = 0; i < tr.legs; i++) {
        if (tr.stance[i] && !was[i]) {
          plants++;
          const z = tr.plant[3 * i + 2];
          if (trenches.some(([a, b]) => z > a && z < b)) inside++;
          if (z > trenches[1][1]) pastBoth++;
        }
        was[i] = tr.stance[i];
      }
    });
    // Every leg got across both trenches, and none was set down in one.
    expect(pastBoth).toBeGreaterThanOrEqual(rig.legs.length);
    expect(plants).toBeGreaterThan(10);
    expect(inside).toBe(0);
  });
});

describe('recovery after a constructed reach-miss', () => {
  it.each<PresetRigName>(['biped', 'quadruped', 'hexapod'])('%s: a leg thrown off its target tracks within 1 cm again within two steps (common practice, no source)', (name) => {
    const rig = presetRig(name);
    const course = generateCourse({ segments: [{ kind: 'flat', length: 40 }] });
    const t = createTrial(rig, defaultLegSetup(rig), course, { duration: 30 });
    const dt = t.options.timeStep;
    for (let k = 0; k < Math.round(2 / dt); k++) stepTrial(t);
    // Throw leg 0 to its joint limits mid-walk: every DOF to the end of its range.
    const ws = t.solvers[0];
    for (let d = 0; d < ws.nDof; d++) if (Number.isFinite(ws.hi[d])) ws.pose[d] = ws.hi[d];
    t.prevPose[0].set(ws.pose);
    t.olderPose[0].set(ws.pose);
    const error = () => Math.hypot(t.target[0] - ws.foot[0], t.target[1] - ws.foot[1], t.target[2] - ws.foot[2]);
    stepTrial(t);
    let frames = 1;
    const twoSteps = Math.ceil((2 * t.gait.cycleTime) / dt);
    while (error() >= 0.01 && frames < twoSteps + 10) {
      stepTrial(t);
      frames++;
    }
    expect(frames).toBeLessThanOrEqual(twoSteps);
  });
});
