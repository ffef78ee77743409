/**
 * A setting over its limit is said in words beside its field: the setting, the value typed, the limit and the
 * fix; a length far over its limit asks whether the character is in centimetres (glTF 2.0 §3.5.1: glTF units
 * are metres, so a file authored in centimetres reads 100 times too large). The limits are LegSetupSchema's.
 */
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { bipedRig } from '../../engine/gait/rig-presets';
import { checkDraft, draftOf } from '../../components/setup/setup-draft';

describe('limits in the leg setup form', () => {
  const draft = draftOf(defaultLegSetup(bipedRig()));

  it('names the step height, its value and the 1 m limit, and asks about centimetres when it is far over', () => {
    const far = checkDraft({ ...draft, 'gait.stepHeight': '8.4' });
    expect(far.errors?.['gait.stepHeight']).toMatch(/^Step height 8\.4 m is above the 1 m limit; is the character in centimetres\?/);
    const near = checkDraft({ ...draft, 'gait.stepHeight': '1.5' });
    expect(near.errors?.['gait.stepHeight']).toBe('Step height 1.5 m is above the 1 m limit; set it to at most 1 m.');
  });

  it('says a share below or above its range with the range, not the schema’s symbols', () => {
    const low = checkDraft({ ...draft, 'gait.dutyFactor': '0.01' });
    expect(low.errors?.['gait.dutyFactor']).toBe('Duty factor 0.01 is below the 0.05 limit; set it to at least 0.05.');
    expect(low.errors?.['gait.dutyFactor']).not.toMatch(/[<>]=?/);
  });
});
