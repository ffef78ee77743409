import { flatCourse } from '../../engine/course';
import {
  PRESET_GAITS,
  alexanderStride,
  alexanderStrideForCycle,
  bipedRig,
  defaultLegSetup,
  doubleSupportFraction,
  froudeNumber,
  hexapodRig,
  legPhase,
  quadrupedRig,
  resolveGait,
  runTrial,
  speedForFroude,
  supportFractions,
} from '../../engine/gait';
import { heightAt } from '../../engine/course';

describe('biped walk preset (Perry, Gait Analysis, 1992)', () => {
  const g = PRESET_GAITS['biped-walk'];
  it('stance about 60 % of the cycle: a walk on flat ground keeps each foot down for 0.6 of its frames (Perry 1992)', () => {
    const rig = bipedRig();
    const r = runTrial(rig, defaultLegSetup(rig), flatCourse(30), { duration: 10, recordRate: 60 });
    for (let i = 0; i < r.series.legs; i++) {
      let down = 0;
      for (let k = 0; k < r.series.length; k++) down += r.series.contact[k * r.series.legs + i];
      expect(down / r.series.length).toBeCloseTo(0.6, 1);
    }
  });
  it('about 20 % double support in total (Perry 1992)', () => {
    expect(doubleSupportFraction(g.phaseOffsets, g.dutyFactor)).toBeCloseTo(0.2, 12);
  });
});

describe('default stride (Alexander 1976, Nature 261)', () => {
  it('hip height 0.9 m at 1.3 m/s gives about 1.26 m (λ/h = 2.3·Fr^0.3)', () => {
    expect(alexanderStride(0.9, 1.3)).toBeCloseTo(1.26, 2);
  });
  it('is what a leg setup without a stride resolves to', () => {
    const rig = bipedRig();
    const setup = defaultLegSetup(rig);
    setup.gait.timing = { mode: 'speed', speed: 1.3 };
    const g = resolveGait(setup.gait, rig);
    expect(rig.hipHeight).toBe(0.9);
    expect(g.stride).toBeCloseTo(1.26, 2);
    expect(g.cycleTime).toBeCloseTo(g.stride / 1.3, 12);
  });
  it('given a cycle time instead, the stride satisfies the same relation at v = λ/T (Alexander 1976)', () => {
    const lambda = alexanderStrideForCycle(0.9, 1.0);
    expect(alexanderStride(0.9, lambda / 1.0)).toBeCloseTo(lambda, 10);
  });
  it('default speed stays below the walk-to-run transition, Froude 0.5 ≈ 2.1 m/s at 0.9 m (Kram, Domingo & Ferris 1997)', () => {
    expect(speedForFroude(0.5, 0.9)).toBeCloseTo(2.1, 1);
    for (const rig of [bipedRig(), quadrupedRig(), hexapodRig()]) {
      const s = defaultLegSetup(rig);
      if (s.gait.timing.mode !== 'speed') throw new Error('expected a speed');
      expect(froudeNumber(s.gait.timing.speed, rig.hipHeight)).toBeLessThan(0.5);
    }
  });
});

describe('swing clearance (Winter, Physical Therapy 72(1), 1992)', () => {
  it('a setup asking for no lift at all still swings the sole 1.29 cm up at mid-swing (Winter 1992)', () => {
    const rig = bipedRig();
    const course = flatCourse(20);
    const setup = defaultLegSetup(rig);
    setup.gait.stepHeight = 0;
    const r = runTrial(rig, setup, course, { duration: 8, recordRate: 60 });
    const s = r.series;
    let highest = 0;
    for (let k = 0; k < s.length; k++) {
      for (let i = 0; i < s.legs; i++) {
        const a = (k * s.legs + i) * 3;
        highest = Math.max(highest, s.foot[a + 1] - heightAt(course, s.foot[a], s.foot[a + 2]));
      }
    }
    // The solver's tolerance (0.5 mm) is all the sole may fall short of the floor.
    expect(highest).toBeGreaterThanOrEqual(0.0129 - 5e-4);
    expect(highest).toBeLessThan(0.03);
  });
  it('in mid-swing on flat ground the biped sole stays at least 1.29 cm up (Winter 1992)', () => {
    const rig = bipedRig();
    const course = flatCourse(20);
    const r = runTrial(rig, defaultLegSetup(rig), course, { duration: 8, recordRate: 60 });
    const s = r.series;
    const g = r.gait;
    let checked = 0;
    for (let k = 0; k < s.length; k++) {
      for (let i = 0; i < s.legs; i++) {
        const phase = legPhase(k / s.rate, g.cycleTime, g.phaseOffsets[i]);
        const tau = (phase - g.dutyFactor) / (1 - g.dutyFactor);
        if (tau < 1 / 3 || tau > 2 / 3) continue;
        const a = (k * s.legs + i) * 3;
        expect(s.foot[a + 1] - heightAt(course, s.foot[a], s.foot[a + 2])).toBeGreaterThanOrEqual(0.0129);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(50);
  });
});

describe('multi-leg patterns (common practice, no source)', () => {
  it('support fractions cover the whole cycle', () => {
    for (const g of Object.values(PRESET_GAITS)) {
      expect(supportFractions(g.phaseOffsets, g.dutyFactor).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    }
  });
  it('tripod keeps three feet down and the wave gait five', () => {
    const tri = PRESET_GAITS['hexapod-tripod'];
    const fTri = supportFractions(tri.phaseOffsets, tri.dutyFactor);
    expect(fTri[0] + fTri[1] + fTri[2]).toBeCloseTo(0, 12);
    const wave = PRESET_GAITS['hexapod-wave'];
    const fWave = supportFractions(wave.phaseOffsets, wave.dutyFactor);
    expect(fWave.slice(0, 5).reduce((a, b) => a + b, 0)).toBeCloseTo(0, 12);
  });
  it('trot moves diagonal pairs together', () => {
    const o = PRESET_GAITS['quadruped-trot'].phaseOffsets;
    expect(o[0]).toBe(o[3]);
    expect(o[1]).toBe(o[2]);
    expect(o[0]).not.toBe(o[1]);
  });
});
