/** Small seeded PRNG (mulberry32): deterministic, no Math.random anywhere in the engine. */

export interface Rng {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform in [lo, hi). */
  range(lo: number, hi: number): number;
  /** Integer in [0, n). */
  int(n: number): number;
  /** Standard normal (Box–Muller). */
  normal(): number;
  /** Current internal state (to save / restore a stream). */
  state(): number;
}

export function mulberry32(seed: number): Rng {
  let a = seed >>> 0;
  let spare = NaN;
  const next = (): number => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    range: (lo, hi) => lo + (hi - lo) * next(),
    int: (n) => Math.floor(next() * n),
    normal: () => {
      if (spare === spare) {
        const s = spare;
        spare = NaN;
        return s;
      }
      let u = next();
      while (u <= 1e-300) u = next();
      const v = next();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return r * Math.cos(2 * Math.PI * v);
    },
    state: () => a,
  };
}

/** Uniform random unit vector written into out[o..o+2]. */
export function randomUnitVector(rng: Rng, out: Float64Array | number[], o = 0): void {
  const z = rng.range(-1, 1);
  const phi = rng.range(0, 2 * Math.PI);
  const r = Math.sqrt(1 - z * z);
  out[o] = r * Math.cos(phi);
  out[o + 1] = r * Math.sin(phi);
  out[o + 2] = z;
}
