/**
 * Gait patterns: which legs step when. A leg's phase offset is the fraction of
 * the cycle at which it touches down; it stays in stance for `dutyFactor` of
 * the cycle and swings for the rest.
 *
 * Leg order of the preset rigs: biped [left, right]; quadruped [left fore,
 * right fore, left hind, right hind]; hexapod [left front, right front, left
 * middle, right middle, left rear, right rear].
 */
export const GAIT_PATTERNS = ['biped-walk', 'quadruped-walk', 'quadruped-trot', 'hexapod-tripod', 'hexapod-wave', 'custom'] as const;
export type GaitPatternName = (typeof GAIT_PATTERNS)[number];

export interface GaitPattern {
  legs: number;
  phaseOffsets: readonly number[];
  dutyFactor: number;
  /** Where the timing comes from. */
  source: string;
}

export const PRESET_GAITS: Record<Exclude<GaitPatternName, 'custom'>, GaitPattern> = {
  'biped-walk': {
    legs: 2,
    phaseOffsets: [0, 0.5],
    dutyFactor: 0.6,
    source: 'Perry, Gait Analysis (1992): stance about 60 % of the cycle, about 20 % double support',
  },
  'quadruped-walk': {
    legs: 4,
    // Lateral-sequence walk: LH, LF, RH, RF a quarter cycle apart.
    phaseOffsets: [0.25, 0.75, 0, 0.5],
    // Lower than a slow walk's 0.75 so that at the default speed the swing stays under the snap limit.
    dutyFactor: 0.6,
    source: 'common practice, no source: lateral-sequence walk',
  },
  'quadruped-trot': {
    legs: 4,
    // Diagonal pairs (LF+RH, RF+LH) in phase.
    phaseOffsets: [0, 0.5, 0.5, 0],
    dutyFactor: 0.5,
    source: 'common practice, no source: diagonal pairs alternate',
  },
  'hexapod-tripod': {
    legs: 6,
    // Tripods L1-R2-L3 and R1-L2-R3 alternate.
    phaseOffsets: [0, 0.5, 0.5, 0, 0, 0.5],
    dutyFactor: 0.5,
    source: 'common practice, no source: alternating tripods',
  },
  'hexapod-wave': {
    legs: 6,
    // Back to front on the left, then back to front on the right.
    phaseOffsets: [2 / 6, 5 / 6, 1 / 6, 4 / 6, 0, 3 / 6],
    dutyFactor: 5 / 6,
    source: 'common practice, no source: one leg swings at a time',
  },
};

/** The preset pattern for a number of legs (the custom pattern spreads legs evenly). */
export function defaultPatternFor(legs: number): GaitPatternName {
  if (legs === 2) return 'biped-walk';
  if (legs === 4) return 'quadruped-walk';
  if (legs === 6) return 'hexapod-tripod';
  return 'custom';
}

/** Evenly spread offsets with a duty factor that keeps most legs down: the custom default. */
export function evenPhaseOffsets(legs: number): number[] {
  return Array.from({ length: legs }, (_, i) => i / legs);
}
