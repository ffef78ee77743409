/** API shapes of trials. Metrics, series and courses travel in the engine's own schemas. */
import { z } from 'zod';
import { CourseEncodingSchema } from '../engine/course/encoding';
import { LegSetupSchema } from '../engine/gait/leg-setup';
import { SeriesEncodingSchema } from '../engine/gait/series-encoding';
import { TrialMetricsSchema } from '../engine/metrics/trial-metrics';
import type { Rig } from '../engine/gait/rig';

const idSchema = (what: string) => z.number({ error: `Pick ${what}.` }).int(`Pick ${what}.`).positive(`Pick ${what}.`);

/** Simulated seconds a trial of record walks (at most; a short course ends it sooner). */
export const TRIAL_SECONDS = 20;

/** POST /api/trials: one character over a course or every course of a suite, with a saved version or an unsaved setup. */
export const trialRequestSchema = z
  .object({
    characterId: idSchema('a character'),
    courseId: idSchema('a course').optional(),
    suiteId: idSchema('a suite').optional(),
    /** A saved version; without it (and without legSetup) the character's newest version, or the engine's defaults. */
    legSetupId: idSchema('a leg setup').optional(),
    legSetup: LegSetupSchema.optional(),
  })
  .superRefine((r, ctx) => {
    if ((r.courseId === undefined) === (r.suiteId === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['courseId'], message: 'Pick a course or a suite (one of them).' });
    }
    if (r.legSetupId !== undefined && r.legSetup !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['legSetup'], message: 'Send a saved leg setup or an unsaved one, not both.' });
    }
  });
export type TrialRequest = z.input<typeof trialRequestSchema>;

/** A trial in lists and on its page. */
export const trialSummarySchema = z.object({
  id: z.number().int(),
  characterId: z.number().int(),
  legSetupId: z.number().int().nullable(),
  legSetupVersion: z.number().int().nullable(),
  courseId: z.number().int().nullable(),
  courseName: z.string(),
  courseVersion: z.number().int(),
  jobId: z.number().int().nullable(),
  footingScore: z.number(),
  metrics: TrialMetricsSchema,
  legNames: z.array(z.string()),
  createdAt: z.number().int(),
});
export type TrialSummary = z.infer<typeof trialSummarySchema>;

/** GET /api/trials/:id: the summary, the setup it ran, its series and the course as it was run (when it still has that version). */
export const trialDetailSchema = z.object({
  trial: trialSummarySchema,
  setup: LegSetupSchema,
  series: SeriesEncodingSchema,
  /** The course now; `courseChanged` says it was edited after the trial. Null when the course was deleted. */
  course: CourseEncodingSchema.nullable(),
  courseChanged: z.boolean(),
  /** The character's walking rig as it is mapped now (engine/gait/character-rig.ts), for replay and re-solving a frame. */
  rig: z.custom<Rig>(),
});
export type TrialDetail = z.infer<typeof trialDetailSchema>;

export const trialListSchema = z.object({ trials: z.array(trialSummarySchema) });
export type TrialList = z.infer<typeof trialListSchema>;

/** What a finished trial job holds: the trials it stored, one per course. */
export const trialJobResultSchema = z.object({
  trialIds: z.array(z.number().int()),
  footingScore: z.number(),
});
export type TrialJobResult = z.infer<typeof trialJobResultSchema>;
