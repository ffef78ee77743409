/** Whether a skeleton's size looks like metres, and which unit mistake it likely is when it does not. */

/** Vertical extent of the rest skeleton (highest joint minus lowest), metres. */
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

const UNITS = [
  { name: 'centimetres', factor: 0.01 },
  { name: 'millimetres', factor: 0.001 },
  { name: 'inches', factor: 0.0254 },
] as const;

/**
 * A warning when the height is far outside PLAUSIBLE_HEIGHT, naming the unit that would bring it
 * to human size (glTF 2.0 §3.5.1: units are metres).
 */
export function unitScaleWarning(height: number): string | null {
  if (!(height > 0)) return null;
  const metres = (h: number) => `${h >= 10 ? h.toFixed(0) : h.toPrecision(2)} m`;
  if (height > PLAUSIBLE_HEIGHT.max) {
    const unit = UNITS.find((u) => height * u.factor >= 0.3 && height * u.factor <= 30) ?? UNITS[1];
    return `The skeleton is ${metres(height)} tall. glTF is in metres; this looks like ${unit.name} (it would be ${metres(height * unit.factor)}). Re-export in metres or scale by ${unit.factor}.`;
  }
  if (height < PLAUSIBLE_HEIGHT.min) {
    const factor = height * 100 >= 0.3 ? 100 : 1000;
    return `The skeleton is only ${metres(height)} tall. glTF is in metres; it may have been scaled down twice when exported (×${factor} would make it ${metres(height * factor)}).`;
  }
  return null;
}
