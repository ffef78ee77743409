/**
 * The pace waits for the planted feet: at the foot of a stair run the steps are short (a tread each) and the
 * body speeds up again afterwards; no stance leg may be drawn out straight behind it. Stairs of IBC 2021
 * §1011.5.2 geometry (178 mm riser, 279 mm tread). The comfortable range is COMFORT_MAX of the leg's reach
 * (engine/gait/reach.ts); a leg at full extension is where damped least squares stalls and the foot skids
 * (common practice, no source).
 */
import { CODE_STAIRS, generateCourse } from '../../engine/course';
import { createTrial, defaultLegSetup, presetRig, stepTrial, type PresetRigName } from '../../engine/gait';
import { CANDIDATE_MAX, COMFORT_MAX } from '../../engine/gait/reach';
import { runTrial } from '../../engine/gait/trial';

function stairs(direction: 'up' | 'down') {
  return generateCourse({ cellSize: 0.02, segments: [{ kind: 'flat', length: 3 }, { kind: 'stairs', steps: 8, ...CODE_STAIRS, direction }, { kind: 'flat', length: 3 }] });
}

describe.each<[PresetRigName, 'up' | 'down']>([
  ['biped', 'down'],
  ['biped', 'up'],
  ['quadruped', 'down'],
])('%s on code stairs %s', (name, direction) => {
  it('keeps every stance leg short of full extension', () => {
    const rig = presetRig(name);
    const t = createTrial(rig, defaultLegSetup(rig), stairs(direction), { duration: 40 });
    let longest = 0;
    while (stepTrial(t)) {
      for (let i = 0; i < t.legs; i++) {
        if (!t.stance[i]) continue;
        const h = t.solvers[i].rootPos;
        const d = Math.hypot(t.plant[3 * i] - h[0], t.plant[3 * i + 1] - h[1], t.plant[3 * i + 2] - h[2]) / rig.legs[i].chain.reach;
        if (d > longest) longest = d;
      }
    }
    // Never further than a foothold may be chosen at (CANDIDATE_MAX): before the pace waited for the feet the
    // biped's trailing leg reached 0.963 of its reach going down and 0.960 going up.
    expect(longest).toBeLessThanOrEqual(CANDIDATE_MAX);
    expect(longest).toBeGreaterThan(COMFORT_MAX - 0.1);
  });
});

it('brings the biped down code stairs without a skid (one skid at the foot of the run before)', () => {
  const rig = presetRig('biped');
  const m = runTrial(rig, defaultLegSetup(rig), stairs('down'), { duration: 60 }).metrics;
  expect(m.stumbles.skid.count).toBe(0);
  expect(m.steps).toBeGreaterThan(10);
});
