/**
 * The dial-in as the server runs it: the engine's ask/tell search (engine/dialin/search.ts) over the chosen
 * settings, each batch's candidates evaluated side by side by whatever `evaluate` is given (piscina threads
 * in this process, or worker processes over a queue), the batch told back in proposal order. So the same
 * inputs and seed give the same candidates and the same answer on any number of workers.
 *
 * Nelder–Mead is our own (engine/dialin/nelder-mead.ts) rather than the fmin package's: fmin runs the whole
 * minimisation inside one call that evaluates one point at a time, so a batch of candidates could not go
 * out to several workers, and its shrink step throws in strict mode (an undeclared loop variable).
 */
import type { CourseEncoding } from '../../engine/course/encoding';
import { createDialInSearch, type SearchDimension, type StopReason } from '../../engine/dialin/search';
import type { CandidateOutcome } from '../../engine/dialin/objective';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { TrialOptionsInput } from '../../engine/gait/trial';
import { tunableByKey, type DialInParam } from '../../schemas/dial-ins';

/** What every candidate of one dial-in shares: sent with each candidate task (a queue stores it once). */
export interface DialInContext {
  rig: Rig;
  base: LegSetup;
  params: DialInParam[];
  courses: CourseEncoding[];
  options: TrialOptionsInput;
}

/** One course of one candidate: the unit of work, so a batch of k candidates over n courses is k·n tasks. */
export interface CandidateTask {
  context: DialInContext;
  values: Record<string, number>;
  /** Index into context.courses. */
  course: number;
}

export interface EvaluatedCandidate {
  index: number;
  values: Record<string, number>;
  outcome: CandidateOutcome;
}

export interface SearchRun {
  /** Every candidate in index order; 0 is the start (the base setup's values). */
  candidates: EvaluatedCandidate[];
  start: EvaluatedCandidate;
  best: EvaluatedCandidate;
  stopReason: StopReason;
}

export interface SearchInput {
  base: LegSetup;
  params: DialInParam[];
  budget: number;
  seed: number;
}

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

export function searchDimensions(params: DialInParam[]): SearchDimension[] {
  return params.map((p) => ({ min: p.min, max: p.max, integer: tunableByKey(p.key)!.integer }));
}

/** The base setup's value of each tuned setting (candidate 0, exactly the setup the dial-in starts from). */
export function baseValuesOf(base: LegSetup, params: DialInParam[]): number[] {
  const b = base as unknown as Record<string, Record<string, number>>;
  return params.map((p) => {
    const [group, field] = tunableByKey(p.key)!.path;
    return b[group][field];
  });
}

export const valuesRecord = (params: DialInParam[], values: readonly number[]): Record<string, number> =>
  Object.fromEntries(params.map((p, i) => [p.key, values[i]]));

export class SearchStopped extends Error {}

/**
 * Runs the search to its end. `evaluate` is called for every candidate of a batch at once; `onResult` as
 * each one arrives (in whatever order workers finish, for progress only). `stopped` is checked between
 * batches.
 */
export async function runSearch(
  input: SearchInput,
  evaluate: (values: Record<string, number>, index: number) => Promise<CandidateOutcome>,
  onResult: (c: EvaluatedCandidate) => void = () => undefined,
  stopped: () => boolean = () => false,
): Promise<SearchRun> {
  const search = createDialInSearch({ dimensions: searchDimensions(input.params), start: baseValuesOf(input.base, input.params), budget: input.budget, seed: input.seed });
  const candidates: EvaluatedCandidate[] = [];
  for (let batch = search.ask(); batch; batch = search.ask()) {
    const results = await Promise.all(
      batch.map(async (p) => {
        const values = valuesRecord(input.params, p.values);
        const c: EvaluatedCandidate = { index: p.index, values, outcome: await evaluate(values, p.index) };
        onResult(c);
        return c;
      }),
    );
    if (stopped()) throw new SearchStopped('stopped');
    candidates.push(...results);
    search.tell(results.map((c) => c.outcome.objective));
  }
  const s = search.summary();
  return { candidates, start: candidates[0], best: candidates[s.bestIndex], stopReason: s.stopReason ?? 'budget' };
}
