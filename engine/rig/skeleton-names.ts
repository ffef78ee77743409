/**
 * Joint-name hints: the naming conventions rigs commonly use for legs and sides
 * (thigh/upperleg/femur, calf/shin/lowerleg/tibia, foot/ankle, toe; left/right as prefixes and
 * suffixes: "LeftUpLeg", "thigh.L", "Bip01 L Calf", "leg_FR_2"). Common practice, no source.
 * Hints only: detection decides by geometry and topology first.
 */

/** "LeftUpLeg" → left up leg; "thigh.L" → thigh l; "Bip01 R Calf" → bip 01 r calf. */
export function nameTokens(name: string): string[] {
  return name
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/([A-Z]+)([A-Z][a-z])/g, '$1 $2')
    .replace(/([a-zA-Z])(\d)/g, '$1 $2')
    .replace(/(\d)([a-zA-Z])/g, '$1 $2')
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter(Boolean);
}

const LEG_WORDS = new Set([
  'leg', 'legs', 'upleg', 'upperleg', 'lowerleg', 'thigh', 'femur', 'calf', 'shin', 'tibia', 'fibula', 'knee', 'foot', 'feet',
  'ankle', 'toe', 'toes', 'toebase', 'heel', 'hock', 'stifle', 'paw', 'hoof', 'pastern', 'fetlock', 'coxa', 'trochanter',
  'tarsus', 'metatarsus', 'metatarsal', 'sole',
]);

/** Words of parts that are never legs. Arm words are not here: quadruped rigs often name their front legs as arms. */
const NEVER_LEG_WORDS = new Set(['tail', 'antenna', 'antennae', 'feeler', 'wing', 'tentacle', 'cable', 'hair', 'ear', 'jaw', 'tongue', 'weapon', 'prop']);

const ARM_WORDS = new Set(['arm', 'upperarm', 'forearm', 'hand', 'finger', 'thumb', 'wrist', 'clavicle']);

const LEFT = new Set(['l', 'left', 'lt', 'lf', 'fl', 'ml', 'hl', 'bl', 'rl']);
const RIGHT = new Set(['r', 'right', 'rt', 'rf', 'fr', 'mr', 'hr', 'br', 'rr']);

export type NameHint = 'leg' | 'arm' | 'never-leg' | 'none';

export function nameHint(name: string): NameHint {
  const tokens = nameTokens(name);
  if (tokens.some((t) => NEVER_LEG_WORDS.has(t))) return 'never-leg';
  if (tokens.some((t) => LEG_WORDS.has(t))) return 'leg';
  if (tokens.some((t) => ARM_WORDS.has(t))) return 'arm';
  return 'none';
}

/** The side a name declares, if any. "rl"/"rr" (rear left/right) and "fl"/"fr" also count. */
export function nameSide(name: string): 'left' | 'right' | null {
  const tokens = nameTokens(name);
  const left = tokens.some((t) => LEFT.has(t));
  const right = tokens.some((t) => RIGHT.has(t));
  if (left === right) return null;
  return left ? 'left' : 'right';
}

/** Words of bones that ride along a limb without bending it: twist and roll bones, muscle and corrective helpers (common practice, no source). */
const PASSENGER_WORDS = new Set(['twist', 'roll', 'helper', 'corrective', 'muscle', 'bulge']);

/** Whether the name is a twist, roll or helper bone's, which rides along with its limb. */
export function isPassengerName(name: string): boolean {
  return nameTokens(name).some((t) => PASSENGER_WORDS.has(t));
}
