/**
 * API shapes of a dial-in: which leg setup settings to tune, their bounds, the suite and the budget;
 * and what the job reports (best so far while it runs, before/after when done).
 */
import { z } from 'zod';
import { LegSetupSchema } from '../engine/gait/leg-setup';
import { SETTING_NAMES, type NamedSetting, type SettingName } from '../engine/gait/setting-sentences';

/** A setting the tuner may move: where it lives in the leg setup and the range the leg setup schema allows. */
export interface TunableSetting {
  key: string;
  /** The setting's name and unit as the leg setup form and the server's sentences say them (SETTING_NAMES). */
  label: string;
  unit: string;
  /** Path inside LegSetupSchema. */
  path: readonly string[];
  /** Hard range (what LegSetupSchema accepts) and suggested search bounds. */
  range: readonly [number, number];
  suggested: readonly [number, number];
  integer: boolean;
}

/** What each tunable setting holds besides its name; its label and unit are the setting's listed name (SETTING_NAMES). */
type TunableSpec = Omit<TunableSetting, 'key' | 'label' | 'unit' | 'path'> & { key: NamedSetting };

const TUNABLE_SPECS: readonly TunableSpec[] = [
  { key: 'solver.lambda', range: [0, 10], suggested: [0.005, 0.4], integer: false },
  { key: 'solver.maxIterations', range: [1, 1000], suggested: [4, 60], integer: true },
  { key: 'solver.maxStepAngle', range: [0.001, Math.PI], suggested: [0.05, 1], integer: false },
  { key: 'gait.dutyFactor', range: [0.05, 0.98], suggested: [0.45, 0.85], integer: false },
  { key: 'gait.stepHeight', range: [0, 1], suggested: [0.02, 0.3], integer: false },
  { key: 'body.settleTime', range: [0.02, 5], suggested: [0.08, 1], integer: false },
  { key: 'body.followHeight', range: [0, 1], suggested: [0, 1], integer: false },
  { key: 'body.slopeCrouch', range: [0, 2], suggested: [0, 0.6], integer: false },
  { key: 'body.heightOffset', range: [-2, 2], suggested: [-0.15, 0.05], integer: false },
];

export const TUNABLE_SETTINGS: readonly TunableSetting[] = TUNABLE_SPECS.map((t) => {
  const name: SettingName = SETTING_NAMES[t.key];
  return { ...t, label: name.label, unit: name.unit ?? '', path: t.key.split('.') };
});

export const TUNABLE_KEYS = TUNABLE_SETTINGS.map((s) => s.key) as [string, ...string[]];
export const tunableByKey = (key: string) => TUNABLE_SETTINGS.find((s) => s.key === key);

/** Most candidates one dial-in may try (each one is a trial per course of the suite). */
export const MAX_DIAL_IN_CANDIDATES = 2000;

export const dialInParamSchema = z
  .object({
    key: z.enum(TUNABLE_KEYS, { error: 'Pick a setting to tune.' }),
    min: z.number({ error: 'Enter a number.' }).finite(),
    max: z.number({ error: 'Enter a number.' }).finite(),
  })
  .superRefine((p, ctx) => {
    const t = tunableByKey(p.key)!;
    if (!(p.min < p.max)) ctx.addIssue({ code: 'custom', path: ['max'], message: 'The upper bound must be above the lower one.' });
    if (p.min < t.range[0]) ctx.addIssue({ code: 'custom', path: ['min'], message: `${t.label} cannot go below ${t.range[0]}.` });
    if (p.max > t.range[1]) ctx.addIssue({ code: 'custom', path: ['max'], message: `${t.label} cannot go above ${t.range[1]}.` });
  });
export type DialInParam = z.infer<typeof dialInParamSchema>;

/** POST /api/dial-ins. */
export const dialInRequestSchema = z
  .object({
    characterId: z.number({ error: 'Pick a character.' }).int().positive(),
    suiteId: z.number({ error: 'Pick a suite.' }).int().positive('Pick a suite.'),
    /** The version to start from; the character's newest (or the engine's defaults) when omitted. */
    legSetupId: z.number().int().positive().optional(),
    params: z.array(dialInParamSchema).min(1, 'Pick at least one setting to tune.').max(TUNABLE_SETTINGS.length),
    candidates: z
      .number({ error: 'Enter a number of candidates.' })
      .int('Use a whole number of candidates.')
      .min(5, 'Try at least 5 candidates.')
      .max(MAX_DIAL_IN_CANDIDATES, `Try at most ${MAX_DIAL_IN_CANDIDATES} candidates.`),
    seed: z.number().int().min(0).max(2 ** 31 - 1).default(1),
  })
  .superRefine((r, ctx) => {
    const seen = new Set<string>();
    r.params.forEach((p, i) => {
      if (seen.has(p.key)) ctx.addIssue({ code: 'custom', path: ['params', i, 'key'], message: 'This setting is already picked.' });
      seen.add(p.key);
    });
  });
export type DialInRequest = z.input<typeof dialInRequestSchema>;

export const dialInScoresSchema = z.object({
  /** Mean footing score over the suite's courses. */
  footingScore: z.number(),
  /** Mean footing penalty P over the courses (score = 100·exp(−P)): what the search minimises. */
  penalty: z.number().optional(),
  perCourse: z.array(z.object({ courseId: z.number().int(), courseName: z.string(), footingScore: z.number(), penalty: z.number().optional() })),
});
export type DialInScores = z.infer<typeof dialInScoresSchema>;

/** One point of the best-so-far plot. */
export const dialInPointSchema = z.object({ candidate: z.number().int(), score: z.number(), best: z.number() });

/** The job's result: while running only `history` and `bestSoFar`; when done everything. */
export const dialInResultSchema = z.object({
  baseLegSetupId: z.number().int().nullable(),
  characterId: z.number().int(),
  suiteId: z.number().int(),
  params: z.array(dialInParamSchema),
  history: z.array(dialInPointSchema),
  bestSoFar: z.number().nullable(),
  candidatesTried: z.number().int(),
  before: dialInScoresSchema.optional(),
  after: dialInScoresSchema.optional(),
  bestValues: z.record(z.string(), z.number()).optional(),
  bestSetup: LegSetupSchema.optional(),
  /** The best candidate's mean penalty is below the start's (false: the start setup was already the best found). */
  beatsStart: z.boolean().optional(),
  /** Why the search ended: budget spent, no improvement for a while, or every simplex converged. */
  stopReason: z.enum(['budget', 'stalled', 'converged']).optional(),
  /** Set once accepted: the leg setup version it saved. */
  acceptedLegSetupId: z.number().int().nullable().optional(),
});
export type DialInResult = z.infer<typeof dialInResultSchema>;

/** POST /api/dial-ins/:jobId/accept. */
export const dialInAcceptSchema = z.object({ note: z.string().trim().max(200, 'Use at most 200 characters.').optional() });
