/**
 * The regression verdict of a game build: the suite re-run on the current character against what the published
 * version earned. Trials are deterministic, so the same file and setup give the same figures and pass; the
 * tolerances only absorb changes too small to see.
 */
import { z } from 'zod';
import { STUMBLE_KINDS } from '../metrics/stumble-thresholds';
import { metricDeltas, type MetricDelta } from './metric-rows';
import type { SuiteMetrics } from './suite-metrics';

export const CheckTolerancesSchema = z.object({
  /** Footing score points the build may lose. */
  score: z.number().min(0).max(100).default(0.5),
  /** Stumbles per 100 steps any one kind may gain. */
  stumbles: z.number().min(0).max(100).default(0.5),
});
export type CheckTolerances = z.infer<typeof CheckTolerancesSchema>;

export interface CheckVerdict {
  pass: boolean;
  /** One sentence per regression, naming the metric and both figures. */
  regressions: string[];
  deltas: MetricDelta[];
}

export function checkAgainstPublished(published: SuiteMetrics, current: SuiteMetrics, tolerances: Partial<CheckTolerances> = {}): CheckVerdict {
  const tol = CheckTolerancesSchema.parse(tolerances);
  const regressions: string[] = [];
  const drop = published.footingScore - current.footingScore;
  if (drop > tol.score) {
    regressions.push(`footing score fell from ${published.footingScore.toFixed(1)} to ${current.footingScore.toFixed(1)} (more than ${tol.score} points)`);
  }
  for (const k of STUMBLE_KINDS) {
    const before = published.stumblesPer100Steps[k];
    const after = current.stumblesPer100Steps[k];
    if (after - before > tol.stumbles) {
      regressions.push(`${k} stumbles rose from ${before.toFixed(2)} to ${after.toFixed(2)} per 100 steps (more than ${tol.stumbles})`);
    }
  }
  return { pass: regressions.length === 0, regressions, deltas: metricDeltas(published, current) };
}
