/**
 * One name per setting: the dial-in's tunable settings say each setting with the name and unit of the one list,
 * SETTING_NAMES (engine/gait/setting-sentences.ts), as the leg setup form and the server's sentences do.
 * Their paths and hard ranges are LegSetupSchema's own.
 */
import { LegSetupSchema, defaultLegSetup } from '../../engine/gait/leg-setup';
import { bipedRig } from '../../engine/gait/rig-presets';
import { SETTING_NAMES, type NamedSetting } from '../../engine/gait/setting-sentences';
import { TUNABLE_SETTINGS } from '../../schemas/dial-ins';

describe('dial-in setting names', () => {
  it('are the names of the one list, with its units', () => {
    for (const t of TUNABLE_SETTINGS) {
      expect(Object.keys(SETTING_NAMES)).toContain(t.key);
      const name = SETTING_NAMES[t.key as NamedSetting];
      expect(t.label).toBe(name.label);
      expect(t.unit).toBe('unit' in name ? name.unit : '');
    }
    expect(TUNABLE_SETTINGS.find((t) => t.key === 'body.followHeight')?.label).toBe('Body follows the feet’s height');
    expect(TUNABLE_SETTINGS.find((t) => t.key === 'body.slopeCrouch')?.label).toBe('Crouch per radian of slope');
  });

  it('point at settings of the leg setup, whose schema accepts the ends of their ranges', () => {
    const setup = defaultLegSetup(bipedRig());
    for (const t of TUNABLE_SETTINGS) {
      expect(t.path.join('.')).toBe(t.key);
      const [group, field] = t.path as [keyof typeof setup, string];
      expect(typeof (setup[group] as Record<string, unknown>)[field]).toBe('number');
      for (const end of t.range) {
        const moved = { ...setup, [group]: { ...(setup[group] as object), [field]: end } };
        expect(LegSetupSchema.safeParse(moved).success).toBe(true);
      }
    }
  });
});
