/**
 * One name per setting: the leg setup form labels its fields with the names in engine/gait/setting-sentences.ts,
 * the same names the server's refusals use, so a field and a sentence about it cannot name a setting two ways.
 * The limits are LegSetupSchema's own (settling time at most 5 s, SDLS γmax at most π rad).
 */
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { bipedRig } from '../../engine/gait/rig-presets';
import { legSetupProblems } from '../../engine/gait/setup-problems';
import { SETTING_NAMES, nameOf } from '../../engine/gait/setting-sentences';
import { BODY_FIELDS, FOOTHOLD_FIELDS, GAIT_FIELDS, SOLVER_FIELDS, checkDraft, draftOf } from '../../components/setup/setup-draft';

const rig = bipedRig();
const setup = defaultLegSetup(rig);
const fields = [...SOLVER_FIELDS, ...GAIT_FIELDS, ...BODY_FIELDS, ...FOOTHOLD_FIELDS];

describe('the form and the sentences share the settings’ names', () => {
  it('labels every field, shown or kept hidden, with its setting’s listed name', () => {
    for (const f of fields) {
      expect(Object.keys(SETTING_NAMES)).toContain(f.path);
      // Under its section heading the label drops the heading's word ("Body settling time" under Body, "Foothold edge weight" under Footholds).
      const name = nameOf(f.path).label.replace(/^(solver|gait|body|foothold) /i, '').toLowerCase();
      expect(f.label.toLowerCase().startsWith(name)).toBe(true);
    }
  });

  it('says a body setting over its limit with the same sentence in the form and at the server', () => {
    const field = BODY_FIELDS.find((f) => f.path === 'body.settleTime');
    expect(field?.label).toBe('Settling time (2 %)');
    const sentence = 'Body settling time 9 s is above the 5 s limit; set it to at most 5 s.';
    expect(checkDraft({ ...draftOf(setup), 'body.settleTime': '9' }).errors?.['body.settleTime']).toBe(sentence);
    expect(legSetupProblems({ ...setup, body: { ...setup.body, settleTime: 9 } }, rig)).toEqual([{ path: 'body.settleTime', message: sentence }]);
  });

  it('names a method-only setting at the server as the form labels it, not by its code', () => {
    const field = SOLVER_FIELDS.find((f) => f.path === 'solver.gammaMax');
    expect(field?.label).toBe('SDLS largest joint change γmax');
    const [p] = legSetupProblems({ ...setup, solver: { ...setup.solver, gammaMax: 4 } }, rig);
    expect(p).toEqual({ path: 'solver.gammaMax', message: 'SDLS largest joint change γmax 4 rad is above the 3.14 rad limit; set it to at most 3.14 rad.' });
  });
});
