/**
 * The dial-in search as an ask/tell state machine. `ask()` proposes a batch of candidates, `tell()` takes
 * their objective values in the same order, and every decision is taken on the whole batch in proposal
 * order, so the same seed gives the same candidates and the same answer however many workers evaluate a
 * batch and in whatever order they finish.
 *
 * Batch 1 is the start point and a Latin hypercube sample; then Nelder–Mead runs from the best few points
 * advance in lockstep, one batch holding the next proposal of every run. A run that converges starts again
 * around its best point with half the step until the step is too small to matter. The search ends when the
 * budget is spent, when the best has not improved by the margin for `patience` candidates, or when every
 * run has finished. The objective is minimised; it should not saturate (a penalty, not a capped score).
 *
 * The search works in the unit cube of the bounds. A point outside the box is evaluated at its projection
 * onto the box and scored a little worse the further out it is, so every candidate is a valid setting and
 * the simplex keeps its shape at a bound. Points whose values (after rounding integer settings) were tried
 * before reuse the earlier value and cost no budget.
 */
import { mulberry32 } from '../math/random';
import { latinHypercube } from './latin-hypercube';
import { nelderMead, type NelderMeadSteps } from './nelder-mead';

export interface SearchDimension {
  min: number;
  max: number;
  integer?: boolean;
}

export interface DialInSearchOptions {
  dimensions: readonly SearchDimension[];
  /** The starting values (real units, e.g. the base setup's); candidate 0. */
  start: readonly number[];
  /** Most candidates, the start included. */
  budget: number;
  seed: number;
  /** Size of the Latin hypercube (default: 5 per dimension plus 10, within 20–40, and within the budget). */
  sampleSize?: number;
  /**
   * Nelder–Mead runs started from the best points of the first batch (default 4). It bounds how many
   * candidates a batch holds once the sample is done, so it is fixed, never taken from the worker count.
   */
  runs?: number;
  /** Stop when the best has not improved by the margin for this many candidates (default: 40, at least 8 per dimension). */
  patience?: number;
  /** An improvement counts when it lowers the best by more than absolute + relative·|best| (defaults 1e-4 and 1e-3). */
  absoluteMargin?: number;
  relativeMargin?: number;
  /** First simplex edge, as a share of each bound range (default 0.15). */
  firstStep?: number;
  /** A run stops restarting when its step falls below this share of the range (default 0.01). */
  smallestStep?: number;
}

export interface Proposal {
  /** Candidate number: 0 is the start, then in the order proposed. */
  index: number;
  /** Values in real units, inside the bounds, integer settings rounded. */
  values: number[];
}

export type StopReason = 'budget' | 'stalled' | 'converged';

export interface SearchSummary {
  tried: number;
  startIndex: 0;
  bestIndex: number;
  bestObjective: number;
  /** Objective of every candidate, by index. */
  objectives: number[];
  done: boolean;
  stopReason: StopReason | null;
}

export interface DialInSearch {
  /** The next batch to evaluate, or null when the search is over. Call `tell` before asking again. */
  ask(): Proposal[] | null;
  /** Objective values of the last batch, in its order. */
  tell(objectives: readonly number[]): void;
  summary(): SearchSummary;
}

interface Run {
  steps: NelderMeadSteps;
  /** Points (unit cube) the run waits on, null once it finished for good. */
  request: number[][] | null;
  step: number;
  best: { u: number[]; f: number };
}

export function sampleSizeFor(dimensions: number, budget: number): number {
  return Math.max(0, Math.min(budget - 1, Math.max(20, Math.min(40, 5 * dimensions + 10))));
}

export function createDialInSearch(o: DialInSearchOptions): DialInSearch {
  const dims = o.dimensions;
  const n = dims.length;
  if (n === 0) throw new Error('the dial-in search needs at least one setting');
  if (!(o.budget >= 1)) throw new Error('the dial-in search needs a budget of at least one candidate');
  const rng = mulberry32(o.seed);
  const sampleSize = Math.min(o.sampleSize ?? sampleSizeFor(n, o.budget), o.budget - 1);
  const runCount = Math.max(1, o.runs ?? 4);
  const patience = o.patience ?? Math.max(40, 8 * n);
  const absoluteMargin = o.absoluteMargin ?? 1e-4;
  const relativeMargin = o.relativeMargin ?? 1e-3;
  const firstStep = o.firstStep ?? 0.15;
  const smallestStep = o.smallestStep ?? 0.01;

  const objectives: number[] = [];
  const byKey = new Map<string, number>();
  let pending: { proposals: Proposal[]; keys: string[] } | null = null;
  let runs: Run[] | null = null;
  let bestIndex = -1;
  let stallReference = Infinity;
  let sinceImprovement = 0;
  let stopReason: StopReason | null = null;
  const valuesOfIndex: number[][] = [];
  const keyOfIndex: string[] = [];

  const clamp01 = (u: number) => (u < 0 ? 0 : u > 1 ? 1 : u);
  const valuesAt = (u: readonly number[]) =>
    dims.map((d, i) => {
      const v = d.min + clamp01(u[i]) * (d.max - d.min);
      return d.integer ? Math.min(d.max, Math.max(d.min, Math.round(v))) : v;
    });
  const unitOf = (values: readonly number[]) => dims.map((d, i) => clamp01((values[i] - d.min) / (d.max - d.min)));
  const keyOf = (values: readonly number[]) => values.join(',');
  const outside = (u: readonly number[]) => u.reduce((s, v) => s + (v < 0 ? -v : v > 1 ? v - 1 : 0), 0);
  /** The value NM sees at u: the projection's objective, worse with the distance outside the box. */
  const seen = (u: readonly number[], f: number) => f + outside(u) * (1 + Math.abs(f));

  function startRun(u: number[], f: number, step: number): Run {
    const simplex = [u.slice(), ...u.map((_, i) => u.map((v, j) => (j === i ? (v + step <= 1 ? v + step : v - step) : v)))];
    const steps = nelderMead(simplex, { fTolerance: absoluteMargin, xTolerance: smallestStep / 2, maxIterations: 50 * n });
    const first = steps.next();
    return { steps, request: first.done ? null : first.value, step, best: { u: u.slice(), f } };
  }

  /** Advances a run past requests answered from earlier candidates; leaves it waiting on new points or finished. */
  function settle(run: Run): void {
    for (let guard = 0; run.request && guard < 10_000; guard++) {
      const keys = run.request.map((u) => keyOf(valuesAt(u)));
      if (!keys.every((k) => byKey.has(k))) return;
      const fs = run.request.map((u, j) => seen(u, objectives[byKey.get(keys[j])!]));
      run.request.forEach((u, j) => {
        if (fs[j] < run.best.f) run.best = { u: u.map(clamp01), f: fs[j] };
      });
      const next = run.steps.next(fs);
      if (!next.done) {
        run.request = next.value;
        continue;
      }
      // Converged: start again around the best with half the step, until the step no longer matters.
      const step = run.step / 2;
      if (step < smallestStep) {
        run.request = null;
        return;
      }
      const restarted = startRun(run.best.u, run.best.f, step);
      run.steps = restarted.steps;
      run.request = restarted.request;
      run.step = step;
    }
    if (run.request) run.request = null;
  }

  function firstBatch(): Proposal[] {
    const points = [o.start.slice()];
    for (const u of latinHypercube(sampleSize, n, rng)) points.push(valuesAt(u));
    return points.map((values) => ({ index: -1, values }));
  }

  function nextBatch(): Proposal[] {
    const out: Proposal[] = [];
    const inBatch = new Set<string>();
    for (const run of runs!) {
      settle(run);
      if (!run.request) continue;
      for (const u of run.request) {
        const values = valuesAt(u);
        const key = keyOf(values);
        if (byKey.has(key) || inBatch.has(key)) continue;
        inBatch.add(key);
        out.push({ index: -1, values });
      }
    }
    return out;
  }

  function beginRuns(): void {
    const ranked = objectives.map((f, i) => i).sort((a, b) => objectives[a] - objectives[b] || a - b);
    const origins: number[] = [];
    const taken = new Set<string>();
    for (const i of ranked) {
      const key = keyOfIndex[i];
      if (taken.has(key)) continue;
      taken.add(key);
      origins.push(i);
      if (origins.length === runCount) break;
    }
    runs = origins.map((i) => startRun(unitOf(valuesOfIndex[i]), objectives[i], firstStep));
  }

  return {
    ask() {
      if (pending) throw new Error('tell the last batch before asking for another');
      if (stopReason) return null;
      const remaining = o.budget - objectives.length;
      if (remaining <= 0) {
        stopReason = 'budget';
        return null;
      }
      let batch: Proposal[];
      if (objectives.length === 0) batch = firstBatch();
      else {
        if (!runs) beginRuns();
        batch = nextBatch();
      }
      // Values that repeat within the first batch (integer settings) are tried once.
      const keys: string[] = [];
      const unique: Proposal[] = [];
      for (const p of batch) {
        const key = keyOf(p.values);
        if (byKey.has(key) || keys.includes(key)) continue;
        keys.push(key);
        unique.push(p);
      }
      if (unique.length === 0) {
        stopReason = 'converged';
        return null;
      }
      const take = unique.slice(0, remaining).map((p, j) => ({ index: objectives.length + j, values: p.values }));
      pending = { proposals: take, keys: keys.slice(0, take.length) };
      return take.map((p) => ({ index: p.index, values: p.values.slice() }));
    },

    tell(values) {
      if (!pending) throw new Error('ask for a batch before telling its values');
      if (values.length !== pending.proposals.length) throw new Error(`expected ${pending.proposals.length} values, got ${values.length}`);
      pending.proposals.forEach((p, j) => {
        const f = Number.isFinite(values[j]) ? values[j] : Number.MAX_VALUE;
        objectives.push(f);
        valuesOfIndex.push(p.values);
        keyOfIndex.push(pending!.keys[j]);
        byKey.set(pending!.keys[j], p.index);
        if (bestIndex < 0 || f < objectives[bestIndex]) bestIndex = p.index;
        if (f < stallReference - (absoluteMargin + relativeMargin * Math.abs(stallReference === Infinity ? 0 : stallReference))) {
          stallReference = f;
          sinceImprovement = 0;
        } else sinceImprovement++;
      });
      pending = null;
      if (objectives.length >= o.budget) stopReason = 'budget';
      else if (sinceImprovement >= patience) stopReason = 'stalled';
    },

    summary() {
      return {
        tried: objectives.length,
        startIndex: 0,
        bestIndex,
        bestObjective: bestIndex < 0 ? NaN : objectives[bestIndex],
        objectives: objectives.slice(),
        done: stopReason !== null,
        stopReason,
      };
    },
  };
}
