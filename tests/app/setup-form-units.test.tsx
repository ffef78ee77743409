import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { bipedRig } from '../../engine/gait/rig-presets';
import { SOLVER_METHODS } from '../../engine/ik/options';
import { checkDraft, draftOf, inDegrees, roundedText, solverFieldsFor } from '../../components/setup/setup-draft';
import { gaitName, solverMethodName } from '../../components/setup/names';
import { formatLocalMoment } from '../../components/setup/local-dates';

// Degrees and radians: 180° = π rad (the definition of the radian, ISO 80000-3:2019 item 3-5).
describe('angles in the leg setup form', () => {
  it('shows radians as degrees and sends radians back', () => {
    const setup = defaultLegSetup(bipedRig());
    setup.solver.maxStepAngle = Math.PI / 4;
    setup.solver.gammaMax = Math.PI / 6;
    const draft = draftOf(setup);
    expect(draft['solver.maxStepAngle']).toBe('45');
    expect(draft['solver.gammaMax']).toBe('30');
    const typed = checkDraft({ ...draft, 'solver.maxStepAngle': '90' });
    expect(typed.setup!.solver.maxStepAngle).toBeCloseTo(Math.PI / 2, 12);
  });

  it('says an out-of-range angle in degrees, not in the schema’s radians', () => {
    const draft = draftOf(defaultLegSetup(bipedRig()));
    const checked = checkDraft({ ...draft, 'solver.maxStepAngle': '200' });
    // LegSetupSchema caps the step at π rad, which is 180°.
    expect(checked.errors!['solver.maxStepAngle']).toBe('Use at most 180°.');
    expect(inDegrees('Too small: expected number to be >0')).toBe('Use more than 0°.');
  });
});

describe('rounded display', () => {
  it('shows three significant digits and keeps the exact value while the field is untouched', () => {
    const setup = defaultLegSetup(bipedRig());
    setup.gait.timing = { mode: 'speed', speed: 1.1292929292 };
    const draft = draftOf(setup);
    expect(draft['gait.timing.value']).toBe('1.13');
    // Saved unchanged, the speed is still the engine's, not the rounding.
    const same = checkDraft(draft).setup!;
    expect(same.gait.timing.mode === 'speed' && same.gait.timing.speed).toBe(1.1292929292);
    const edited = checkDraft({ ...draft, 'gait.timing.value': '1.2' }).setup!;
    expect(edited.gait.timing.mode === 'speed' && edited.gait.timing.speed).toBe(1.2);
    // Whole numbers stay whole: an iteration budget of 1234 is not rounded to 1230.
    expect(roundedText(1234)).toBe('1234');
    // Tiny values are written out, never in exponent form.
    expect(roundedText(5.72957795e-8)).toBe('0.0000000573');
  });
});

describe('only the chosen method’s settings', () => {
  const paths = (method: string) => solverFieldsFor(method, false).map((f) => f.path);
  it('gives DLS its damping and SDLS its γmax, and neither the other’s', () => {
    // DLS: Δθ = Jᵀ(JJᵀ + λ²I)⁻¹e (Wampler 1986); SDLS clamps each singular direction by γmax (Buss & Kim 2005).
    expect(paths('dls')).toContain('solver.lambda');
    expect(paths('dls')).not.toContain('solver.gammaMax');
    expect(paths('sdls')).toContain('solver.gammaMax');
    expect(paths('sdls')).not.toContain('solver.lambda');
    // The pseudoinverse drops small singular values (its threshold); CCD turns one joint at a time, no Jacobian.
    expect(paths('pseudoinverse')).toContain('solver.svdThreshold');
    expect(paths('ccd')).not.toEqual(expect.arrayContaining(['solver.lambda']));
    expect(paths('ccd')).not.toContain('solver.clampDistance');
    expect(paths('transpose')).not.toContain('solver.lambda');
  });
  it('shows the orientation settings only when the sole is turned to the ground', () => {
    expect(solverFieldsFor('dls', false).map((f) => f.path)).not.toContain('solver.orientationTolerance');
    expect(solverFieldsFor('dls', true).map((f) => f.path)).toContain('solver.orientationTolerance');
  });
});

describe('names instead of codes', () => {
  it('names every solver method and gait pattern', () => {
    expect(SOLVER_METHODS.map(solverMethodName)).toEqual(['DLS', 'SDLS', 'Jacobian transpose', 'Pseudoinverse', 'Adaptive DLS', 'CCD']);
    expect(gaitName('biped-walk')).toBe('Two-leg walk');
    expect(gaitName('hexapod-tripod')).toBe('Six-leg tripod');
    expect(gaitName('a-newer-pattern')).toBe('a-newer-pattern');
  });
});

describe('dates in the reader’s locale', () => {
  it('follows the locale’s own order (CLDR medium date patterns, from memory)', () => {
    const t = Date.UTC(2026, 11, 1, 9, 5);
    const gb = formatLocalMoment(t, 'en-GB');
    const us = formatLocalMoment(t, 'en-US');
    expect(gb).toMatch(/^1 Dec 2026/);
    expect(us).toMatch(/^Dec 1, 2026/);
  });
});
