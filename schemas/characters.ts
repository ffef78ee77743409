import { z } from 'zod';

/** Most legs a character may map (an eight-legged crawler with room to spare). */
export const MAX_LEGS = 16;
/** A leg is 2–5 skeleton joints: 1–4 that move plus the end joint at the sole. */
export const MAX_LEG_DOF_JOINTS = 4;

const vec3Schema = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);
export type Vec3 = z.infer<typeof vec3Schema>;

/** Joint kinds a leg can use (the engine's DOF kinds: engine/rig/types.ts DofKind). */
export const legDofKindSchema = z.enum(['ball', 'hinge', 'universal', 'slider'], { error: 'Pick ball, hinge, universal or slider.' });
export type LegDofKind = z.infer<typeof legDofKindSchema>;

export const legSideSchema = z.enum(['left', 'right', 'centre'], { error: 'Pick left, right or centre.' });
export type LegSide = z.infer<typeof legSideSchema>;

const rangeSchema = z
  .object({ min: z.number({ error: 'Enter a number.' }).finite(), max: z.number({ error: 'Enter a number.' }).finite() })
  .refine((r) => r.min <= r.max, { message: 'The lower limit must not exceed the upper one.', path: ['max'] });

/** How many rotation axes and limit ranges each kind carries. A ball has no axes and two ranges: swing cone [0, half-angle] and twist. */
export const DOF_SHAPE: Record<LegDofKind, { axes: number; limits: number }> = {
  hinge: { axes: 1, limits: 1 },
  universal: { axes: 2, limits: 2 },
  ball: { axes: 0, limits: 2 },
  slider: { axes: 1, limits: 1 },
};

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

/** PUT /api/characters/:id/legs. Topology (joints exist, hip → end is one path, no joint in two legs) is checked by the server against the skeleton. */
export const legMappingUpdateSchema = z.object({
  legs: z
    .array(legMappingSchema)
    .min(1, 'Map at least one leg.')
    .max(MAX_LEGS, `Map at most ${MAX_LEGS} legs.`)
    .superRefine((legs, ctx) => {
      const seen = new Set<string>();
      legs.forEach((leg, i) => {
        const key = leg.name.trim().toLowerCase();
        if (seen.has(key)) ctx.addIssue({ code: 'custom', path: [i, 'name'], message: `Another leg is already called "${leg.name}".` });
        seen.add(key);
      });
    }),
});
export type LegMappingUpdate = z.infer<typeof legMappingUpdateSchema>;

export const issueSeveritySchema = z.enum(['error', 'warning', 'info', 'hint']);

/** One finding of the Khronos glTF validator, as it reports it. */
export const validatorIssueSchema = z.object({
  code: z.string(),
  severity: issueSeveritySchema,
  message: z.string(),
  pointer: z.string().optional(),
});

/** One finding of Treadle's own import (unit scale, unpaired legs, …). */
export const importNoteSchema = z.object({
  code: z.string(),
  severity: z.enum(['warning', 'info']),
  message: z.string(),
});
export type ImportNote = z.infer<typeof importNoteSchema>;

/** What the import found: the validator's report, our own notes and a few figures. */
export const importReportSchema = z.object({
  validator: z.object({
    version: z.string(),
    errors: z.number().int(),
    warnings: z.number().int(),
    infos: z.number().int(),
    hints: z.number().int(),
    issues: z.array(validatorIssueSchema),
    truncated: z.boolean(),
  }),
  notes: z.array(importNoteSchema),
  stats: z.object({
    joints: z.number().int(),
    meshes: z.number().int(),
    vertices: z.number().int(),
    /** Height of the rest skeleton (lowest to highest joint), metres. */
    height: z.number(),
    legs: z.number().int(),
  }),
});
export type ImportReport = z.infer<typeof importReportSchema>;

export const characterFormatSchema = z.enum(['glb', 'gltf']);

/** A character in lists: the row without its skeleton or report. */
export const characterSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  fileName: z.string(),
  format: characterFormatSchema,
  byteSize: z.number().int(),
  sha256: z.string(),
  jointCount: z.number().int(),
  legCount: z.number().int(),
  uploadedBy: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.number().int(),
  updatedAt: z.number().int(),
  /** The legs in use: as detected, until someone saves an edited mapping. */
  legs: z.array(legMappingSchema),
  legsEdited: z.boolean(),
});
export type Character = z.infer<typeof characterSchema>;

/** A joint of the imported skeleton as the client needs it: name, parent index (−1 for a root), rest world position in metres. */
export const skeletonJointSummarySchema = z.object({
  name: z.string(),
  parent: z.number().int(),
  position: vec3Schema,
});
export type SkeletonJointSummary = z.infer<typeof skeletonJointSummarySchema>;

/** GET /api/characters/:id. */
export const characterDetailSchema = z.object({
  character: characterSchema,
  skeleton: z.object({ joints: z.array(skeletonJointSummarySchema) }),
  detectedLegs: z.array(detectedLegSchema),
  report: importReportSchema,
});
export type CharacterDetail = z.infer<typeof characterDetailSchema>;

/** POST /api/characters: 201 for a new character, 200 with `existing: true` when the team already has this very file. */
export const characterUploadResultSchema = z.object({
  character: characterSchema,
  report: importReportSchema,
  existing: z.boolean(),
});
export type CharacterUploadResult = z.infer<typeof characterUploadResultSchema>;

export const characterListSchema = z.object({ characters: z.array(characterSchema) });
export type CharacterList = z.infer<typeof characterListSchema>;

/** The optional text field of an upload. */
export const characterUploadFieldsSchema = z.object({
  name: z.string().trim().max(60, 'Use at most 60 characters.').optional(),
});
