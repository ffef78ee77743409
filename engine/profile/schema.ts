/**
 * The leg profile: the published, versioned file a game reads. It carries the
 * leg setup (the engine's LegSetupSchema, not a copy), the rig mapping by
 * joint NAMES (indices differ between exports of the same character), the
 * character file's sha256 and the metrics the setup earned on its suite.
 * Key order of the schema is the key order of the exported file.
 */
import { z } from 'zod';
import { LegSetupSchema } from '../gait/leg-setup';
import { legDofKindSchema, legSideSchema } from '../rig/leg-mapping';
import { SuiteMetricsSchema } from './suite-metrics';

/** The JSON Schema's $id and the `schema` field of every profile file. */
export const LEG_PROFILE_SCHEMA_ID = 'urn:treadle:schema:leg-profile:1';

const vec3 = z.tuple([z.number(), z.number(), z.number()]);
const jointName = z.string().min(1, 'name the joint').max(200);

/** One moving joint of a leg, named as in the character's skeleton. Axes and limits as in the character's leg mapping. */
export const ProfileLegJointSchema = z.object({
  joint: jointName,
  dof: legDofKindSchema,
  axes: z.array(vec3).max(2),
  limits: z.array(z.object({ min: z.number(), max: z.number() })).max(2),
});

export const ProfileLegSchema = z.object({
  name: z.string().min(1).max(40),
  side: legSideSchema,
  /** Hip → ankle. */
  joints: z.array(ProfileLegJointSchema).min(1).max(4),
  /** The joint whose rest position is the sole point. */
  end: jointName,
});

export const ProfileRigSchema = z.object({
  /**
   * The character's unit fix: the factor that brings its file's lengths to metres (0.01 for a file in centimetres).
   * The runtime scales the game's skeleton by it before binding, so the profile's metres fit; absent means 1.
   */
  unitScale: z.number().positive().finite().optional(),
  legs: z.array(ProfileLegSchema).min(1).max(16),
});

export const ProfileSuiteSchema = z.object({
  name: z.string().min(1),
  courses: z.array(z.object({ name: z.string().min(1), version: z.number().int().min(1) })).min(1),
});

export const LegProfileSchema = z.object({
  schema: z.literal(LEG_PROFILE_SCHEMA_ID, { error: `schema must be "${LEG_PROFILE_SCHEMA_ID}"` }),
  /** The profile (one per character); versions count up from 1. */
  profileId: z.number().int().min(1),
  version: z.number().int().min(1),
  character: z.object({
    name: z.string().min(1),
    sha256: z.string().regex(/^[0-9a-f]{64}$/, 'sha256 must be 64 lowercase hex digits'),
  }),
  notes: z.string().max(2000),
  author: z.object({ name: z.string().min(1) }),
  /** ISO 8601 UTC. */
  publishedAt: z.iso.datetime({ message: 'publishedAt must be an ISO 8601 UTC time' }),
  legSetup: LegSetupSchema,
  rig: ProfileRigSchema,
  suite: ProfileSuiteSchema,
  metrics: SuiteMetricsSchema,
});

export type ProfileLegJoint = z.infer<typeof ProfileLegJointSchema>;
export type ProfileLeg = z.infer<typeof ProfileLegSchema>;
export type ProfileRig = z.infer<typeof ProfileRigSchema>;
export type ProfileSuite = z.infer<typeof ProfileSuiteSchema>;
export type LegProfile = z.infer<typeof LegProfileSchema>;
