/**
 * What a leg setup earned on a suite: the trials' metrics pooled over the
 * courses (stumbles per 100 steps over all steps, tracking and overshoot
 * weighted by steps) and one footing score by the same formula as a trial's.
 */
import { z } from 'zod';
import { footingScore } from '../metrics/footing-score';
import { STUMBLE_KINDS, type StumbleKind } from '../metrics/stumble-thresholds';
import type { TrialMetrics } from '../metrics/trial-metrics';

const nonNeg = z.number().min(0);
const StumbleRatesSchema = z.object({ sink: nonNeg, skid: nonNeg, 'reach-miss': nonNeg, scuff: nonNeg, snap: nonNeg });

export const CourseMetricsSchema = z.object({
  course: z.string(),
  footingScore: z.number().min(0).max(100),
  steps: z.number().int().min(0),
  stumblesPer100Steps: StumbleRatesSchema,
});

export const SuiteMetricsSchema = z.object({
  footingScore: z.number().min(0).max(100),
  steps: z.number().int().min(0),
  stumblesPer100Steps: StumbleRatesSchema,
  /** RMS foot-to-target distance, m. */
  trackingRms: nonNeg,
  touchdownOvershootPercent: nonNeg,
  /** Mean 2 % settling time of the feet after touchdown, s; null when none settled. */
  touchdownSettleSeconds: nonNeg.nullable(),
  bodyOvershootPercent: nonNeg,
  bodySettleSeconds: nonNeg.nullable(),
  courses: z.array(CourseMetricsSchema),
});

export type StumbleRates = z.infer<typeof StumbleRatesSchema>;
export type CourseMetrics = z.infer<typeof CourseMetricsSchema>;
export type SuiteMetrics = z.infer<typeof SuiteMetricsSchema>;

const rates = (f: (k: StumbleKind) => number): StumbleRates =>
  Object.fromEntries(STUMBLE_KINDS.map((k) => [k, f(k)])) as StumbleRates;

/** Rounds to a fixed number of decimals, so published figures do not carry float noise. */
const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;

function weighted(items: { w: number; v: number | null }[]): number | null {
  let sw = 0;
  let s = 0;
  for (const { w, v } of items) {
    if (v === null) continue;
    sw += w;
    s += w * v;
  }
  return sw > 0 ? s / sw : null;
}

/** Pools the per-course trial metrics of one setup into suite metrics. */
export function summariseSuite(trials: readonly { course: string; metrics: TrialMetrics }[]): SuiteMetrics {
  if (trials.length === 0) throw new Error('a suite needs at least one course');
  const steps = trials.reduce((s, t) => s + t.metrics.steps, 0);
  const per100 = rates((k) => (trials.reduce((s, t) => s + t.metrics.stumbles[k].count, 0) * 100) / Math.max(steps, 1));
  const frames = trials.reduce((s, t) => s + t.metrics.frames, 0);
  const trackingRms = Math.sqrt(trials.reduce((s, t) => s + t.metrics.tracking.rms ** 2 * t.metrics.frames, 0) / Math.max(frames, 1));
  const td = (f: (m: TrialMetrics) => number | null) => weighted(trials.map((t) => ({ w: t.metrics.touchdown.count, v: f(t.metrics) })));
  const body = (f: (m: TrialMetrics) => number | null) => weighted(trials.map((t) => ({ w: t.metrics.bodyStepUp.count, v: f(t.metrics) })));
  const touchdownOvershootPercent = td((m) => m.touchdown.overshootMeanPercent) ?? 0;
  const touchdownSettle = td((m) => m.touchdown.settleMeanSeconds);
  const bodySettle = body((m) => m.bodyStepUp.settleMeanSeconds);
  return {
    footingScore: footingScore({ per100Steps: per100, trackingRms, touchdownOvershootPercent }),
    steps,
    stumblesPer100Steps: rates((k) => round(per100[k], 4)),
    trackingRms: round(trackingRms, 7),
    touchdownOvershootPercent: round(touchdownOvershootPercent, 4),
    touchdownSettleSeconds: touchdownSettle === null ? null : round(touchdownSettle, 4),
    bodyOvershootPercent: round(body((m) => m.bodyStepUp.overshootMeanPercent) ?? 0, 4),
    bodySettleSeconds: bodySettle === null ? null : round(bodySettle, 4),
    courses: trials.map((t) => ({
      course: t.course,
      footingScore: t.metrics.footingScore,
      steps: t.metrics.steps,
      stumblesPer100Steps: rates((k) => round(t.metrics.stumbles[k].per100Steps, 4)),
    })),
  };
}
