/**
 * What a published file and a build check say about small numbers: the file carries no float noise in its leg
 * setup, and the check calls a change inside its stated tolerance "unchanged" rather than better or worse.
 */
import { skitter } from '../../seeds/characters';
import { exportLegProfile, PROFILE_DECIMALS, roundProfileNumbers } from '../../engine/profile/export';
import { checkAgainstPublished, describeTolerances } from '../../engine/profile/check';
import { summariseSuite } from '../../engine/profile/suite-metrics';
import type { TrialMetrics } from '../../engine/metrics/trial-metrics';
import type { LegProfile } from '../../engine/profile/schema';
import { demoCharacter, profileOf } from './profile/fixtures';

/** Every number literal in a JSON text with more fractional digits than `decimals`. */
const noisy = (text: string, decimals: number) => (text.match(/-?\d+\.\d+(e-?\d+)?/g) ?? []).filter((n) => (n.split('.')[1].split('e')[0].length > decimals || /e/.test(n)));

describe('publishing rounds the leg setup', () => {
  let p: LegProfile;
  beforeAll(async () => {
    p = profileOf(await demoCharacter(skitter));
  });

  it('writes 0.1 + 0.2 as 0.3 and 0.065 one ulp off as 0.065', () => {
    // IEEE 754 doubles: 0.1 + 0.2 is 0.30000000000000004 (any floating-point reference, e.g. ECMA-262 Number).
    expect(0.1 + 0.2).not.toBe(0.3);
    const noise = { ...p, legSetup: { ...p.legSetup, solver: { ...p.legSetup.solver, lambda: 0.1 + 0.2 }, gait: { ...p.legSetup.gait, stepHeight: 0.065 * 1.0000000000000002 } } };
    expect(noise.legSetup.gait.stepHeight).not.toBe(0.065);
    const file = JSON.parse(exportLegProfile(noise)) as LegProfile;
    expect(file.legSetup.solver.lambda).toBe(0.3);
    expect(file.legSetup.gait.stepHeight).toBe(0.065);
  });

  it('leaves no number in the leg setup with more decimals than the schema states', () => {
    const text = JSON.stringify(JSON.parse(exportLegProfile(p)).legSetup);
    // The defaults hold π/4 and joint limits in radians, so unrounded there would be 16-digit fractions.
    expect(noisy(JSON.stringify(p.legSetup), PROFILE_DECIMALS).length).toBeGreaterThan(0);
    expect(noisy(text, PROFILE_DECIMALS)).toEqual([]);
  });

  it('leaves integers, strings and short numbers as they are', () => {
    expect(roundProfileNumbers({ a: 3, b: 'x0.30000000000000004', c: [0.25, -0.0000001] })).toEqual({ a: 3, b: 'x0.30000000000000004', c: [0.25, 0] });
  });
});

/** A one-course suite with the given tracking RMS (m) and skid count over 100 steps. */
function suite(rms: number, skids = 1) {
  const kinds = ['sink', 'skid', 'reach-miss', 'scuff', 'snap'] as const;
  const counts: Record<string, number> = { skid: skids };
  const summary = { count: 100, overshootMeanPercent: 2, overshootMaxPercent: 4, settleMeanSeconds: 0.1, unsettled: 0 };
  const metrics: TrialMetrics = {
    simSeconds: 10,
    frames: 600,
    steps: 100,
    stumbles: Object.fromEntries(kinds.map((k) => [k, { count: counts[k] ?? 0, per100Steps: counts[k] ?? 0 }])) as TrialMetrics['stumbles'],
    events: [],
    tracking: { rms, max: rms * 2 },
    touchdown: summary,
    bodyStepUp: summary,
    solver: { solves: 1200, iterationsPerSolve: 3, iterationsPerFrameMean: 6, iterationsPerFrameMax: 12, errorMean: 0, errorMax: 0, unconverged: 0 },
    footingScore: 0,
  };
  return summariseSuite([{ course: 'a', metrics }]);
}

describe('the check’s tolerance', () => {
  it('calls a 0.0013 mm tracking difference unchanged, and a 0.5 mm one improved', () => {
    const published = suite(0.002);
    const tiny = checkAgainstPublished(published, suite(0.002 - 0.0000013)).deltas.find((d) => d.key === 'trackingRms')!;
    expect(tiny.delta).toBeCloseTo(-0.0013, 6);
    expect(tiny.improved).toBeNull();
    expect(tiny.tolerance).toBe(0.01);
    const real = checkAgainstPublished(published, suite(0.0015)).deltas.find((d) => d.key === 'trackingRms')!;
    expect(real.improved).toBe(true);
  });

  it('uses the given stumble tolerance for the verdict word as well as for pass/fail', () => {
    const published = suite(0.002, 1);
    // One more skid in 100 steps is +1 per 100: worse under a 0.5 tolerance, unchanged (and passing) under 2.
    expect(checkAgainstPublished(published, suite(0.002, 2)).deltas.find((d) => d.key === 'stumbles.skid')!.improved).toBe(false);
    const lenient = checkAgainstPublished(published, suite(0.002, 2), { stumbles: 2, score: 100 });
    expect(lenient.pass).toBe(true);
    expect(lenient.deltas.find((d) => d.key === 'stumbles.skid')!.improved).toBeNull();
  });

  it('states the tolerance in words', () => {
    const text = describeTolerances({ score: 0.5, stumbles: 0.5 });
    expect(text).toMatch(/footing score ±0\.5 points/);
    expect(text).toMatch(/tracking rms ±0\.01 mm/);
    expect(text).toMatch(/count as unchanged/);
  });
});
