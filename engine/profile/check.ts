/**
 * The regression verdict of a game build: the suite re-run on the current character against what the published
 * version earned. Trials are deterministic, so the same file and setup give the same figures and pass; the
 * tolerances only absorb changes too small to matter, and a difference inside its tolerance is called unchanged.
 */
import { z } from 'zod';
import { STUMBLE_KINDS } from '../metrics/stumble-thresholds';
import { METRIC_ROWS, metricDeltas, type MetricDelta, type MetricRow } from './metric-rows';
import type { SuiteMetrics } from './suite-metrics';

export const CheckTolerancesSchema = z.object({
  /** Footing score points the build may lose. */
  score: z.number().min(0).max(100).default(0.5),
  /** Stumbles per 100 steps any one kind may gain. */
  stumbles: z.number().min(0).max(100).default(0.5),
});
export type CheckTolerances = z.infer<typeof CheckTolerancesSchema>;

/** A metric's change with the band inside which the check calls it unchanged (`improved` is then null). */
export interface CheckDelta extends MetricDelta {
  /** In the row's own unit (points, per 100 steps, mm, %, s). */
  tolerance: number;
}

export interface CheckVerdict {
  pass: boolean;
  /** One sentence per regression, naming the metric and both figures. */
  regressions: string[];
  deltas: CheckDelta[];
  tolerances: CheckTolerances;
}

/**
 * The band per row: the given tolerances for the score and the stumble rates; for the step-response figures the
 * resolution they are shown at (one unit of the last digit), since a change below it cannot be seen in any report.
 */
export function toleranceOf(row: MetricRow, tol: CheckTolerances): number {
  if (row.key === 'footingScore') return tol.score;
  if (row.group === 'stumbles') return tol.stumbles;
  return 10 ** -row.digits;
}

/** One sentence a build log can show: what the check forgives, so "unchanged" has a stated meaning. */
export function describeTolerances(tol: CheckTolerances): string {
  const response = METRIC_ROWS.filter((r) => r.group === 'response')
    .map((r) => `${r.label.toLowerCase()} ±${10 ** -r.digits} ${r.unit}`)
    .join(', ');
  return `Tolerance: footing score ±${tol.score} points, each stumble kind ±${tol.stumbles} per 100 steps, ${response}; differences inside it count as unchanged.`;
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
  const deltas = metricDeltas(published, current).map((d, i): CheckDelta => {
    const tolerance = toleranceOf(METRIC_ROWS[i], tol);
    // Same boundary as the regressions above: a change up to the tolerance itself is inside it.
    const inside = d.delta !== null && Math.abs(d.delta) <= tolerance;
    return { ...d, tolerance, improved: inside ? null : d.improved };
  });
  return { pass: regressions.length === 0, regressions, deltas, tolerances: tol };
}
