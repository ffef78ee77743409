/** Saved leg setup versions (table leg_setups, owned by the leg-setup feature) as the profile and compare features read them. */
import type { Db } from '../db';
import { HttpError } from '../errors';

export interface SavedLegSetup {
  id: number;
  characterId: number;
  version: number;
  setup: unknown;
}

export async function findLegSetupVersion(db: Db, teamId: number, legSetupId: number): Promise<SavedLegSetup> {
  const row = await db('leg_setups').where({ id: legSetupId, team_id: teamId }).first('id', 'character_id', 'version', 'setup');
  if (!row) throw new HttpError(404, 'not_found', 'That leg setup was not found.', { legSetupId: 'Pick a saved leg setup of your team.' });
  return { id: row.id, characterId: row.character_id, version: row.version, setup: JSON.parse(row.setup) };
}

/** A saved setup's JSON, checked to belong to the character it is published for. */
export async function loadLegSetupVersion(db: Db, teamId: number, legSetupId: number, characterId: number): Promise<unknown> {
  const saved = await findLegSetupVersion(db, teamId, legSetupId);
  if (saved.characterId !== characterId) {
    throw new HttpError(400, 'wrong_character', 'That leg setup belongs to another character.', { legSetupId: 'Pick a leg setup of this character.' });
  }
  return saved.setup;
}

/** The id of a character's newest saved leg setup version, if it has any. */
export async function newestLegSetupId(db: Db, teamId: number, characterId: number): Promise<number | undefined> {
  const row = await db('leg_setups').where({ team_id: teamId, character_id: characterId }).orderBy('version', 'desc').first('id');
  return row?.id;
}
