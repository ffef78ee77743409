/**
 * What stops a leg setup, in sentences: the setting as the form names it, its value, the limit and the fix.
 * The limits are LegSetupSchema's own; a rig standing 84 m at the hips is the 0.84 m demo quadruped read from
 * a file authored in centimetres (glTF 2.0 §3.5.1: glTF units are metres).
 */
import { generateCourse } from '../../engine/course';
import { defaultLegSetup, parseLegSetup } from '../../engine/gait/leg-setup';
import { presetRig, scaledRig } from '../../engine/gait/rig-presets';
import { legSetupProblems, trialStartProblems } from '../../engine/gait/setup-problems';

describe('leg setup problems', () => {
  const rig = presetRig('quadruped');
  const setup = defaultLegSetup(rig);

  it('parse errors are sentences with the path for a programmer, not zod symbols', () => {
    expect(() => parseLegSetup({ ...setup, gait: { ...setup.gait, stepHeight: 8.4 } })).toThrow(
      /^invalid leg setup: Step height 8\.4 m is above the 1 m limit; is the character in centimetres\? .* \(gait\.stepHeight\)$/,
    );
    expect(() => parseLegSetup({ ...setup, gait: { ...setup.gait, dutyFactor: 1.5 } })).toThrow('invalid leg setup: Duty factor 1.5 is above the 0.98 limit; set it to at most 0.98. (gait.dutyFactor)');
  });

  it('asks about centimetres from the rig when the rig is tall, and not for a rig of ordinary size', () => {
    const tall = scaledRig(rig, 100);
    const [p] = legSetupProblems(defaultLegSetup(tall), tall);
    expect(p.path).toBe('gait.stepHeight');
    expect(p.message).toMatch(/is the character in centimetres \(its hips stand 72 m up\)\?/);
    const [q] = legSetupProblems({ ...setup, gait: { ...setup.gait, stepHeight: 1.2 } }, rig);
    expect(q.message).toBe('Step height 1.2 m is above the 1 m limit; set it to at most 1 m.');
    expect(legSetupProblems(setup, rig)).toEqual([]);
  });

  it('names a course too short to walk and passes one long enough', () => {
    const short = generateCourse({ segments: [{ kind: 'flat', length: 1 }] });
    const long = generateCourse({ segments: [{ kind: 'flat', length: 12 }] });
    const problems = trialStartProblems(rig, setup, [{ name: 'Doormat', heightfield: short }, { name: 'Yard', heightfield: long }]);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toEqual({ path: 'course', message: expect.stringMatching(/^“Doormat” is too short for this character: 1\.00 m leaves no room .*Lengthen the course, or shorten the stride\.$/) });
  });
});
