/** API shapes of leg setups: versions of a character's LegSetupSchema (engine/gait/leg-setup.ts), never redeclared here. */
import { z } from 'zod';
import { LegSetupSchema } from '../engine/gait/leg-setup';
import type { Rig } from '../engine/gait/rig';

export const legSetupSourceSchema = z.enum(['form', 'dial-in', 'seed']);
export type LegSetupSource = z.infer<typeof legSetupSourceSchema>;

/** One saved version. */
export const legSetupVersionSchema = z.object({
  id: z.number().int(),
  characterId: z.number().int(),
  version: z.number().int(),
  setup: LegSetupSchema,
  note: z.string(),
  source: legSetupSourceSchema,
  createdBy: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.number().int(),
});
export type LegSetupVersion = z.infer<typeof legSetupVersionSchema>;

/** GET /api/characters/:id/leg-setups: newest first, with the engine's defaults for this character's rig. */
export const legSetupListSchema = z.object({
  versions: z.array(legSetupVersionSchema),
  defaults: LegSetupSchema,
  legNames: z.array(z.string()),
  /** The walking rig (engine/gait/character-rig.ts) the live preview runs. */
  rig: z.custom<Rig>(),
});
export type LegSetupList = z.infer<typeof legSetupListSchema>;

export const legSetupNoteSchema = z.string().trim().max(200, 'Use at most 200 characters.');

/** POST /api/characters/:id/leg-setups: save the form as a new version. */
export const legSetupCreateSchema = z.object({
  setup: LegSetupSchema,
  note: legSetupNoteSchema.default(''),
});
export type LegSetupCreate = z.input<typeof legSetupCreateSchema>;
