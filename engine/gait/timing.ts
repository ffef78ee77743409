/** Gait clock: phases, stance/swing, and how many feet are down over a cycle. */

/** Fractional part in [0, 1), also for negative input. */
export function wrap01(x: number): number {
  const f = x - Math.floor(x);
  return f >= 1 ? 0 : f;
}

/** Phase of a leg in [0, 1): 0 at touchdown, dutyFactor at liftoff. */
export function legPhase(time: number, cycleTime: number, phaseOffset: number): number {
  return wrap01(time / cycleTime - phaseOffset);
}

/** Phases of every leg at `time` into out (one call per frame: no per-leg boxing of doubles). */
export function writeLegPhases(time: number, cycleTime: number, phaseOffsets: ArrayLike<number>, out: Float64Array): void {
  const cycles = time / cycleTime;
  for (let i = 0; i < out.length; i++) out[i] = wrap01(cycles - phaseOffsets[i]);
}

export function inStance(phase: number, dutyFactor: number): boolean {
  return phase < dutyFactor;
}

/**
 * Fraction of the cycle with exactly k feet in stance, for k = 0..legs
 * (exact: the stance intervals are cut at every touchdown and liftoff).
 */
export function supportFractions(phaseOffsets: readonly number[], dutyFactor: number): number[] {
  const n = phaseOffsets.length;
  const cuts = [0, 1];
  for (const o of phaseOffsets) cuts.push(wrap01(o), wrap01(o + dutyFactor));
  cuts.sort((a, b) => a - b);
  const out = new Array<number>(n + 1).fill(0);
  for (let i = 0; i + 1 < cuts.length; i++) {
    const span = cuts[i + 1] - cuts[i];
    if (span <= 0) continue;
    const mid = (cuts[i] + cuts[i + 1]) / 2;
    let k = 0;
    for (const o of phaseOffsets) if (inStance(wrap01(mid - o), dutyFactor)) k++;
    out[k] += span;
  }
  return out;
}

/** Fraction of the cycle with at least two feet down: double support for a biped. */
export function doubleSupportFraction(phaseOffsets: readonly number[], dutyFactor: number): number {
  const f = supportFractions(phaseOffsets, dutyFactor);
  let s = 0;
  for (let k = 2; k < f.length; k++) s += f[k];
  return s;
}
