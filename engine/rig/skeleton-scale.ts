/**
 * The unit a skeleton was authored in, judged from its size (glTF 2.0 §3.4 "Coordinate System and Units": lengths
 * are metres), and the unit fix: one uniform scale applied above the skeleton, so the file itself never changes.
 */
import { z } from 'zod';
import type { Skeleton } from './types';

/** Vertical extent of the rest skeleton (highest joint minus lowest), in the file's units. */
export function skeletonHeight(positions: ArrayLike<number>): number {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 1; i < positions.length; i += 3) {
    if (positions[i] < min) min = positions[i];
    if (positions[i] > max) max = positions[i];
  }
  return positions.length ? max - min : 0;
}

/** Sizes we expect a walking game character to have: a mouse-sized drone up to a building-sized walker (common practice, no source). */
export const PLAUSIBLE_HEIGHT = { min: 0.05, max: 60 } as const;
/** Above this a character is unusual enough in metres that centimetres are worth offering (a 10 m walker is rare; common practice, no source). */
export const TALL_HEIGHT = 10;

/** The factors a unit fix may use: anything that keeps a character between a millimetre and a kilometre scale of itself. */
export const UNIT_SCALE_RANGE = { min: 1e-4, max: 1e4 } as const;

export const lengthUnitSchema = z.enum(['metres', 'centimetres', 'millimetres']);
export type LengthUnit = z.infer<typeof lengthUnitSchema>;

/** Metres per unit (SI prefixes: centi = 10⁻², milli = 10⁻³). */
export const UNIT_FACTOR: Record<LengthUnit, number> = { metres: 1, centimetres: 0.01, millimetres: 0.001 };
const UNIT_SYMBOL: Record<LengthUnit, string> = { metres: 'm', centimetres: 'cm', millimetres: 'mm' };

export const unitGuessSchema = z.object({
  /** The unit the file's lengths look like. */
  unit: lengthUnitSchema,
  /** Factor that brings the file's lengths to metres. */
  factor: z.number(),
  /** 'likely': the size in metres is implausible; 'possible': plausible but unusual, the fix is offered, not urged. */
  certainty: z.enum(['likely', 'possible']),
  /** The skeleton's height after the factor, metres. */
  metres: z.number(),
});
export type UnitGuess = z.infer<typeof unitGuessSchema>;

/** How far a height is from a person-sized one, on a log scale (1 m sits in the middle of 0.3–3 m). */
const offPersonSize = (metres: number) => Math.abs(Math.log10(metres));

/**
 * The unit a skeleton of this height (file units) was most likely authored in: metres when the height is
 * plausible, else the SI unit whose factor brings it nearest to person size. Null when it already reads as metres.
 */
export function guessUnit(height: number): UnitGuess | null {
  if (!(height > 0) || !Number.isFinite(height)) return null;
  if (height <= TALL_HEIGHT && height >= PLAUSIBLE_HEIGHT.min) return null;
  if (height < PLAUSIBLE_HEIGHT.min) return null; // scaled down twice: a custom factor, see unitScaleWarning
  const candidates: LengthUnit[] = ['centimetres', 'millimetres'];
  let best: LengthUnit = 'centimetres';
  for (const u of candidates) if (offPersonSize(height * UNIT_FACTOR[u]) < offPersonSize(height * UNIT_FACTOR[best])) best = u;
  return { unit: best, factor: UNIT_FACTOR[best], certainty: height > PLAUSIBLE_HEIGHT.max ? 'likely' : 'possible', metres: height * UNIT_FACTOR[best] };
}

/** A length with its unit, in the precision a person reads: "42.4 cm", "0.424 m". */
export function formatLength(value: number, unit: LengthUnit = 'metres'): string {
  const a = Math.abs(value);
  const digits = unit === 'metres' ? (a >= 10 ? 1 : a >= 1 ? 2 : 3) : a >= 100 ? 0 : 1;
  return `${value.toFixed(digits)} ${UNIT_SYMBOL[unit]}`;
}

/**
 * A warning when the height is far outside plausible metres, naming the unit it likely is
 * (glTF 2.0 §3.4: units are metres). Null when the size reads as metres.
 */
export function unitScaleWarning(height: number): string | null {
  const guess = guessUnit(height);
  if (guess) {
    const lead =
      guess.certainty === 'likely'
        ? `The skeleton is ${formatLength(height)} tall if its units are metres, as glTF defines them; this looks like ${guess.unit} (it would be ${formatLength(guess.metres)}).`
        : `The skeleton is ${formatLength(height)} tall if its units are metres, as glTF defines them. If it was authored in ${guess.unit}, it is ${formatLength(guess.metres)}.`;
    return `${lead} Scale it by ${guess.factor} on the character page (the file is kept as uploaded), or re-export in metres.`;
  }
  if (height > 0 && height < PLAUSIBLE_HEIGHT.min) {
    const factor = height * 100 >= 0.3 ? 100 : 1000;
    return `The skeleton is only ${formatLength(height)} tall. glTF is in metres; it may have been scaled down twice when exported (×${factor} would make it ${formatLength(height * factor)}). Set a custom scale on the character page, or re-export.`;
  }
  return null;
}

/** Whether a unit fix factor is one Treadle accepts. */
export function isUnitScale(factor: number): boolean {
  return Number.isFinite(factor) && factor >= UNIT_SCALE_RANGE.min && factor <= UNIT_SCALE_RANGE.max;
}

/**
 * The skeleton with a uniform scale `factor` applied above its roots: world' = S(factor) · world for every joint,
 * as a parent node scaling the whole character would (glTF 2.0 §3.5.3). Root joints carry what lies above them,
 * so scaling a root's translation and scale is exactly S · T · R · S_root = T(f·t) · R · (f·S_root).
 */
export function scaledSkeleton(skeleton: Skeleton, factor: number): Skeleton {
  if (factor === 1) return skeleton;
  return {
    joints: skeleton.joints.map((j) =>
      j.parent >= 0
        ? j
        : {
            ...j,
            translation: [j.translation[0] * factor, j.translation[1] * factor, j.translation[2] * factor],
            scale: [j.scale[0] * factor, j.scale[1] * factor, j.scale[2] * factor],
          },
    ),
  };
}
