/**
 * Reading a finished dial-in for the screen: did it find anything better than the start, by how much, and
 * the start's stumbles per course. The job's result may carry more than the schema says (newer servers add
 * per-course stumbles and the start's values), so extra fields are read defensively and never required.
 */
import { STUMBLE_KINDS, type StumbleKind } from '../../engine/metrics/stumble-thresholds';
import { tunableByKey, type DialInResult } from '../../schemas/dial-ins';

export const DEG_PER_RAD = 180 / Math.PI;

/** Scores show to one decimal; a change that rounds to 0.0 there is no change to the reader. */
export const SCORE_DECIMALS = 1;
const rounded = (v: number) => Math.round(v * 10 ** SCORE_DECIMALS) / 10 ** SCORE_DECIMALS;

/** After minus before, as shown (to one decimal); null while the result has no before/after. */
export function shownGain(result: DialInResult | undefined): number | null {
  if (!result?.before || !result.after) return null;
  return rounded(result.after.footingScore) - rounded(result.before.footingScore);
}

/** True when the shown "after" is better than the shown "before" (so the better colour is earned). */
export const isBetter = (before: number, after: number) => rounded(after) > rounded(before);

/** Found nothing worth saving: the best is no better than the start once both are rounded as shown. */
export function foundNothing(result: DialInResult | undefined): boolean {
  const gain = shownGain(result);
  // The server's own verdict (the best's penalty below the start's) can only take a gain away, never add one:
  // a lower penalty that still shows the same score is nothing the reader can see.
  const flagged = (result as { beatsStart?: unknown; improved?: unknown } | undefined);
  if (flagged?.beatsStart === false || flagged?.improved === false) return true;
  return gain !== null && gain <= 0;
}

export type StumbleRates = Record<StumbleKind, number>;

/** Per-100-step rates from either `{ sink: 3.2 }` or `{ sink: { per100Steps: 3.2 } }`; null when not there. */
export function ratesOf(raw: unknown): StumbleRates | null {
  if (!raw || typeof raw !== 'object') return null;
  const out = {} as StumbleRates;
  for (const k of STUMBLE_KINDS) {
    const v = (raw as Record<string, unknown>)[k];
    const n = typeof v === 'number' ? v : typeof (v as { per100Steps?: unknown })?.per100Steps === 'number' ? (v as { per100Steps: number }).per100Steps : NaN;
    if (!Number.isFinite(n)) return null;
    out[k] = n;
  }
  return out;
}

/** The start's stumbles on one course, if the result carries them (as `stumbles` or `per100Steps` of an entry). */
export function startStumbles(result: DialInResult, courseId: number): StumbleRates | null {
  const entry = result.before?.perCourse.find((c) => c.courseId === courseId) as Record<string, unknown> | undefined;
  if (!entry) return null;
  return ratesOf(entry.stumbles) ?? ratesOf(entry.per100Steps) ?? ratesOf((entry.metrics as { stumbles?: unknown } | undefined)?.stumbles);
}

/** A tunable setting as people read it: radians shown in degrees. */
export function displayUnit(key: string): { unit: string; scale: number } {
  const t = tunableByKey(key);
  if (t?.unit === 'rad') return { unit: '°', scale: DEG_PER_RAD };
  return { unit: t?.unit ?? '', scale: 1 };
}

/** A setting's value for display: 3 significant digits, whole numbers whole, in the display unit. */
export function showValue(key: string, v: number): string {
  const { unit, scale } = displayUnit(key);
  const x = v * scale;
  const text = Number.isInteger(x) || tunableByKey(key)?.integer ? String(Math.round(x)) : String(parseFloat(x.toPrecision(3)));
  return unit ? (unit === '°' ? `${text}°` : `${text} ${unit}`) : text;
}

/** The value at a setting's path in a leg setup (the start's value of a tuned setting). */
export function valueAt(setup: unknown, key: string): number | null {
  const t = tunableByKey(key);
  if (!t) return null;
  const v = t.path.reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], setup);
  return typeof v === 'number' ? v : null;
}

/** The mean penalty P (score = 100·e^(−P)) of the start and the best, when the result carries them. */
export function penalties(result: DialInResult): { start: number; best: number } | null {
  const start = (result.before as { penalty?: unknown } | undefined)?.penalty;
  const best = (result.after as { penalty?: unknown } | undefined)?.penalty;
  return typeof start === 'number' && typeof best === 'number' ? { start, best } : null;
}

const STOP_REASONS: Record<string, string> = {
  budget: 'it tried every candidate of its budget',
  stalled: 'no candidate improved on the best for a while',
  converged: 'every search settled on one point',
};

/** Why the search ended, in words, when the result says. */
export function stopReasonText(result: DialInResult): string | null {
  const r = (result as { stopReason?: unknown }).stopReason;
  return typeof r === 'string' ? (STOP_REASONS[r] ?? null) : null;
}
