/**
 * Defaults fitted to the character's own size: every preset rig and demo character, at 0.3×, 1× and 3× its
 * size, walks flat ground with zero stumbles on defaultLegSetup alone, before any tuning.
 * Outside references: dynamic similarity by the Froude number v²/(g·h) (Alexander 1976, Nature 261), which the
 * default speed keeps at 0.2 unless the swing would be too fast; the peak speed of a minimum-jerk move is 15/8
 * of its mean (Flash & Hogan 1985, J. Neurosci. 5(7)), which the slowed speed is solved from.
 * Without the fitting (the Froude speed at every size) the 0.3× demo quadruped dragged its toes 36 times in 20 s.
 */
import { generateCourse } from '../../engine/course';
import { resolveGait } from '../../engine/gait/gait-params';
import { PLANNED_SWING_SPEED, defaultLegSetup } from '../../engine/gait/leg-setup';
import { PRESET_RIG_NAMES, presetRig, scaledRig } from '../../engine/gait/rig-presets';
import type { Rig } from '../../engine/gait/rig';
import { froudeNumber } from '../../engine/gait/stride';
import { runTrial } from '../../engine/gait/trial';
import { STUMBLE_KINDS } from '../../engine/metrics/stumble-thresholds';
import { demoCharacterRigs } from '../../seeds/demo-character-rigs';
import { GAUNTLET } from '../../engine/course/gauntlet';

jest.setTimeout(300_000);

const SCALES = [0.3, 1, 3];
let rigs: { name: string; rig: Rig }[] = [];

beforeAll(async () => {
  rigs = [...PRESET_RIG_NAMES.map((n) => ({ name: n as string, rig: presetRig(n) })), ...(await demoCharacterRigs())];
});

/** Estimated peak joint speed of a swing, °/s: the leg sweeps the stance travel over its reach in the swing time, min-jerk. */
function plannedSwingSpeed(rig: Rig): number {
  const g = resolveGait(defaultLegSetup(rig).gait, rig);
  const reach = Math.min(...rig.legs.map((l) => l.chain.reach));
  return ((15 / 8) * ((g.dutyFactor * g.stride) / reach) * (180 / Math.PI)) / ((1 - g.dutyFactor) * g.cycleTime);
}

describe('defaults fitted to the character', () => {
  it('keep the Froude number at 0.2 where the swing is slow enough, and slow down to the planned swing speed where it is not', () => {
    let slowed = 0;
    for (const { name, rig } of rigs) {
      for (const s of SCALES) {
        const r = scaledRig(rig, s);
        const setup = defaultLegSetup(r);
        const g = resolveGait(setup.gait, r);
        const fr = froudeNumber(g.speed, r.hipHeight);
        const peak = plannedSwingSpeed(r);
        if (fr < 0.2 - 1e-9) {
          slowed++;
          expect({ name, s, peak }).toEqual({ name, s, peak: expect.closeTo(PLANNED_SWING_SPEED, 6) });
        } else {
          expect({ name, s, fr }).toEqual({ name, s, fr: expect.closeTo(0.2, 9) });
          expect(peak).toBeLessThanOrEqual(PLANNED_SWING_SPEED + 1e-6);
        }
        // Step height: a tenth of hip height at every size (common practice, no source), or a twentieth of the
        // shortest reach where that is more (a sprawled leg; our own choice).
        const shortest = Math.min(...r.legs.map((l) => l.chain.reach));
        expect(setup.gait.stepHeight).toBeCloseTo(Math.max(0.1 * r.hipHeight, 0.05 * shortest), 12);
      }
    }
    // The small ones are slowed (a fast swing at 0.3× is what dragged their toes); the large ones are not.
    expect(slowed).toBeGreaterThan(0);
    expect(slowed).toBeLessThan(rigs.length * SCALES.length);
  });

  it('walk flat ground with zero stumbles at 0.3×, 1× and 3× for 2, 4 and 6 legs', () => {
    const legCounts = new Set<number>();
    const failures: string[] = [];
    for (const { name, rig } of rigs) {
      legCounts.add(rig.legs.length);
      for (const s of SCALES) {
        const r = scaledRig(rig, s);
        const flat = generateCourse({ segments: [{ kind: 'flat', length: Math.max(20, 40 * s) }] });
        const m = runTrial(r, defaultLegSetup(r), flat, { duration: 15 }).metrics;
        expect(m.steps).toBeGreaterThan(2 * r.legs.length);
        for (const k of STUMBLE_KINDS) if (m.stumbles[k].count > 0) failures.push(`${name} ×${s}: ${m.stumbles[k].count} ${k}`);
      }
    }
    expect(failures).toEqual([]);
    expect([...legCounts].sort()).toEqual([2, 4, 6]);
  });

  it('give a sprawled hip room to twist, so the demo hexapod climbs a 20° ramp and code stairs without a stumble', () => {
    const twistOf = (rig: Rig) => rig.legs.map((l) => l.chain.joints.find((j) => j.kind === 'ball')?.ball?.twistMax);
    const byName = Object.fromEntries(rigs.map((r) => [r.name, r.rig]));
    // Human hip rotation about ±35° (from memory); a hip whose first bone points out sideways gets ±60°.
    for (const t of twistOf(byName.Wicket)) expect(t).toBeCloseTo((35 * Math.PI) / 180, 9);
    for (const t of twistOf(byName.Skitter)) expect(t).toBeCloseTo((60 * Math.PI) / 180, 9);
    // With ±35° the hexapod's front legs stuck at the twist limit mid-swing: 9 snaps and 7 scuffs on the ramp, 5 and 5 on the stairs.
    // The stairs are IBC 2021 §1011.5.2 geometry (engine/course/gauntlet.ts).
    for (const name of ['ramp 20° up and down', 'code stairs up']) {
      const course = generateCourse(GAUNTLET.find((g) => g.name === name)!.recipe);
      const m = runTrial(byName.Skitter, defaultLegSetup(byName.Skitter), course, { duration: 60 }).metrics;
      expect({ name, stumbles: STUMBLE_KINDS.map((k) => m.stumbles[k].count) }).toEqual({ name, stumbles: STUMBLE_KINDS.map(() => 0) });
    }
  });

  it('give a hip the human 120° of flexion, so the demo quadruped folds its fore legs over the mixed course without a snap', () => {
    const burrow = rigs.find((r) => r.name === 'Burrow')!.rig;
    // Hip flexion about 120° (from memory, the usual range of motion of a human hip).
    for (const l of burrow.legs) expect(l.chain.joints[0].ball?.swing).toBeCloseTo((120 * Math.PI) / 180, 9);
    // At 90° the fore legs met the cone's edge mid-swing and the clamp jumped: one snap, one skid and one reach-miss here.
    const course = generateCourse(GAUNTLET.find((g) => g.name === 'mixed')!.recipe);
    const m = runTrial(burrow, defaultLegSetup(burrow), course, { duration: 60 }).metrics;
    expect({ snap: m.stumbles.snap.count, skid: m.stumbles.skid.count, reachMiss: m.stumbles['reach-miss'].count }).toEqual({ snap: 0, skid: 0, reachMiss: 0 });
  });
});
