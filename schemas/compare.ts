import { z } from 'zod';
import { SuiteMetricsSchema } from '../engine/profile/suite-metrics';

/** One thing to compare: a character with its default leg setup ("c12") or a saved leg setup version ("s7"). */
export const comparePickSchema = z.string().regex(/^[cs][1-9]\d*$/, 'Each pick is "c" + a character id or "s" + a leg setup id.');

/** GET /api/compare?suite=3&pick=c1,c2 — the same parameters as the app's URL, so a comparison can be shared. */
export const compareQuerySchema = z.object({
  suite: z.coerce.number({ error: 'Pick a suite.' }).int('Pick a suite.').positive('Pick a suite.'),
  pick: z
    .string({ error: 'Pick 2 to 4 characters or leg setups.' })
    .transform((s) => s.split(',').map((p) => p.trim()).filter(Boolean))
    .pipe(
      z
        .array(comparePickSchema)
        .min(2, 'Pick at least 2 characters or leg setups.')
        .max(4, 'Pick at most 4 characters or leg setups.')
        .refine((a) => new Set(a).size === a.length, 'Each character or leg setup can be picked once.'),
    ),
});
export type CompareQuery = z.infer<typeof compareQuerySchema>;

const nullableNumbers = z.array(z.number().nullable());

export const compareEntrySchema = z.object({
  pick: z.string(),
  label: z.string(),
  characterId: z.number().int(),
  characterName: z.string(),
  metrics: SuiteMetricsSchema,
  /** Per course: body height response and mean foot-to-target distance, by time and by distance along the course (downsampled for the plots). */
  plots: z.array(z.object({ course: z.string(), time: z.array(z.number()), distance: z.array(z.number()), bodyHeight: nullableNumbers, footError: nullableNumbers })),
});

export const compareResultSchema = z.object({
  suite: z.object({ id: z.number().int(), name: z.string(), courses: z.array(z.string()) }),
  entries: z.array(compareEntrySchema),
});
