/**
 * Latin hypercube sample in the unit cube (McKay, Beckman & Conover 1979): each dimension is cut into n equal
 * strata and every stratum holds exactly one of the n points; where in its stratum a point falls, and which
 * strata pair up across dimensions, comes from the seeded PRNG.
 */
import type { Rng } from '../math/random';

export function latinHypercube(n: number, dimensions: number, rng: Rng): number[][] {
  const points = Array.from({ length: n }, () => new Array<number>(dimensions).fill(0));
  const strata = new Array<number>(n);
  for (let d = 0; d < dimensions; d++) {
    for (let i = 0; i < n; i++) strata[i] = i;
    // Fisher–Yates shuffle of the strata for this dimension.
    for (let i = n - 1; i > 0; i--) {
      const j = rng.int(i + 1);
      const t = strata[i];
      strata[i] = strata[j];
      strata[j] = t;
    }
    for (let i = 0; i < n; i++) points[i][d] = (strata[i] + rng.next()) / n;
  }
  return points;
}
