/**
 * Stumble kinds and their default thresholds, each with the reason for its
 * value and where the value comes from. Lengths are metres, joint speed
 * degrees per second.
 */
import { z } from 'zod';

export const STUMBLE_KINDS = ['sink', 'skid', 'reach-miss', 'scuff', 'snap'] as const;
export type StumbleKind = (typeof STUMBLE_KINDS)[number];

export const StumbleThresholdsSchema = z.object({
  /** Stance sole this far below the ground… */
  sinkDepth: z.number().positive().max(1),
  /** …for at least this many consecutive frames. */
  sinkFrames: z.number().int().min(1).max(600),
  /** Largest horizontal slide of a planted foot within one stance. */
  skidDistance: z.number().positive().max(1),
  /** Distance from the foot to its target at touchdown. */
  reachMissResidual: z.number().positive().max(1),
  /** Swinging sole this far below the ground. */
  scuffDepth: z.number().min(0).max(1),
  /** Largest joint angular speed, °/s. */
  snapSpeed: z.number().positive().max(100000),
});

export type StumbleThresholds = z.infer<typeof StumbleThresholdsSchema>;

export const DEFAULT_STUMBLE_THRESHOLDS: StumbleThresholds = {
  sinkDepth: 0.01,
  sinkFrames: 2,
  skidDistance: 0.02,
  reachMissResidual: 0.01,
  scuffDepth: 0.002,
  snapSpeed: 720,
};

export interface ThresholdNote {
  reason: string;
  basis: 'common practice, no source' | 'from memory';
}

export const STUMBLE_THRESHOLD_NOTES: Record<keyof StumbleThresholds, ThresholdNote> = {
  sinkDepth: {
    reason: 'a sole 1 cm into the ground reads as sinking at game camera distances; less is hidden by shoe and ground meshes',
    basis: 'common practice, no source',
  },
  sinkFrames: {
    reason: 'a single frame below the ground is not seen; two in a row at 60 Hz are',
    basis: 'common practice, no source',
  },
  skidDistance: {
    reason: 'a planted foot sliding 2 cm or more within one stance is read as foot skate',
    basis: 'common practice, no source',
  },
  reachMissResidual: {
    reason: 'a foot landing more than 1 cm from its target visibly floats or sinks',
    basis: 'common practice, no source',
  },
  scuffDepth: {
    reason: 'any clip of the swinging sole through the ground counts; 2 mm allows for sampling noise of the ground and the solver tolerance',
    basis: 'common practice, no source',
  },
  snapSpeed: {
    reason: '720 °/s (12° per frame at 60 Hz) is faster than a knee moves in walking, so a jump past it is a visible pop',
    basis: 'from memory',
  },
};

/** Units of the event size of each kind. */
export const STUMBLE_SIZE_UNITS: Record<StumbleKind, 'm' | 'deg/s'> = {
  sink: 'm',
  skid: 'm',
  'reach-miss': 'm',
  scuff: 'm',
  snap: 'deg/s',
};
