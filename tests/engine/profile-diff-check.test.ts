/** Version diffs and the regression verdict, checked against values computed by hand from the two inputs (common practice, no source). */
import { skitter } from '../../seeds/characters';
import { diffLegProfiles, valueChanges } from '../../engine/profile/diff';
import { checkAgainstPublished } from '../../engine/profile/check';
import { bestIndex, METRIC_ROWS, metricDeltas } from '../../engine/profile/metric-rows';
import { summariseSuite } from '../../engine/profile/suite-metrics';
import { footingScore } from '../../engine/metrics/footing-score';
import type { TrialMetrics } from '../../engine/metrics/trial-metrics';
import type { LegProfile } from '../../engine/profile/schema';
import { demoCharacter, profileOf } from './profile/fixtures';

let v1: LegProfile;
let v2: LegProfile;
beforeAll(async () => {
  const c = await demoCharacter(skitter);
  v1 = profileOf(c);
  const setup = { ...v1.legSetup, solver: { ...v1.legSetup.solver, lambda: v1.legSetup.solver.lambda + 0.05 }, gait: { ...v1.legSetup.gait, dutyFactor: 0.8 } };
  v2 = profileOf(c, setup, 2);
});

describe('diffLegProfiles', () => {
  it('lists exactly the settings that changed, with both values', () => {
    const d = diffLegProfiles(v1, v2);
    expect(d.from).toBe(1);
    expect(d.to).toBe(2);
    expect(d.settings).toEqual([
      { path: 'solver.lambda', before: v1.legSetup.solver.lambda, after: v1.legSetup.solver.lambda + 0.05 },
      { path: 'gait.dutyFactor', before: v1.legSetup.gait.dutyFactor, after: 0.8 },
    ]);
    expect(d.rig).toEqual([]);
    expect(d.characterChanged).toBe(false);
  });

  it('gives each metric delta as after − before of the two published figures', () => {
    const d = diffLegProfiles(v1, v2);
    const score = d.metrics.find((m) => m.key === 'footingScore')!;
    expect(score.before).toBe(v1.metrics.footingScore);
    expect(score.after).toBe(v2.metrics.footingScore);
    expect(score.delta).toBeCloseTo(v2.metrics.footingScore - v1.metrics.footingScore, 12);
    const skid = d.metrics.find((m) => m.key === 'stumbles.skid')!;
    expect(skid.delta).toBeCloseTo(v2.metrics.stumblesPer100Steps.skid - v1.metrics.stumblesPer100Steps.skid, 12);
  });

  it('walks arrays and nested objects, and shows a value on one side only', () => {
    expect(valueChanges({ a: [1, { b: 2 }] }, { a: [1, { b: 3 }, 4] })).toEqual([
      { path: 'a.1.b', before: 2, after: 3 },
      { path: 'a.2', before: undefined, after: 4 },
    ]);
  });
});

/** A trial's metrics with the given counts; everything else clean. */
function trial(steps: number, counts: Partial<Record<'sink' | 'skid' | 'reach-miss' | 'scuff' | 'snap', number>>, rms = 0.002): TrialMetrics {
  const kinds = ['sink', 'skid', 'reach-miss', 'scuff', 'snap'] as const;
  const stumbles = Object.fromEntries(kinds.map((k) => [k, { count: counts[k] ?? 0, per100Steps: ((counts[k] ?? 0) * 100) / steps }])) as TrialMetrics['stumbles'];
  const summary = { count: steps, overshootMeanPercent: 2, overshootMaxPercent: 4, settleMeanSeconds: 0.1, unsettled: 0 };
  return {
    simSeconds: 10,
    frames: 600,
    steps,
    stumbles,
    events: [],
    tracking: { rms, max: rms * 2 },
    touchdown: summary,
    bodyStepUp: { ...summary, count: 1 },
    solver: { solves: 1200, iterationsPerSolve: 3, iterationsPerFrameMean: 6, iterationsPerFrameMax: 12, errorMean: 0, errorMax: 0, unconverged: 0 },
    footingScore: 0,
  };
}

describe('summariseSuite', () => {
  it('pools stumbles over all steps and scores the pool with the footing score formula', () => {
    const m = summariseSuite([
      { course: 'a', metrics: trial(40, { skid: 2 }) },
      { course: 'b', metrics: trial(60, { skid: 1, snap: 3 }) },
    ]);
    // 3 skids and 3 snaps in 100 steps.
    expect(m.steps).toBe(100);
    expect(m.stumblesPer100Steps.skid).toBe(3);
    expect(m.stumblesPer100Steps.snap).toBe(3);
    expect(m.footingScore).toBe(
      footingScore({ per100Steps: { sink: 0, skid: 3, 'reach-miss': 0, scuff: 0, snap: 3 }, trackingRms: 0.002, touchdownOvershootPercent: 2 }),
    );
  });
});

describe('checkAgainstPublished', () => {
  const published = summariseSuite([{ course: 'a', metrics: trial(100, { skid: 1 }) }]);

  it('passes the same figures', () => {
    const v = checkAgainstPublished(published, published);
    expect(v.pass).toBe(true);
    expect(v.regressions).toEqual([]);
    expect(v.deltas.every((d) => d.delta === 0 || d.delta === null)).toBe(true);
  });

  it('fails when a stumble kind rises past its tolerance, and says which and by how much', () => {
    const worse = summariseSuite([{ course: 'a', metrics: trial(100, { skid: 1, 'reach-miss': 4 }) }]);
    const v = checkAgainstPublished(published, worse);
    expect(v.pass).toBe(false);
    expect(v.regressions.some((r) => r.startsWith('reach-miss stumbles rose from 0.00 to 4.00'))).toBe(true);
    expect(v.regressions.some((r) => r.startsWith('footing score fell'))).toBe(true);
  });

  it('lets changes inside the tolerances pass', () => {
    const slightly = summariseSuite([{ course: 'a', metrics: trial(100, { skid: 1 }, 0.00205) }]);
    expect(checkAgainstPublished(published, slightly).pass).toBe(true);
  });
});

describe('metric rows', () => {
  it('marks the best value by the row’s direction', () => {
    const score = METRIC_ROWS.find((r) => r.key === 'footingScore')!;
    const skid = METRIC_ROWS.find((r) => r.key === 'stumbles.skid')!;
    expect(bestIndex(score, [40, 72, 55])).toBe(1);
    expect(bestIndex(skid, [3, 1, null])).toBe(1);
    expect(bestIndex(skid, [null, null])).toBe(-1);
  });

  it('says whether a change is an improvement', () => {
    const a = summariseSuite([{ course: 'a', metrics: trial(100, { skid: 4 }) }]);
    const b = summariseSuite([{ course: 'a', metrics: trial(100, { skid: 1 }) }]);
    const d = metricDeltas(a, b);
    expect(d.find((x) => x.key === 'stumbles.skid')!.improved).toBe(true);
    expect(d.find((x) => x.key === 'footingScore')!.improved).toBe(true);
  });
});
