import { z } from 'zod';
import { DOF_KINDS, DOF_SHAPE } from './dof-kinds';

/** A leg is 2–5 skeleton joints: 1–4 that move plus the end joint at the sole. */
export const MAX_LEG_DOF_JOINTS = 4;

export const vec3Schema = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);
export type Vec3 = z.infer<typeof vec3Schema>;

/** Joint kinds a leg can use: the engine's DOF kinds. */
export const legDofKindSchema = z.enum(DOF_KINDS, { error: 'Pick ball, hinge, universal or slider.' });
export type LegDofKind = z.infer<typeof legDofKindSchema>;

export const legSideSchema = z.enum(['left', 'right', 'centre'], { error: 'Pick left, right or centre.' });
export type LegSide = z.infer<typeof legSideSchema>;

const rangeSchema = z
  .object({ min: z.number({ error: 'Enter a number.' }).finite(), max: z.number({ error: 'Enter a number.' }).finite() })
  .refine((r) => r.min <= r.max, { message: 'The lower limit must not exceed the upper one.', path: ['max'] });

/**
 * One moving joint of a leg. Axes are unit vectors in the character's rest (bind) space, +Y up, metres;
 * limits are radians around those axes relative to the rest pose (metres along the axis for a slider).
 */
export const legJointSchema = z
  .object({
    joint: z.number({ error: 'Pick a joint.' }).int().min(0),
    dof: legDofKindSchema,
    axes: z.array(vec3Schema).max(2),
    limits: z.array(rangeSchema).max(2),
  })
  .superRefine((j, ctx) => {
    const shape = DOF_SHAPE[j.dof];
    if (j.axes.length !== shape.axes) ctx.addIssue({ code: 'custom', path: ['axes'], message: `A ${j.dof} joint has ${shape.axes} axes.` });
    if (j.limits.length !== shape.limits) ctx.addIssue({ code: 'custom', path: ['limits'], message: `A ${j.dof} joint has ${shape.limits} limit ranges.` });
  });
export type LegJoint = z.infer<typeof legJointSchema>;

/** A leg as the user confirms it: its moving joints hip → ankle and the end joint whose rest position is the sole point. */
export const legMappingSchema = z.object({
  name: z.string({ error: 'Name the leg.' }).trim().min(1, 'Name the leg.').max(40, 'Use at most 40 characters.'),
  side: legSideSchema,
  joints: z
    .array(legJointSchema)
    .min(1, 'A leg needs at least one moving joint.')
    .max(MAX_LEG_DOF_JOINTS, `A leg has at most ${MAX_LEG_DOF_JOINTS} moving joints.`),
  end: z.number({ error: 'Pick the end joint.' }).int().min(0),
});
export type LegMapping = z.infer<typeof legMappingSchema>;

/** A leg as detection found it: the mapping plus how sure detection was (0–1) and what it relied on. */
export const detectedLegSchema = legMappingSchema.extend({
  confidence: z.number().min(0).max(1),
  /** Index of its mirror partner in the same list, or null when unpaired. */
  mirrorOf: z.number().int().nullable(),
  evidence: z.array(z.string()),
});
export type DetectedLeg = z.infer<typeof detectedLegSchema>;

/** Strips what only detection knows (confidence, evidence) from a detected leg. */
export function mappingOf(leg: DetectedLeg): LegMapping {
  return { name: leg.name, side: leg.side, joints: leg.joints, end: leg.end };
}
