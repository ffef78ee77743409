/**
 * Leg setups in the database: versions per character, and which setup a
 * trial or dial-in runs (a saved version, an unsaved one, the newest version, or the engine's defaults).
 * Every query is scoped to one team.
 */
import type { Knex } from 'knex';
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import { defaultLegSetup, LegSetupSchema, type LegSetup } from '../../engine/gait/leg-setup';
import { rigFitProblem } from '../../engine/gait/setup-problems';
import type { Rig } from '../../engine/gait/rig';
import type { LegSetupSource, LegSetupVersion } from '../../schemas/leg-setups';
import { roundProfileNumbers } from '../../engine/profile/export';
import type { WalkingCharacter } from './characters';

type Conn = Db | Knex.Transaction;

interface LegSetupRow {
  id: number;
  team_id: number;
  character_id: number;
  version: number;
  setup: string;
  note: string;
  source: LegSetupSource;
  created_by: number;
  creator_name: string;
  created_at: number;
}

function versionFromRow(r: LegSetupRow): LegSetupVersion {
  return {
    id: r.id,
    characterId: r.character_id,
    version: r.version,
    setup: LegSetupSchema.parse(JSON.parse(r.setup)),
    note: r.note,
    source: r.source,
    createdBy: { id: r.created_by, name: r.creator_name },
    createdAt: Number(r.created_at),
  };
}

const rows = (db: Conn, teamId: number) =>
  db('leg_setups as s').join('users as u', 'u.id', 's.created_by').where('s.team_id', teamId).select<LegSetupRow[]>('s.*', 'u.name as creator_name');

export async function listLegSetups(db: Conn, teamId: number, characterId: number): Promise<LegSetupVersion[]> {
  return (await rows(db, teamId).where('s.character_id', characterId).orderBy('s.version', 'desc')).map(versionFromRow);
}

export async function findLegSetup(db: Conn, teamId: number, id: number): Promise<LegSetupVersion> {
  const [row] = await rows(db, teamId).where('s.id', id);
  if (!row) throw notFound('That leg setup');
  return versionFromRow(row);
}

/** The setup must fit the rig (leg and joint names, phase offsets per leg): a 400 whose field names the setting. */
export function assertFitsRig(setup: LegSetup, rig: Rig, field = 'setup'): void {
  const problem = rigFitProblem(setup, rig);
  if (problem) throw new HttpError(400, 'invalid_input', problem.message, { [problem.path ? `${field}.${problem.path}` : field]: problem.message });
}

/** Saves a new version (numbered after the character's newest) in one transaction. */
export async function saveLegSetup(
  db: Db,
  v: { teamId: number; characterId: number; userId: number; setup: LegSetup; note: string; source: LegSetupSource; now: number },
): Promise<number> {
  return db.transaction(async (trx) => {
    const top = await trx('leg_setups').where({ character_id: v.characterId }).max<{ n: number | null }>({ n: 'version' }).first();
    const [id] = await trx('leg_setups').insert({
      team_id: v.teamId,
      character_id: v.characterId,
      version: Number(top?.n ?? 0) + 1,
      // Stored at the precision a published profile keeps, so its trials, Compare and its profile run the same numbers.
      setup: JSON.stringify(roundProfileNumbers(v.setup)),
      note: v.note,
      source: v.source,
      created_by: v.userId,
      created_at: v.now,
    });
    return typeof id === 'object' ? (id as { id: number }).id : id;
  });
}

export interface ResolvedSetup {
  setup: LegSetup;
  legSetupId: number | null;
  legSetupVersion: number | null;
}

/** Which setup a trial or dial-in runs: the version asked for, an unsaved one, else the newest version, else the defaults. */
export async function resolveLegSetup(
  db: Conn,
  teamId: number,
  character: WalkingCharacter,
  ask: { legSetupId?: number; legSetup?: LegSetup },
): Promise<ResolvedSetup> {
  let resolved: ResolvedSetup;
  if (ask.legSetupId !== undefined) {
    const v = await findLegSetup(db, teamId, ask.legSetupId);
    if (v.characterId !== character.id) throw new HttpError(400, 'invalid_input', `Leg setup ${ask.legSetupId} belongs to another character.`, { legSetupId: 'This leg setup belongs to another character.' });
    resolved = { setup: v.setup, legSetupId: v.id, legSetupVersion: v.version };
  } else if (ask.legSetup) {
    resolved = { setup: ask.legSetup, legSetupId: null, legSetupVersion: null };
  } else {
    const [newest] = await listLegSetups(db, teamId, character.id);
    resolved = newest
      ? { setup: newest.setup, legSetupId: newest.id, legSetupVersion: newest.version }
      : { setup: defaultLegSetup(character.rig), legSetupId: null, legSetupVersion: null };
  }
  assertFitsRig(resolved.setup, character.rig, ask.legSetup ? 'legSetup' : 'legSetupId');
  return resolved;
}
