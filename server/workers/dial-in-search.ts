/**
 * The dial-in search: Nelder–Mead (the fmin package) maximising the mean footing score of a leg setup over a
 * suite's courses, in settings scaled to [0, 1] within their bounds. Points outside the box are folded back
 * in by reflection, so every candidate is a valid setup. Where every score is 0 the mean penalty (the score is
 * 100·exp(−P)) still ranks candidates. The budget counts candidates (one trial per course
 * each); when the simplex converges early the search restarts around the best point with a seeded step, so
 * the same inputs and seed always try the same candidates.
 */
import { nelderMead } from 'fmin';
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { runTrial, type TrialOptionsInput } from '../../engine/gait/trial';
import { mulberry32 } from '../../engine/math/random';
import { footingPenalty, type FootingScoreInputs } from '../../engine/metrics/footing-score';
import { tunableByKey, type DialInParam } from '../../schemas/dial-ins';

export interface Candidate {
  values: Record<string, number>;
  score: number;
  perCourse: number[];
  /** Mean footing penalty P over the courses (the score is 100·exp(−P)). */
  penalty: number;
}

export interface SearchInput {
  rig: Rig;
  base: LegSetup;
  params: DialInParam[];
  courses: Heightfield[];
  budget: number;
  seed: number;
  /** Start point in [0, 1] per parameter; null = the base setup's values. */
  start: number[] | null;
  options: TrialOptionsInput;
}

export interface SearchResult {
  first: Candidate;
  best: Candidate;
  tried: number;
  /** Score of every candidate in the order tried. */
  scores: number[];
}

/** Initial simplex edge, as a share of each bound range (common practice, no source). */
const FIRST_STEP = 0.25;

const fold = (u: number) => {
  const m = ((u % 2) + 2) % 2;
  return m > 1 ? 2 - m : m;
};

/** The setup with `values` written at each parameter's path. */
export function withValues(base: LegSetup, values: Record<string, number>): LegSetup {
  const setup = structuredClone(base) as unknown as Record<string, Record<string, unknown>>;
  for (const [key, v] of Object.entries(values)) {
    const t = tunableByKey(key);
    if (!t) throw new Error(`unknown setting ${key}`);
    const [group, field] = t.path;
    setup[group][field] = v;
  }
  return setup as unknown as LegSetup;
}

export function valuesAt(params: DialInParam[], u: ArrayLike<number>): Record<string, number> {
  const values: Record<string, number> = {};
  params.forEach((p, i) => {
    const v = p.min + fold(u[i]) * (p.max - p.min);
    values[p.key] = tunableByKey(p.key)!.integer ? Math.round(v) : v;
  });
  return values;
}

export function baseValuesOf(base: LegSetup, params: DialInParam[]): number[] {
  const b = base as unknown as Record<string, Record<string, number>>;
  return params.map((p) => {
    const [group, field] = tunableByKey(p.key)!.path;
    const v = b[group][field];
    return Math.min(1, Math.max(0, (v - p.min) / (p.max - p.min)));
  });
}

/** A penalty standing for a course the engine refuses the setup on. */
const REFUSED_PENALTY = 100;
/**
 * Weight of the mean penalty in the objective: small beside the score, but where every candidate scores 0
 * (a badly set up character) it still tells the simplex which way is better.
 */
const PENALTY_WEIGHT = 0.01;

/** Mean footing score and penalty over the courses; a setup the engine refuses on a course scores 0 there. */
export function scoreSetup(rig: Rig, setup: LegSetup, courses: Heightfield[], options: TrialOptionsInput): { score: number; perCourse: number[]; penalty: number } {
  let penalty = 0;
  const perCourse = courses.map((c) => {
    try {
      const m = runTrial(rig, setup, c, options).metrics;
      const per100Steps = Object.fromEntries(Object.entries(m.stumbles).map(([k, v]) => [k, v.per100Steps])) as FootingScoreInputs['per100Steps'];
      penalty += footingPenalty({ per100Steps, trackingRms: m.tracking.rms, touchdownOvershootPercent: m.touchdown.overshootMeanPercent });
      return m.footingScore;
    } catch {
      penalty += REFUSED_PENALTY;
      return 0;
    }
  });
  const n = Math.max(1, perCourse.length);
  return { score: perCourse.reduce((a, b) => a + b, 0) / n, perCourse, penalty: penalty / n };
}

class BudgetSpent extends Error {}

/** What the simplex minimises: minus the score, with the penalty as a tie-breaker. */
const objective = (c: Candidate) => -c.score + PENALTY_WEIGHT * c.penalty;

/**
 * fmin 0.0.4's shrink step assigns an undeclared loop variable `i` (src/nelderMead.js line 132), which throws
 * a ReferenceError in strict mode. A global of that name gives the assignment somewhere to go; nothing reads it.
 */
function allowFminShrink(): void {
  const g = globalThis as Record<string, unknown>;
  if (!('i' in g)) g.i = 0;
}

export function searchSetup(input: SearchInput, onCandidate: (c: Candidate, tried: number, best: Candidate) => void = () => undefined): SearchResult {
  const { params, budget } = input;
  const rng = mulberry32(input.seed);
  let tried = 0;
  const scores: number[] = [];
  let first: Candidate | null = null;
  let best: Candidate | null = null;
  const seen = new Map<string, Candidate>();

  const evaluate = (u: ArrayLike<number>): Candidate => {
    const values = valuesAt(params, u);
    const key = JSON.stringify(values);
    const cached = seen.get(key);
    if (cached) return cached;
    if (tried >= budget) throw new BudgetSpent();
    const { score, perCourse, penalty } = scoreSetup(input.rig, withValues(input.base, values), input.courses, input.options);
    const c: Candidate = { values, score, perCourse, penalty };
    seen.set(key, c);
    tried++;
    scores.push(score);
    first ??= c;
    if (!best || c.score > best.score || (c.score === best.score && c.penalty < best.penalty)) best = c;
    onCandidate(c, tried, best);
    return c;
  };

  allowFminShrink();
  let origin = input.start ?? baseValuesOf(input.base, params);
  let step = FIRST_STEP;
  try {
    while (tried < budget) {
      const o = origin;
      const before = tried;
      // Minimise minus the score in coordinates centred on the origin: fmin's first simplex steps `zeroDelta` along each axis.
      nelderMead((y: number[]) => objective(evaluate(y.map((v, i) => o[i] + v))), params.map(() => 0), {
        zeroDelta: step,
        maxIterations: 100 * budget,
        minErrorDelta: 1e-3,
      });
      const bestU = params.map((p, i) => (best!.values[p.key] - p.min) / (p.max - p.min));
      step = Math.max(0.02, step * 0.6);
      // Converged: start again near the best, shifted by a seeded step so it does not retrace itself.
      origin = bestU.map((u) => u + (rng.next() - 0.5) * step);
      if (tried === before) break;
    }
  } catch (err) {
    if (!(err instanceof BudgetSpent)) throw err;
  }
  if (!first || !best) throw new Error('the dial-in tried no candidate');
  return { first, best, tried, scores };
}
