/**
 * Nothing already saved is lost by the leg setup form: a setup with its own joint speed limit and foothold
 * weights goes through the form's draft and comes back unchanged, and the form edits them with the schema's
 * bounds (LegSetupSchema in engine/gait/leg-setup.ts: joint speed above 0 °/s, search radius 0–1 of the stride).
 * The rule is the project's own (common practice, no source): a save never resets a setting it was not asked to.
 */
import { useState } from 'react';
import { fireEvent, render, screen } from '@testing-library/react-native';
import { DEFAULT_FOOTHOLDS, DEFAULT_MAX_JOINT_SPEED, defaultLegSetup, parseLegSetup, type LegSetup } from '../../engine/gait/leg-setup';
import { bipedRig } from '../../engine/gait/rig-presets';
import { LegSetupForm } from '../../components/setup/LegSetupForm';
import { jsonOf, rowsOf, type LimitLeg } from '../../components/setup/limit-rows';
import { FOOTHOLD_FIELDS, checkDraft, draftOf, type Draft } from '../../components/setup/setup-draft';

const rig = bipedRig();

/** Every setting the form did not have before moved off its default. */
function customSetup(): LegSetup {
  const s = defaultLegSetup(rig);
  s.solver.maxJointSpeed = 123;
  s.footholds = { searchRadius: 0.9, distanceWeight: 3.5, slopeWeight: 0.25, roughnessWeight: 77, edgeWeight: 12.345678, reachWeight: 9 };
  return s;
}

describe('the leg setup form keeps every setting of the schema', () => {
  it('saves a setup with its own joint speed limit and foothold weights back unchanged', () => {
    const saved = customSetup();
    expect(saved.solver.maxJointSpeed).not.toBe(DEFAULT_MAX_JOINT_SPEED);
    expect(saved.footholds.searchRadius).not.toBe(DEFAULT_FOOTHOLDS.searchRadius);
    const again = checkDraft(draftOf(saved));
    expect(again.errors).toBeNull();
    expect(again.setup).toEqual(saved);
    expect(again.setup!.solver.maxJointSpeed).toBe(123);
    expect(again.setup!.footholds.searchRadius).toBe(0.9);
    // 12.345678 shows as 12.3 and is still saved exact while its field is untouched.
    expect(again.setup!.footholds.edgeWeight).toBe(12.345678);
  });

  it('keeps them while another setting is edited', () => {
    const edited = checkDraft({ ...draftOf(customSetup()), 'gait.dutyFactor': '0.7' }).setup!;
    expect(edited.gait.dutyFactor).toBe(0.7);
    expect(edited.solver.maxJointSpeed).toBe(123);
    expect(edited.footholds).toEqual(customSetup().footholds);
  });

  it('edits them as typed, and says a value out of the schema’s bounds beside its field', () => {
    const draft = draftOf(customSetup());
    expect(draft['solver.maxJointSpeed']).toBe('123');
    expect(draft['footholds.searchRadius']).toBe('0.9');
    const typed = checkDraft({ ...draft, 'solver.maxJointSpeed': '450', 'footholds.slopeWeight': '6' }).setup!;
    expect(typed.solver.maxJointSpeed).toBe(450);
    expect(typed.footholds.slopeWeight).toBe(6);
    const wide = checkDraft({ ...draft, 'footholds.searchRadius': '1.5' });
    expect(wide.errors?.['footholds.searchRadius']).toBe('Foothold search radius 1.5 is above the 1 limit; set it to at most 1.');
    const still = checkDraft({ ...draft, 'solver.maxJointSpeed': '0' });
    expect(still.errors?.['solver.maxJointSpeed']).toBe('Joint speed limit 0 °/s is below the 0 °/s limit; set it to above 0 °/s.');
    expect(checkDraft({ ...draft, 'footholds.edgeWeight': '' }).errors?.['footholds.edgeWeight']).toBeTruthy();
  });

  it('fills the foothold defaults into a version saved before the setup had them', () => {
    const { footholds: _dropped, ...older } = customSetup();
    const loaded = parseLegSetup(older);
    expect(checkDraft(draftOf(loaded)).setup!.footholds).toEqual(DEFAULT_FOOTHOLDS);
  });

  it('keeps a leg’s own solver settings when the leg’s joint limits are edited', () => {
    const legs: LimitLeg[] = [{ name: 'left', joints: [{ name: 'knee', slider: false }] }, { name: 'right', joints: [{ name: 'knee', slider: false }] }];
    const saved = JSON.stringify([
      { leg: 'left', limits: [{ joint: 'knee', dof: 0, min: -1, max: 0 }], solver: { lambda: 0.2 } },
      { leg: 'right', limits: [], solver: { maxIterations: 7 } },
    ]);
    const rows = rowsOf(saved, legs);
    // The knee's limit typed in degrees (−1 rad = −57.3°); removing it leaves the leg's own λ as saved.
    expect(rows).toEqual([{ leg: 'left', joint: 'knee', dof: '0', min: '-57.3', max: '0' }]);
    const edited = JSON.parse(jsonOf([{ ...rows[0], max: '10' }], legs, saved));
    expect(edited[0].solver).toEqual({ lambda: 0.2 });
    expect(edited[0].limits[0].max).toBeCloseTo((10 * Math.PI) / 180, 12);
    expect(edited[1]).toEqual({ leg: 'right', limits: [], solver: { maxIterations: 7 } });
    expect(JSON.parse(jsonOf([], legs, saved))).toEqual([
      { leg: 'left', limits: [], solver: { lambda: 0.2 } },
      { leg: 'right', limits: [], solver: { maxIterations: 7 } },
    ]);
  });
});

function Harness({ start }: { start: LegSetup }) {
  const [draft, setDraft] = useState<Draft>(() => draftOf(start));
  const errors = checkDraft(draft).errors ?? {};
  return <LegSetupForm draft={draft} errors={errors} onChange={(path, value) => setDraft((d) => ({ ...d, [path]: value }))} legs={[]} />;
}

describe('the form’s fields for them', () => {
  it('shows the joint speed limit with the solver and the foothold settings on request', () => {
    render(<Harness start={customSetup()} />);
    expect(screen.getByLabelText('Joint speed limit (°/s)').props.value).toBe('123');
    expect(screen.queryByLabelText('Search radius (share of the stride)')).toBeNull();
    fireEvent.press(screen.getByRole('button', { name: 'Show the foothold settings' }));
    for (const f of FOOTHOLD_FIELDS) expect(screen.getByLabelText(f.unit ? `${f.label} (${f.unit})` : f.label)).toBeTruthy();
    fireEvent.changeText(screen.getByLabelText('Search radius (share of the stride)'), '2');
    expect(screen.getByText('Foothold search radius 2 is above the 1 limit; set it to at most 1.')).toBeTruthy();
    // A setting that needs attention stays in view: no button folds it away.
    expect(screen.queryByRole('button', { name: 'Hide the foothold settings' })).toBeNull();
  });

  it('says a leg’s own solver settings are kept as saved', () => {
    const s = customSetup();
    s.legs = [{ leg: rig.legs[0].name, limits: [], solver: { lambda: 0.2 } }];
    render(<Harness start={s} />);
    expect(screen.getByText(`${rig.legs[0].name} has its own solver settings, kept as saved: DLS damping λ.`)).toBeTruthy();
  });
});
