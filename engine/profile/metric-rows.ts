/** The suite metrics as table rows: label, unit, group and which way is better. Shared by compare, version diffs and the regression check. */
import { STUMBLE_KINDS } from '../metrics/stumble-thresholds';
import type { SuiteMetrics } from './suite-metrics';

export type MetricGroup = 'score' | 'stumbles' | 'response';

export interface MetricRow {
  key: string;
  label: string;
  group: MetricGroup;
  unit: string;
  /** 'neither' for figures that are context, not quality (how many steps a suite took). */
  better: 'higher' | 'lower' | 'neither';
  /** Decimals shown. */
  digits: number;
  value: (m: SuiteMetrics) => number | null;
}

export const METRIC_GROUPS: readonly { group: MetricGroup; label: string }[] = [
  { group: 'score', label: 'Score' },
  { group: 'stumbles', label: 'Stumbles per 100 steps' },
  { group: 'response', label: 'Step response' },
];

export const METRIC_ROWS: readonly MetricRow[] = [
  { key: 'footingScore', label: 'Footing score', group: 'score', unit: '', better: 'higher', digits: 1, value: (m) => m.footingScore },
  { key: 'steps', label: 'Steps', group: 'score', unit: '', better: 'neither', digits: 0, value: (m) => m.steps },
  ...STUMBLE_KINDS.map(
    (k): MetricRow => ({ key: `stumbles.${k}`, label: k, group: 'stumbles', unit: '/100', better: 'lower', digits: 2, value: (m) => m.stumblesPer100Steps[k] }),
  ),
  { key: 'trackingRms', label: 'Tracking RMS', group: 'response', unit: 'mm', better: 'lower', digits: 2, value: (m) => m.trackingRms * 1000 },
  { key: 'touchdownOvershoot', label: 'Touchdown overshoot', group: 'response', unit: '%', better: 'lower', digits: 1, value: (m) => m.touchdownOvershootPercent },
  { key: 'touchdownSettle', label: 'Touchdown settling', group: 'response', unit: 's', better: 'lower', digits: 3, value: (m) => m.touchdownSettleSeconds },
  { key: 'bodyOvershoot', label: 'Body step-up overshoot', group: 'response', unit: '%', better: 'lower', digits: 1, value: (m) => m.bodyOvershootPercent },
  { key: 'bodySettle', label: 'Body step-up settling', group: 'response', unit: 's', better: 'lower', digits: 3, value: (m) => m.bodySettleSeconds },
];

export interface MetricDelta {
  key: string;
  label: string;
  unit: string;
  before: number | null;
  after: number | null;
  /** after − before; null when either is missing. */
  delta: number | null;
  /** True when the change goes the better way, false the worse way, null when unchanged or unknown. */
  improved: boolean | null;
}

export function metricDeltas(before: SuiteMetrics, after: SuiteMetrics): MetricDelta[] {
  return METRIC_ROWS.map((r) => {
    const a = r.value(before);
    const b = r.value(after);
    const delta = a === null || b === null ? null : b - a;
    const improved = delta === null || delta === 0 || r.better === 'neither' ? null : r.better === 'higher' ? delta > 0 : delta < 0;
    return { key: r.key, label: r.label, unit: r.unit, before: a, after: b, delta, improved };
  });
}

/** Index of the best value in a row (ties: the first), or -1 when no value is known. */
export function bestIndex(row: MetricRow, values: readonly (number | null)[]): number {
  let best = -1;
  if (row.better === 'neither') return best;
  values.forEach((v, i) => {
    if (v === null) return;
    const cur = best < 0 ? null : values[best];
    if (cur === null || cur === undefined || (row.better === 'higher' ? v > cur : v < cur)) best = i;
  });
  return best;
}
