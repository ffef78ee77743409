/** What changed between two profile versions: every setting and mapping value that differs, and the metric deltas. */
import { metricDeltas, type MetricDelta } from './metric-rows';
import type { LegProfile } from './schema';

export interface ValueChange {
  /** Dotted path, array items by index: "gait.dutyFactor", "legs.0.limits.1.max". */
  path: string;
  before: unknown;
  after: unknown;
}

export interface ProfileDiff {
  from: number;
  to: number;
  settings: ValueChange[];
  rig: ValueChange[];
  characterChanged: boolean;
  metrics: MetricDelta[];
}

function isPlain(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Leaf-by-leaf differences; a value present on one side only shows as undefined on the other. */
export function valueChanges(before: unknown, after: unknown, path = ''): ValueChange[] {
  if (Array.isArray(before) && Array.isArray(after)) {
    const out: ValueChange[] = [];
    for (let i = 0; i < Math.max(before.length, after.length); i++) out.push(...valueChanges(before[i], after[i], path ? `${path}.${i}` : `${i}`));
    return out;
  }
  if (isPlain(before) && isPlain(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
    return keys.flatMap((k) => valueChanges(before[k], after[k], path ? `${path}.${k}` : k));
  }
  return JSON.stringify(before) === JSON.stringify(after) ? [] : [{ path, before, after }];
}

export function diffLegProfiles(a: LegProfile, b: LegProfile): ProfileDiff {
  return {
    from: a.version,
    to: b.version,
    settings: valueChanges(a.legSetup, b.legSetup),
    rig: valueChanges(a.rig, b.rig),
    characterChanged: a.character.sha256 !== b.character.sha256,
    metrics: metricDeltas(a.metrics, b.metrics),
  };
}
