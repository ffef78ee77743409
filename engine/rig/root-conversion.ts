/**
 * What the nodes above a skeleton do to it: exporters often convert a Z-up scene, or centimetres, with one root
 * node's matrix instead of changing the joints (glTF 2.0 §3.4: +Y up, metres). Read from the composed matrix of
 * the nodes between the scene and the skeleton's root joint, column-major.
 */

export interface RootConversion {
  /** The root turns the authored +Z axis onto +Y: a Z-up armature converted to glTF's +Y up. */
  turnsZUp: boolean;
  /** Uniform scale of the root (1 when it does not scale), or null when it scales unevenly. */
  scale: number | null;
}

/** Axes within this angle's cosine count as aligned (about 2.6°; common practice, no source). */
const ALIGNED = 0.999;

export function rootConversionOf(m: ArrayLike<number>): RootConversion {
  const col = (c: number) => [m[4 * c], m[4 * c + 1], m[4 * c + 2]];
  const lengths = [0, 1, 2].map((c) => Math.hypot(...col(c)));
  const uniform = Math.max(...lengths) - Math.min(...lengths) <= 1e-6 * Math.max(...lengths);
  const z = col(2);
  const turnsZUp = lengths[2] > 0 && z[1] / lengths[2] >= ALIGNED;
  return { turnsZUp, scale: uniform ? lengths[0] : null };
}
