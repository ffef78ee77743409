/**
 * Stride from speed and hip height, after Alexander (1976, Nature 261): the
 * relative stride λ/h ≈ 2.3·Fr^0.3 with the Froude number Fr = v²/(g·h),
 * fitted on walking and running mammals including people.
 */
export const GRAVITY = 9.81;

/** Alexander's coefficient and exponent for λ/h = a·Fr^b. */
export const ALEXANDER_STRIDE = { coefficient: 2.3, exponent: 0.3 } as const;

/** Froude number v²/(g·h): dynamically similar gaits share it. */
export function froudeNumber(speed: number, hipHeight: number): number {
  return (speed * speed) / (GRAVITY * hipHeight);
}

/** Speed that gives the Froude number `fr` at this hip height. */
export function speedForFroude(fr: number, hipHeight: number): number {
  return Math.sqrt(fr * GRAVITY * hipHeight);
}

/** Stride length (one full cycle of one foot), metres. */
export function alexanderStride(hipHeight: number, speed: number): number {
  if (!(hipHeight > 0) || !(speed >= 0)) {
    throw new RangeError(`stride needs a positive hip height and a speed ≥ 0, got h = ${hipHeight}, v = ${speed}`);
  }
  return ALEXANDER_STRIDE.coefficient * hipHeight * Math.pow(froudeNumber(speed, hipHeight), ALEXANDER_STRIDE.exponent);
}

/**
 * Default walking speed of a rig: Froude number 0.2, a comfortable walk well
 * below the walk-to-run transition near 0.5 (Kram, Domingo & Ferris 1997).
 * The value 0.2 itself is common practice, no source.
 */
export const DEFAULT_FROUDE = 0.2;
