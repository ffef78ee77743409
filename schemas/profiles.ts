import { z } from 'zod';
import { LegSetupSchema } from '../engine/gait/leg-setup';

const id = (what: string) => z.coerce.number({ error: `Pick ${what}.` }).int(`Pick ${what}.`).positive(`Pick ${what}.`);

/** POST /api/profiles: publish a leg setup of a character as the next immutable version of its profile. */
export const publishProfileSchema = z
  .object({
    characterId: id('a character'),
    suiteId: id('a suite'),
    /** A saved leg setup version to publish… */
    legSetupId: id('a leg setup').optional(),
    /** …or the setup itself; neither = the engine's default setup for the character. */
    legSetup: LegSetupSchema.optional(),
    notes: z.string().trim().max(2000, 'Use at most 2000 characters.').default(''),
  })
  .refine((p) => !(p.legSetupId !== undefined && p.legSetup !== undefined), { message: 'Send a leg setup id or a leg setup, not both.', path: ['legSetup'] });
export type PublishProfileInput = z.input<typeof publishProfileSchema>;

export const profileVersionSummarySchema = z.object({
  version: z.number().int(),
  notes: z.string(),
  author: z.object({ id: z.number().int(), name: z.string() }),
  publishedAt: z.number().int(),
  /** Of the whole suite (its courses pooled), not of one course. */
  footingScore: z.number(),
  characterSha256: z.string(),
  suiteName: z.string(),
  suiteCourseCount: z.number().int(),
  /** The saved leg setup version published; null when an unsaved setup was. */
  legSetupVersion: z.number().int().nullable(),
  /** sha256 of the file: its ETag. */
  sha256: z.string(),
});
export type ProfileVersionSummary = z.infer<typeof profileVersionSummarySchema>;

export const profileSummarySchema = z.object({
  id: z.number().int(),
  character: z.object({ id: z.number().int(), name: z.string(), sha256: z.string() }),
  versionCount: z.number().int(),
  latest: profileVersionSummarySchema.nullable(),
});
export type ProfileSummary = z.infer<typeof profileSummarySchema>;

export const profileListSchema = z.object({ profiles: z.array(profileSummarySchema) });
export type ProfileList = z.infer<typeof profileListSchema>;

/** GET /api/profiles/:id: the profile with every version, newest first. */
export const profileDetailSchema = z.object({ profile: profileSummarySchema, versions: z.array(profileVersionSummarySchema) });
export type ProfileDetail = z.infer<typeof profileDetailSchema>;

export const profileDiffQuerySchema = z.object({ from: id('the older version'), to: id('the newer version') });

/** ":version" of GET /api/v1/profiles/:id/versions/:version. */
export const versionParamSchema = z.union([z.literal('latest'), z.coerce.number().int().positive()], {
  error: 'The version is a whole number from 1, or "latest".',
});

/** GET /api/v1/characters: each character with its profile, if it has one. */
export const apiCharacterSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  sha256: z.string(),
  profile: z.object({ id: z.number().int(), latestVersion: z.number().int() }).nullable(),
});
export const apiCharacterListSchema = z.object({ characters: z.array(apiCharacterSchema) });
export type ApiCharacterList = z.infer<typeof apiCharacterListSchema>;

/** POST /api/v1/profiles/:id/check form fields (besides the optional `file`). */
export const checkFieldsSchema = z.object({
  version: z.union([z.literal('latest'), z.coerce.number().int().positive()]).default('latest'),
  scoreTolerance: z.coerce.number().min(0).max(100).optional(),
  stumbleTolerance: z.coerce.number().min(0).max(100).optional(),
});

export const checkResultSchema = z.object({
  pass: z.boolean(),
  profileId: z.number().int(),
  version: z.number().int(),
  checked: z.enum(['stored', 'uploaded']),
  characterSha256: z.string(),
  regressions: z.array(z.string()),
  deltas: z.array(
    z.object({
      key: z.string(),
      label: z.string(),
      unit: z.string(),
      before: z.number().nullable(),
      after: z.number().nullable(),
      delta: z.number().nullable(),
      /** Null when unchanged: the difference is inside `tolerance` (or unknown). */
      improved: z.boolean().nullable(),
      tolerance: z.number(),
    }),
  ),
  tolerances: z.object({ score: z.number(), stumbles: z.number() }),
  /** The tolerances in one sentence, for logs. */
  toleranceNote: z.string(),
});
export type CheckResult = z.infer<typeof checkResultSchema>;
