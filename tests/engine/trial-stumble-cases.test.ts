import { curbCourse, flatCourse, generateCourse, rampCourse, trenchCourse } from '../../engine/course';
import { PRESET_GAITS, defaultLegSetup, presetRig, runTrial, type LegSetup, type PresetRigName, type Rig } from '../../engine/gait';
import { mirrorChain } from '../../engine/rig/presets';
import type { LegChain } from '../../engine/rig/types';
import type { StumbleKind } from '../../engine/metrics';
import type { Heightfield } from '../../engine/course';

/**
 * Whole trials built to trigger one stumble kind each, beside the near miss
 * that must not trigger it. Thresholds are the defaults (common practice, no
 * source; snap from memory).
 */
function stumbles(rig: PresetRigName, course: Heightfield, edit: (s: LegSetup) => void = () => {}, duration = 20) {
  const r = presetRig(rig);
  const setup = defaultLegSetup(r);
  edit(setup);
  const m = runTrial(r, setup, course, { duration }).metrics;
  return (kind: StumbleKind) => m.stumbles[kind].count;
}

describe('reach-miss', () => {
  const quad = presetRig('quadruped');
  const stride = 1.02; // the quadruped's default stride, checked below
  it('a trench wider than the stride and deeper than the leg', () => {
    const s = stumbles('quadruped', trenchCourse(10, 2, 1.5, { leadIn: 3, leadOut: 20 }));
    expect(2).toBeGreaterThan(stride);
    expect(1.5).toBeGreaterThan(quad.legs[0].chain.reach);
    expect(s('reach-miss')).toBeGreaterThan(0);
  });
  it('near miss: the same trench 3 cm deep', () => {
    expect(stumbles('quadruped', trenchCourse(10, 2, 0.03, { leadIn: 3, leadOut: 20 }))('reach-miss')).toBe(0);
  });
});

describe('snap', () => {
  // Stilts: a universal hip and a knee, 0.45 m + 0.45 m, hips exactly one leg length up, so every
  // stance passes through the straight-leg singularity; rubble keeps pushing targets past it.
  const stilt: LegChain = {
    name: 'stilt',
    kind: 'custom',
    reach: 0.9,
    sole: [0, -0.45, 0],
    soleNormal: [0, 1, 0],
    knee: 1,
    kneeDirection: [0, 0, 1],
    joints: [
      { name: 'hip', kind: 'universal', offset: [0, 0, 0], rest: [0, 0, 0, 1], axes: [[1, 0, 0], [0, 0, 1]], limits: [{ min: -1.5, max: 1.5 }, { min: -0.5, max: 0.5 }], restValues: [-0.2, 0] },
      { name: 'knee', kind: 'hinge', offset: [0, -0.45, 0], rest: [0, 0, 0, 1], axes: [[1, 0, 0]], limits: [{ min: 0, max: 2.6 }], restValues: [0.4] },
    ],
  };
  const stilts: Rig = {
    name: 'stilts',
    hipHeight: 0.9,
    legs: [
      { name: 'left', chain: stilt, hip: [0.1, 0, 0], hipRotation: [0, 0, 0, 1], neutralFoot: [0.1, 0] },
      { name: 'right', chain: mirrorChain(stilt), hip: [-0.1, 0, 0], hipRotation: [0, 0, 0, 1], neutralFoot: [-0.1, 0] },
    ],
  };
  const rubble = generateCourse({ segments: [{ kind: 'flat', length: 3 }, { kind: 'rubble', length: 40, amplitude: 0.05, featureSize: 0.5, seed: 7 }] });
  const snapsWith = (lambda: number) => {
    const s = defaultLegSetup(stilts);
    s.solver.lambda = lambda;
    // The joint speed limit off: these checks are about the solver's own pops.
    s.solver.maxJointSpeed = 100000;
    s.gait.stride = 0.6;
    s.gait.timing = { mode: 'speed', speed: 0.8 };
    return runTrial(stilts, s, rubble, { duration: 20 }).metrics.stumbles.snap.count;
  };
  // Straight stance legs are where an undamped solver pops (Buss 2004); the body keeps every stance leg
  // inside its comfortable reach, so neither setting snaps, and more damping never means more snaps
  // (reach band: common practice, no source).
  it('stilts on rubble: no snaps with λ = 0 or a tuned λ, because no stance leg is driven straight', () => {
    const undamped = snapsWith(0);
    const damped = snapsWith(0.03);
    expect(undamped).toBe(0);
    expect(damped).toBeLessThanOrEqual(undamped);
  });

  // The wave gait swings one leg at a time, in a sixth of the cycle: speed sets how fast the joints must move.
  const wave = (speed: number) => {
    const rig = presetRig('hexapod');
    const s = defaultLegSetup(rig);
    s.gait.pattern = 'hexapod-wave';
    s.gait.dutyFactor = PRESET_GAITS['hexapod-wave'].dutyFactor;
    s.gait.timing = { mode: 'speed', speed };
    s.solver.maxJointSpeed = 100000;
    const r = runTrial(rig, s, flatCourse(30), { duration: 15, recordRate: 60 });
    let fastest = 0;
    for (let k = 10; k < r.series.length; k++) for (let i = 0; i < 6; i++) fastest = Math.max(fastest, r.series.jointSpeed[k * 6 + i]);
    return { snaps: r.metrics.stumbles.snap.count, fastest };
  };
  it('a hexapod wave gait at 0.475 m/s swings its joints past 720 °/s', () => {
    expect(wave(0.475).snaps).toBeGreaterThan(0);
  });
  it('near miss: at 0.416 m/s the fastest joint stays under 720 °/s and nothing snaps', () => {
    const w = wave(0.416);
    expect(w.fastest).toBeLessThan(720);
    expect(w.fastest).toBeGreaterThan(600);
    expect(w.snaps).toBe(0);
  });
});

describe('scuff', () => {
  const curb = curbCourse(10, 0.1, { leadIn: 3, leadOut: 20 });
  // One damped iteration per frame from the last pose: the swinging foot trails its path a little.
  const trailing = (stepHeight: number | null) => (s: LegSetup) => {
    if (stepHeight !== null) s.gait.stepHeight = stepHeight;
    s.solver.maxIterations = 1;
    s.solver.lambda = 0.1;
    s.solver.warmStart = 'previous';
  };
  it('a biped asked to lift its feet 0 cm still clears a 10 cm curb: the swing keeps Winter (1992)\'s 1.29 cm minimum toe clearance', () => {
    expect(stumbles('biped', curb, trailing(0))('scuff')).toBe(0);
  });
  it('a solver that trails its path badly (one heavily damped iteration a frame) scuffs the curb', () => {
    expect(
      stumbles('biped', curb, (s) => {
        s.gait.stepHeight = 0;
        s.solver.maxIterations = 1;
        s.solver.lambda = 0.4;
        s.solver.warmStart = 'previous';
      })('scuff'),
    ).toBeGreaterThan(0);
  });
  it('near miss: the same solver with the default step height', () => {
    expect(stumbles('biped', curb, trailing(null))('scuff')).toBe(0);
  });
  it('and the default setup over the curb', () => {
    expect(stumbles('biped', curb)('scuff')).toBe(0);
  });
});

describe('sink and skid', () => {
  // One heavily damped iteration per frame from the last pose: the foot lags its target as the body moves.
  const sluggish = (s: LegSetup) => {
    s.solver.maxIterations = 1;
    s.solver.lambda = 0.3;
    s.solver.warmStart = 'previous';
  };
  it('sink: a sluggish solver walking down a 10° ramp', () => {
    expect(stumbles('quadruped', rampCourse(30, -10, { leadIn: 3, leadOut: 10 }), sluggish)('sink')).toBeGreaterThan(0);
  });
  it('near miss: two iterations per frame on the same ramp', () => {
    const s = stumbles('quadruped', rampCourse(30, -10, { leadIn: 3, leadOut: 10 }), (x) => {
      x.solver.maxIterations = 2;
      x.solver.lambda = 0.1;
      x.solver.warmStart = 'previous';
    });
    expect(s('sink')).toBe(0);
    expect(s('skid')).toBe(0);
  });
  it('skid: a very sluggish solver on flat ground', () => {
    const s = stumbles('quadruped', flatCourse(40), (x) => {
      x.solver.maxIterations = 1;
      x.solver.lambda = 0.5;
      x.solver.warmStart = 'previous';
    });
    expect(s('skid')).toBeGreaterThan(0);
  });
});

describe('body step-up after a curb', () => {
  it('the pelvis rises without overshoot (critically damped filter; Ogata §5-3) and settles', () => {
    const rig = presetRig('biped');
    const setup = defaultLegSetup(rig);
    const r = runTrial(rig, setup, curbCourse(10, 0.1, { leadIn: 3, leadOut: 20 }), { duration: 20 });
    const m = r.metrics;
    expect(m.bodyStepUp.count).toBeGreaterThanOrEqual(1);
    expect(m.bodyStepUp.overshootMaxPercent).toBeLessThan(0.5);
    // It settles within the 2 % band before the next step has gone by: the filter's settling time after
    // the swing that asked for the rise (common practice, no source).
    expect(m.bodyStepUp.settleMeanSeconds ?? Infinity).toBeLessThan(setup.body.settleTime + r.gait.cycleTime);
  });
});

describe('the quadruped default stride used above', () => {
  it('is about 1.02 m (Alexander 1976 at Froude 0.2)', () => {
    const rig = presetRig('quadruped');
    const r = runTrial(rig, defaultLegSetup(rig), flatCourse(20), { duration: 1 });
    expect(r.gait.stride).toBeCloseTo(1.02, 2);
  });
});
