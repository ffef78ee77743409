import { z } from 'zod';
import { legMappingSchema, detectedLegSchema, vec3Schema } from '../engine/rig/leg-mapping';
import { importNoteSchema } from '../engine/rig/rig-quirks';
import { UNIT_SCALE_RANGE, unitGuessSchema } from '../engine/rig/skeleton-scale';

/** The leg shapes belong to the engine, which reads them too; the API uses them from there. */
export {
  MAX_LEG_DOF_JOINTS,
  legDofKindSchema,
  legSideSchema,
  legJointSchema,
  legMappingSchema,
  detectedLegSchema,
  type Vec3,
  type LegDofKind,
  type LegSide,
  type LegJoint,
  type LegMapping,
  type DetectedLeg,
} from '../engine/rig/leg-mapping';
export { DOF_SHAPE } from '../engine/rig/dof-kinds';

/** Most legs a character may map (an eight-legged crawler with room to spare). */
export const MAX_LEGS = 16;

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

/** Treadle's own import findings are the engine's shape (engine/rig/rig-quirks.ts). */
export { importNoteSchema, type ImportNote } from '../engine/rig/rig-quirks';

/** What a validator finding means for walking: harmless to it, the mesh only, or the skeleton (an error there refuses the upload). */
export const findingMeaningSchema = z.enum(['harmless', 'mesh', 'skeleton']);
export type FindingMeaning = z.infer<typeof findingMeaningSchema>;

/** Validator findings of one code and meaning, with the glTF 2.0 rule they come from. */
export const validatorFindingGroupSchema = z.object({
  meaning: findingMeaningSchema,
  code: z.string(),
  severity: issueSeveritySchema,
  count: z.number().int(),
  /** The validator's message for the first finding of the group. */
  message: z.string(),
  /** What the meaning is, in words. */
  explanation: z.string(),
  /** The matching rule of the glTF 2.0 specification: its section and a link to it. */
  rule: z.object({ section: z.string(), url: z.string() }),
  /** Where in the file, for the first few. */
  pointers: z.array(z.string()),
});
export type ValidatorFindingGroup = z.infer<typeof validatorFindingGroupSchema>;

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
    /** The issues grouped by what they mean for walking (reports from before grouping have none). */
    groups: z.array(validatorFindingGroupSchema).optional(),
  }),
  /** The unit the file's lengths look like when they do not read as metres, and the fix on offer (null: they read as metres). */
  units: z.object({ guess: unitGuessSchema.nullable() }).optional(),
  notes: z.array(importNoteSchema),
  stats: z.object({
    joints: z.number().int(),
    meshes: z.number().int(),
    vertices: z.number().int(),
    /** Height of the rest skeleton (lowest to highest joint), in the file's units (metres, as glTF defines, before any unit fix). */
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
  /** The unit fix: the factor that brings the file's lengths to metres, applied wherever the skeleton is read (1: as the file says). */
  unitScale: z.number(),
});
export type Character = z.infer<typeof characterSchema>;

/** PUT /api/characters/:id/unit-scale: 0.01 for centimetres, 0.001 for millimetres, any other factor, or 1 to undo. */
export const unitScaleUpdateSchema = z.object({
  unitScale: z
    .number({ error: 'Enter the scale as a number, e.g. 0.01 for centimetres.' })
    .finite('Enter the scale as a number, e.g. 0.01 for centimetres.')
    .min(UNIT_SCALE_RANGE.min, `Use a scale of at least ${UNIT_SCALE_RANGE.min}.`)
    .max(UNIT_SCALE_RANGE.max, `Use a scale of at most ${UNIT_SCALE_RANGE.max}.`),
});
export type UnitScaleUpdate = z.infer<typeof unitScaleUpdateSchema>;

/** A joint of the imported skeleton as the client needs it: name, parent index (−1 for a root), rest world position in metres (the unit fix applied). */
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
