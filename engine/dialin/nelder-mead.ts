/**
 * Nelder–Mead simplex minimisation (Nelder & Mead, Computer Journal 7(4), 1965) with the usual coefficients
 * (reflection 1, expansion 2, contraction ½, shrink ½; as in Lagarias et al., SIAM J. Optim. 9(1), 1998),
 * written as a generator: it yields the points it needs evaluated and is resumed with their values, in the
 * same order. The caller decides how and where points are evaluated, so a search can be driven in batches
 * by any number of workers and still take every decision in the same order.
 */

export interface NelderMeadOptions {
  /** Stop when the simplex's values and its vertices are this close to the best vertex's (defaults 1e-10). */
  fTolerance?: number;
  xTolerance?: number;
  /** Most iterations (reflections) before giving up (default 200 per dimension). */
  maxIterations?: number;
}

export interface NelderMeadResult {
  x: number[];
  f: number;
  iterations: number;
  converged: boolean;
}

/** Yields points to evaluate; expects their values back in the same order. */
export type NelderMeadSteps = Generator<number[][], NelderMeadResult, number[]>;

const REFLECT = 1;
const EXPAND = 2;
const CONTRACT = 0.5;
const SHRINK = 0.5;

/** The initial simplex: x0 and one vertex `step` along each axis (a negative step goes the other way). */
export function axisSimplex(x0: readonly number[], steps: readonly number[]): number[][] {
  return [x0.slice(), ...x0.map((_, i) => x0.map((v, j) => (j === i ? v + steps[i] : v)))];
}

export function* nelderMead(simplex: number[][], options: NelderMeadOptions = {}): NelderMeadSteps {
  const n = simplex[0].length;
  const fTol = options.fTolerance ?? 1e-10;
  const xTol = options.xTolerance ?? 1e-10;
  const maxIterations = options.maxIterations ?? 200 * n;
  const xs = simplex.map((v) => v.slice());
  const fs: number[] = yield xs.map((v) => v.slice());
  const order = xs.map((_, i) => i);
  const centroid = new Array<number>(n).fill(0);
  const along = (t: number, worst: number[]) => centroid.map((c, k) => c + t * (c - worst[k]));
  let iterations = 0;

  for (;;) {
    // Sort by value; ties keep the older vertex first, so the order is the same on every run.
    order.sort((a, b) => fs[a] - fs[b] || a - b);
    const best = order[0];
    const worst = order[n];
    const secondWorst = order[n - 1];
    let spreadF = 0;
    let spreadX = 0;
    for (const i of order) {
      spreadF = Math.max(spreadF, Math.abs(fs[i] - fs[best]));
      for (let k = 0; k < n; k++) spreadX = Math.max(spreadX, Math.abs(xs[i][k] - xs[best][k]));
    }
    if ((spreadF <= fTol && spreadX <= xTol) || iterations >= maxIterations) {
      return { x: xs[best].slice(), f: fs[best], iterations, converged: iterations < maxIterations };
    }
    iterations++;
    centroid.fill(0);
    for (const i of order) if (i !== worst) for (let k = 0; k < n; k++) centroid[k] += xs[i][k] / n;

    const xr = along(REFLECT, xs[worst]);
    const [fr] = yield [xr];
    if (fr < fs[best]) {
      const xe = along(EXPAND, xs[worst]);
      const [fe] = yield [xe];
      if (fe < fr) replace(worst, xe, fe);
      else replace(worst, xr, fr);
      continue;
    }
    if (fr < fs[secondWorst]) {
      replace(worst, xr, fr);
      continue;
    }
    if (fr < fs[worst]) {
      const xc = along(CONTRACT, xs[worst]);
      const [fc] = yield [xc];
      if (fc <= fr) {
        replace(worst, xc, fc);
        continue;
      }
    } else {
      const xcc = along(-CONTRACT, xs[worst]);
      const [fcc] = yield [xcc];
      if (fcc < fs[worst]) {
        replace(worst, xcc, fcc);
        continue;
      }
    }
    // Shrink every vertex towards the best; the n new points are independent, so they go out as one batch.
    const shrunk = order.slice(1).map((i) => xs[i].map((v, k) => xs[best][k] + SHRINK * (v - xs[best][k])));
    const fShrunk: number[] = yield shrunk.map((v) => v.slice());
    order.slice(1).forEach((i, j) => replace(i, shrunk[j], fShrunk[j]));
  }

  function replace(i: number, x: number[], f: number) {
    xs[i] = x;
    fs[i] = f;
  }
}

/** Runs Nelder–Mead on a function evaluated in place (for tests and small uses). */
export function minimise(f: (x: number[]) => number, simplex: number[][], options: NelderMeadOptions = {}): NelderMeadResult & { evaluations: number } {
  const steps = nelderMead(simplex, options);
  let evaluations = 0;
  let next = steps.next();
  while (!next.done) {
    const values = next.value.map((x) => f(x));
    evaluations += values.length;
    next = steps.next(values);
  }
  return { ...next.value, evaluations };
}
