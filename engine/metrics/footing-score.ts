/**
 * The footing score: one 0–100 figure for a trial (or a suite). Every term
 * is a penalty; the score falls off exponentially so it never goes below 0
 * and a clean walk gives 100. The formula is data: the app shows
 * FOOTING_SCORE_FORMULA.text and the terms, and `footingScore` evaluates
 * exactly those terms. The weights are our own choice (common practice, no
 * source): one stumble per 100 steps costs 3–6 points, 1 cm of RMS tracking
 * error 10, 10 % mean touchdown overshoot 10.
 */
import type { StumbleKind } from './stumble-thresholds';

export interface FootingScoreInputs {
  /** Stumbles per 100 steps, by kind. */
  per100Steps: Record<StumbleKind, number>;
  /** RMS distance from foot to target over the trial, m. */
  trackingRms: number;
  /** Mean percent overshoot of the foot at touchdown. */
  touchdownOvershootPercent: number;
}

export interface FootingScoreTerm {
  /** Input symbol used in the formula text. */
  symbol: string;
  description: string;
  weight: number;
  unit: string;
  value: (i: FootingScoreInputs) => number;
}

export const FOOTING_SCORE_TERMS: readonly FootingScoreTerm[] = [
  { symbol: 'sink', description: 'sink stumbles', weight: 0.05, unit: 'per 100 steps', value: (i) => i.per100Steps.sink },
  { symbol: 'skid', description: 'skid stumbles', weight: 0.05, unit: 'per 100 steps', value: (i) => i.per100Steps.skid },
  { symbol: 'reachMiss', description: 'reach-miss stumbles', weight: 0.06, unit: 'per 100 steps', value: (i) => i.per100Steps['reach-miss'] },
  { symbol: 'scuff', description: 'scuff stumbles', weight: 0.03, unit: 'per 100 steps', value: (i) => i.per100Steps.scuff },
  { symbol: 'snap', description: 'snap stumbles', weight: 0.06, unit: 'per 100 steps', value: (i) => i.per100Steps.snap },
  { symbol: 'rmsCm', description: 'RMS foot tracking error', weight: 0.1, unit: 'cm', value: (i) => i.trackingRms * 100 },
  { symbol: 'overshoot', description: 'mean touchdown overshoot', weight: 0.01, unit: '%', value: (i) => i.touchdownOvershootPercent },
];

function formulaText(): string {
  const sum = FOOTING_SCORE_TERMS.map((t) => `${t.weight}·${t.symbol}`).join(' + ');
  const where = FOOTING_SCORE_TERMS.map((t) => `${t.symbol} = ${t.description} (${t.unit})`).join('; ');
  return `footing score = 100 · exp(−P), rounded to 0.1, where P = ${sum}; ${where}`;
}

export const FOOTING_SCORE_FORMULA = {
  version: 1,
  text: formulaText(),
  terms: FOOTING_SCORE_TERMS.map(({ symbol, description, weight, unit }) => ({ symbol, description, weight, unit })),
} as const;

export function footingPenalty(inputs: FootingScoreInputs): number {
  let p = 0;
  for (const t of FOOTING_SCORE_TERMS) {
    const v = t.value(inputs);
    // NaN (nothing measured) costs nothing; Infinity drives the score to 0.
    p += t.weight * (v > 0 ? v : 0);
  }
  return p;
}

export function footingScore(inputs: FootingScoreInputs): number {
  return Math.round(1000 * Math.exp(-footingPenalty(inputs))) / 10;
}
