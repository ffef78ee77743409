/**
 * A driven turn answers within a step: a game that lets go of the turn expects the character to stop turning
 * about as soon as its feet allow, not to swing on by a right angle (common practice, no source).
 */
import { createHeightfieldGrid } from '../../../engine/course';
import { defaultLegSetup, PRESET_RIG_NAMES, presetRig, resolveGait } from '../../../engine/gait';
import { createRigRuntime } from '../../../engine/profile/runtime';

const DEG = Math.PI / 180;

describe.each(PRESET_RIG_NAMES)('%s driven through a turn', (name) => {
  it('has turned a right angle after 3 s at 1.2 rad/s, and stops within a cycle of the release, without a stumble', () => {
    const rig = presetRig(name);
    const setup = defaultLegSetup(rig);
    const gait = resolveGait(setup.gait, rig);
    const legs = createRigRuntime(rig, setup, createHeightfieldGrid(201, 201, 0.1, 0), { watchStumbles: true, position: [10, 10] });
    const q = new Float64Array(4);
    const heading = () => 2 * Math.atan2(legs.bodyRotation(q)[1], q[3]);
    const v = 0.6 * gait.speed;
    let released = 0;
    let lastTurning = 0;
    for (let k = 0; k < 6 * 60; k++) {
      const turning = k < 3 * 60;
      const h = heading();
      if (k === 3 * 60) released = h;
      legs.drive(v * Math.sin(h), v * Math.cos(h), turning ? 1.2 : 0);
      legs.update(1 / 60);
      if (!turning && Math.abs(heading() - h) > 1e-4) lastTurning = (k + 1 - 3 * 60) / 60;
    }
    // Over four cycles the biped had turned 68° in 3 s and went on 33° for 1.5 s after the release.
    expect((released / DEG)).toBeGreaterThan(90);
    expect(lastTurning).toBeLessThanOrEqual(gait.cycleTime);
    expect(Math.abs(heading() - released) / DEG).toBeLessThan(20);
    expect(Array.from(legs.stumbleCounts())).toEqual([0, 0, 0, 0, 0]);
  });
});
