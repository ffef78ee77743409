/** Trial options (the part of a trial request that is not the rig, setup or course) and the loop's fixed constants. */
import { z } from 'zod';
import { DEFAULT_STUMBLE_THRESHOLDS, StumbleThresholdsSchema } from '../metrics/stumble-thresholds';

export const TrialOptionsSchema = z.object({
  /** Simulated seconds asked for; the trial stops earlier if the course runs out. */
  duration: z.number().positive().max(600).default(60),
  timeStep: z
    .number()
    .min(1 / 1000)
    .max(1 / 10)
    .default(1 / 60),
  /** Series samples per second (at most one per frame). */
  recordRate: z.number().positive().max(1000).default(30),
  /** Body start along the walk, m; null = far enough in for the rear feet. */
  startZ: z.number().min(0).nullable().default(null),
  thresholds: StumbleThresholdsSchema.default(DEFAULT_STUMBLE_THRESHOLDS),
});

export type TrialOptions = z.infer<typeof TrialOptionsSchema>;
export type TrialOptionsInput = z.input<typeof TrialOptionsSchema>;

/** A body target rise of at least this much starts a step-up response window, m. */
export const BODY_STEP_UP_MIN = 0.02;
/** Longest body step-up window, s. */
export const BODY_WINDOW_SECONDS = 2;
/** Smallest swing descent measured as a touchdown response, m. */
export const TOUCHDOWN_MIN_DESCENT = 0.01;
/** Longest touchdown window after the touchdown, s. */
export const TOUCHDOWN_WINDOW_SECONDS = 0.5;
/** Iterations for the first solve from the rest pose, before the clock starts. */
export const SETTLE_ITERATIONS = 200;
/** Margin kept clear at the far end of the course, m. */
export const END_MARGIN = 0.1;
export const DEG = 180 / Math.PI;
/**
 * Fraction of last frame's joint motion carried into the next warm start.
 * Below 1 so motion in a redundant leg's null space (which no target
 * corrects) dies away instead of building up into a whipping joint.
 */
export const EXTRAPOLATION_GAIN = 0.8;
