/**
 * The dial-in search's parts against their published definitions: Nelder–Mead on Rosenbrock's function
 * (Rosenbrock, Computer Journal 3(3), 1960: f = 100(y − x²)² + (1 − x)², minimum 0 at (1, 1), standard start
 * (−1.2, 1); Nelder & Mead, Computer Journal 7(4), 1965), the Latin hypercube's one point per stratum per
 * dimension (McKay, Beckman & Conover, Technometrics 21(2), 1979), and the ask/tell search: the same seed
 * gives the same candidates and answer whatever the batch is split into and in whatever order results come.
 */
import { axisSimplex, minimise, nelderMead } from '../../engine/dialin/nelder-mead';
import { latinHypercube } from '../../engine/dialin/latin-hypercube';
import { createDialInSearch, type DialInSearchOptions, type Proposal } from '../../engine/dialin/search';
import { mulberry32 } from '../../engine/math/random';

const rosenbrock = ([x, y]: number[]) => 100 * (y - x * x) ** 2 + (1 - x) ** 2;

describe('Nelder–Mead', () => {
  it('reaches the minimum of Rosenbrock at (1, 1) from the standard start (−1.2, 1)', () => {
    const r = minimise(rosenbrock, axisSimplex([-1.2, 1], [0.1, 0.1]), { maxIterations: 2000 });
    expect(r.converged).toBe(true);
    expect(r.x[0]).toBeCloseTo(1, 4);
    expect(r.x[1]).toBeCloseTo(1, 4);
    expect(r.f).toBeLessThan(1e-8);
    // Nelder and Mead report the 2-D Rosenbrock case solved in a few hundred evaluations (from memory);
    // a loop that never contracts or shrinks would spend its whole budget or diverge.
    expect(r.evaluations).toBeLessThan(1000);
  });

  it('reaches the minimum of a 4-D shifted quadratic (x − c)ᵀ(x − c) at c (common practice, no source)', () => {
    const c = [0.3, -2, 5, 1.5];
    const r = minimise((x) => x.reduce((s, v, i) => s + (i + 1) * (v - c[i]) ** 2, 0), axisSimplex([0, 0, 0, 0], [1, 1, 1, 1]), { maxIterations: 5000 });
    r.x.forEach((v, i) => expect(v).toBeCloseTo(c[i], 3));
  });

  it('asks for the n points of a shrink together, and for one point otherwise', () => {
    const steps = nelderMead(axisSimplex([-1.2, 1], [0.1, 0.1]));
    let next = steps.next();
    expect(next.value).toHaveLength(3);
    const sizes = new Set<number>();
    for (let i = 0; i < 300 && !next.done; i++) {
      next = steps.next((next.value as number[][]).map(rosenbrock));
      if (!next.done) sizes.add((next.value as number[][]).length);
    }
    for (const s of sizes) expect([1, 2]).toContain(s);
  });
});

describe('Latin hypercube', () => {
  it('puts exactly one point in each of the n strata of every dimension', () => {
    for (const [n, d, seed] of [[20, 3, 1], [37, 7, 99], [40, 9, 2026]]) {
      const pts = latinHypercube(n, d, mulberry32(seed));
      expect(pts).toHaveLength(n);
      for (let k = 0; k < d; k++) {
        const strata = pts.map((p) => Math.floor(p[k] * n)).sort((a, b) => a - b);
        expect(strata).toEqual(Array.from({ length: n }, (_, i) => i));
      }
    }
  });

  it('depends on the seed: another seed pairs the strata differently', () => {
    const a = latinHypercube(20, 2, mulberry32(1));
    const b = latinHypercube(20, 2, mulberry32(2));
    expect(a).not.toEqual(b);
    expect(latinHypercube(20, 2, mulberry32(1))).toEqual(a);
  });
});

/** A bowl over a box with a wide flat shoulder where a capped score would read 0 everywhere. */
const DIMS = [
  { min: -1, max: 3 },
  { min: 0, max: 10 },
  { min: 1, max: 60, integer: true },
];
const TARGET = [1.7, 2.5, 23];
const bowl = (v: number[]) => ((v[0] - TARGET[0]) / 4) ** 2 * 40 + ((v[1] - TARGET[1]) / 10) ** 2 * 40 + ((v[2] - TARGET[2]) / 59) ** 2 * 40;

async function drive(o: DialInSearchOptions, evaluateBatch: (batch: Proposal[]) => Promise<number[]>) {
  const s = createDialInSearch(o);
  const seen: Proposal[] = [];
  for (let batch = s.ask(); batch; batch = s.ask()) {
    seen.push(...batch);
    s.tell(await evaluateBatch(batch));
  }
  return { summary: s.summary(), seen };
}

/** Evaluates a batch on `workers` simulated workers that finish in a seeded random order. */
function onWorkers(workers: number, seed: number) {
  const rng = mulberry32(seed);
  return async (batch: Proposal[]) => {
    const out = new Array<number>(batch.length);
    const queue = batch.map((p, i) => i);
    await Promise.all(
      Array.from({ length: workers }, async () => {
        for (let i = queue.shift(); i !== undefined; i = queue.shift()) {
          await new Promise((r) => setTimeout(r, rng.int(3)));
          out[i] = bowl(batch[i].values);
        }
      }),
    );
    return out;
  };
}

describe('the ask/tell dial-in search', () => {
  const options: DialInSearchOptions = { dimensions: DIMS, start: [-0.5, 9, 5], budget: 200, seed: 42 };

  it('starts with the start point and a Latin hypercube in one batch, then climbs to the bowl’s bottom', async () => {
    const { summary, seen } = await drive(options, async (b) => b.map((p) => bowl(p.values)));
    expect(seen[0]).toEqual({ index: 0, values: [-0.5, 9, 5] });
    // The first batch: the start plus 25 sample points (5 per dimension + 10), one per stratum per dimension.
    const sample = seen.slice(1, 26).map((p) => p.values);
    const strata = sample.map((v) => Math.floor(((v[0] - DIMS[0].min) / 4) * 25)).sort((a, b) => a - b);
    expect(strata).toEqual(Array.from({ length: 25 }, (_, i) => i));
    const best = seen[summary.bestIndex].values;
    expect(summary.bestObjective).toBeLessThan(bowl([-0.5, 9, 5]) / 100);
    expect(Math.abs(best[0] - TARGET[0])).toBeLessThan(0.2);
    expect(Math.abs(best[1] - TARGET[1])).toBeLessThan(0.5);
    expect(Math.abs(best[2] - TARGET[2])).toBeLessThanOrEqual(3);
    for (const p of seen) {
      p.values.forEach((v, k) => {
        expect(v).toBeGreaterThanOrEqual(DIMS[k].min);
        expect(v).toBeLessThanOrEqual(DIMS[k].max);
      });
      expect(Number.isInteger(p.values[2])).toBe(true);
    }
    // No candidate repeats another's values (a repeat would spend budget on nothing).
    expect(new Set(seen.map((p) => p.values.join(','))).size).toBe(seen.length);
  });

  it('gives the same candidates and answer on 1, 2 and 7 workers finishing in any order', async () => {
    const runs = await Promise.all([1, 2, 7].map((w, i) => drive(options, onWorkers(w, 100 + i))));
    for (const r of runs.slice(1)) {
      expect(r.seen).toEqual(runs[0].seen);
      expect(r.summary).toEqual(runs[0].summary);
    }
    const other = await drive({ ...options, seed: 43 }, async (b) => b.map((p) => bowl(p.values)));
    expect(other.seen.slice(1, 26)).not.toEqual(runs[0].seen.slice(1, 26));
  });

  it('stops early once the best has not improved by the margin for `patience` candidates', async () => {
    const flat = await drive({ ...options, patience: 30 }, async (b) => b.map(() => 5));
    expect(flat.summary.stopReason).toBe('stalled');
    // The first value sets the reference; 30 more without improvement end it, within the batch that crossed.
    expect(flat.summary.tried).toBeGreaterThanOrEqual(31);
    expect(flat.summary.tried).toBeLessThan(200);
    expect(flat.summary.bestIndex).toBe(0);
  });

  it('never exceeds the budget, however small', async () => {
    for (const budget of [1, 5, 26, 27]) {
      const r = await drive({ ...options, budget }, async (b) => b.map((p) => bowl(p.values)));
      expect(r.summary.tried).toBe(budget);
      expect(r.seen.map((p) => p.index)).toEqual(Array.from({ length: budget }, (_, i) => i));
    }
  });
});
