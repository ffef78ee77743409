/**
 * Per-leg joint limit overrides as the form's rows (degrees for turning joints, metres for sliders, kept as typed
 * text) and back to the leg setup's JSON (radians). Only the limits are edited here: whatever else a leg's override
 * holds (its own solver settings) is carried over as saved.
 */
import type { LegOverride } from '../../engine/gait/leg-setup';
import { DEG_PER_RAD, roundedText } from './setup-draft';

/** A leg as the editor needs it: its joints, and which of them slide (metres) rather than turn (degrees). */
export interface LimitLeg {
  name: string;
  joints: { name: string; slider: boolean }[];
}

export type LimitRow = { leg: string; joint: string; dof: string; min: string; max: string };

const isSlider = (legs: LimitLeg[], leg: string, joint: string) => !!legs.find((l) => l.name === leg)?.joints.find((j) => j.name === joint)?.slider;

/** The unit a row is typed in. */
export const rowUnit = (legs: LimitLeg[], r: LimitRow) => (isSlider(legs, r.leg, r.joint) ? 'm' : '°');

/** The overrides in the setup's JSON; none when it does not parse. */
export function overridesOf(json: string): LegOverride[] {
  try {
    const parsed: unknown = JSON.parse(json || '[]');
    return Array.isArray(parsed) ? (parsed as LegOverride[]) : [];
  } catch {
    return [];
  }
}

/** Rows as typed: degrees for turning joints, metres for sliders. */
export function rowsOf(json: string, legs: LimitLeg[]): LimitRow[] {
  return overridesOf(json).flatMap((l) =>
    (Array.isArray(l.limits) ? l.limits : []).map((lim) => {
      const scale = isSlider(legs, l.leg, lim.joint) ? 1 : DEG_PER_RAD;
      return { leg: l.leg, joint: lim.joint, dof: String(lim.dof ?? 0), min: roundedText(lim.min * scale), max: roundedText(lim.max * scale) };
    }),
  );
}

/** Whether an override holds more than its limits (a leg's own solver settings). */
const holdsMore = (o: LegOverride) => Object.keys(o).some((k) => k !== 'leg' && k !== 'limits');

/**
 * The setup's JSON for these rows (radians for turning joints); a blank or broken number becomes null, which the
 * schema refuses. `saved` is the JSON the rows were read from: each leg keeps the rest of its override as saved,
 * and a leg whose override holds more than limits stays even with no limit left.
 */
export function jsonOf(rows: LimitRow[], legs: LimitLeg[], saved: string): string {
  const byLeg = new Map<string, { joint: string; dof: number; min: number | null; max: number | null }[]>();
  const num = (t: string, scale: number) => (t.trim() === '' || !Number.isFinite(Number(t)) ? null : Number(t) / scale);
  for (const r of rows) {
    const scale = isSlider(legs, r.leg, r.joint) ? 1 : DEG_PER_RAD;
    const list = byLeg.get(r.leg) ?? [];
    list.push({ joint: r.joint, dof: Number(r.dof), min: num(r.min, scale), max: num(r.max, scale) });
    byLeg.set(r.leg, list);
  }
  const before = overridesOf(saved);
  const kept = before.filter((o) => byLeg.has(o.leg) || holdsMore(o)).map((o) => ({ ...o, limits: byLeg.get(o.leg) ?? [] }));
  const added = [...byLeg].filter(([leg]) => !before.some((o) => o.leg === leg)).map(([leg, limits]) => ({ leg, limits }));
  return JSON.stringify([...kept, ...added]);
}
