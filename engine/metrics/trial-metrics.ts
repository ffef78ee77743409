/** The metrics a trial yields: stored by the server, shown by the app, written into leg profiles. */
import { z } from 'zod';
import { STUMBLE_KINDS } from './stumble-thresholds';

export const StumbleEventSchema = z.object({
  kind: z.enum(STUMBLE_KINDS),
  /** Seconds from the start of the trial. */
  time: z.number(),
  leg: z.number().int().min(0),
  /** Metres, or °/s for snap. */
  size: z.number(),
});

const StumbleCountSchema = z.object({ count: z.number().int().min(0), per100Steps: z.number().min(0) });

export const StepResponseSummarySchema = z.object({
  count: z.number().int().min(0),
  overshootMeanPercent: z.number().min(0),
  overshootMaxPercent: z.number().min(0),
  /** Mean 2 % settling time over the responses that settled, s; null when none did. */
  settleMeanSeconds: z.number().min(0).nullable(),
  unsettled: z.number().int().min(0),
});

export const TrialMetricsSchema = z.object({
  simSeconds: z.number().min(0),
  frames: z.number().int().min(0),
  /** Touchdowns, all legs. */
  steps: z.number().int().min(0),
  stumbles: z.record(z.enum(STUMBLE_KINDS), StumbleCountSchema),
  events: z.array(StumbleEventSchema),
  /** |target − foot| over every leg and frame, m. */
  tracking: z.object({ rms: z.number().min(0), max: z.number().min(0) }),
  /** Foot height against its target, from the start of the descent; settling counted from touchdown. */
  touchdown: StepResponseSummarySchema,
  /** Body (hip-level) height after each rise of its target by 2 cm or more. */
  bodyStepUp: StepResponseSummarySchema,
  solver: z.object({
    solves: z.number().int().min(0),
    iterationsPerSolve: z.number().min(0),
    iterationsPerFrameMean: z.number().min(0),
    iterationsPerFrameMax: z.number().int().min(0),
    errorMean: z.number().min(0),
    errorMax: z.number().min(0),
    unconverged: z.number().int().min(0),
  }),
  footingScore: z.number().min(0).max(100),
});

export type StumbleEvent = z.infer<typeof StumbleEventSchema>;
export type StepResponseSummary = z.infer<typeof StepResponseSummarySchema>;
export type TrialMetrics = z.infer<typeof TrialMetricsSchema>;
