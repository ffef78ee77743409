/**
 * Characters in the database: the row and its encoding both ways, reads scoped to one team, leg updates, the
 * stored file, and the one conversion of a row into the rig the engine walks. Uploads (gltf-import-store.ts)
 * insert through here.
 */
import fs from 'node:fs';
import type { Knex } from 'knex';
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import type { Character, CharacterDetail, DetectedLeg, ImportReport, LegMapping } from '../../schemas/characters';
import type { ApiCharacterList } from '../../schemas/profiles';
import type { Skeleton, SkeletonJoint } from '../../engine/rig/types';
import { legMappingProblems } from '../../engine/rig/skeleton-leg-check';
import { scaledSkeleton } from '../../engine/rig/skeleton-scale';
import { detectLegs } from '../../engine/rig/detect-legs';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import type { Rig } from '../../engine/gait/rig';
import { characterFilePath } from './character-files';

type Conn = Db | Knex.Transaction;

/** What skeleton_json holds. */
export interface StoredSkeleton {
  joints: SkeletonJoint[];
  /** Rest world positions, x y z per joint. */
  positions: number[];
  /** 16 numbers per joint, column-major. */
  inverseBindMatrices: number[];
}

export interface CharacterRow {
  id: number;
  team_id: number;
  name: string;
  file_name: string;
  format: 'glb' | 'gltf';
  sha256: string;
  byte_size: number;
  joint_count: number;
  leg_count: number;
  skeleton_json: string;
  detected_legs_json: string;
  legs_json: string;
  legs_edited: number | boolean;
  report_json: string;
  /** The unit fix (migrations/20261202300000_character_unit_scale.ts). */
  unit_scale: number;
  uploaded_by: number;
  uploader_name: string;
  created_at: number;
  updated_at: number;
}

/** A character as a trial walks it: rest skeleton and mapped legs; the file's sha256 keys cached suite runs. */
export interface TrialCharacter {
  name: string;
  sha256: string;
  /** In metres: the unit fix is applied. */
  skeleton: Skeleton;
  legs: LegMapping[];
  /** The unit fix applied to the file's skeleton (a profile carries it, so a game applies it too). */
  unitScale?: number;
}

/** A team's character with its walking rig. */
export interface WalkingCharacter {
  id: number;
  name: string;
  rig: Rig;
  character: TrialCharacter;
}

/** Rows with the uploader's name, always scoped to one team. */
function characterRows(db: Conn, teamId: number) {
  return db('characters as c').join('users as u', 'u.id', 'c.uploaded_by').where('c.team_id', teamId).select<CharacterRow[]>('c.*', 'u.name as uploader_name');
}

export async function findCharacterRow(db: Conn, teamId: number, id: number): Promise<CharacterRow | undefined> {
  return (await characterRows(db, teamId).where('c.id', id))[0];
}

/** The team's character, or a 404 (another team's character is one too). */
export async function getCharacterRow(db: Conn, teamId: number, id: number): Promise<CharacterRow> {
  const row = await findCharacterRow(db, teamId, id);
  if (!row) throw notFound('That character');
  return row;
}

/** The one place skeleton_json is read. */
export function skeletonOf(row: Pick<CharacterRow, 'skeleton_json'>): StoredSkeleton {
  return JSON.parse(row.skeleton_json) as StoredSkeleton;
}

const legsOf = (row: Pick<CharacterRow, 'legs_json'>) => JSON.parse(row.legs_json) as LegMapping[];
const reportOf = (row: Pick<CharacterRow, 'report_json'>) => JSON.parse(row.report_json) as ImportReport;

export function characterFromRow(row: CharacterRow): Character {
  return {
    id: row.id,
    name: row.name,
    fileName: row.file_name,
    format: row.format,
    byteSize: row.byte_size,
    sha256: row.sha256,
    jointCount: row.joint_count,
    legCount: row.leg_count,
    uploadedBy: { id: row.uploaded_by, name: row.uploader_name },
    createdAt: Number(row.created_at),
    updatedAt: Number(row.updated_at),
    legs: legsOf(row),
    legsEdited: Boolean(row.legs_edited),
    unitScale: unitScaleOf(row),
  };
}

/** The character's unit fix; 1 when none is set. */
export function unitScaleOf(row: Partial<Pick<CharacterRow, 'unit_scale'>>): number {
  const s = Number(row.unit_scale ?? 1);
  return Number.isFinite(s) && s > 0 ? s : 1;
}

export async function listCharacters(db: Conn, teamId: number): Promise<Character[]> {
  const rows = await characterRows(db, teamId).orderBy('c.created_at', 'desc').orderBy('c.id', 'desc');
  return rows.map(characterFromRow);
}

export async function getCharacter(db: Conn, teamId: number, id: number): Promise<Character> {
  return characterFromRow(await getCharacterRow(db, teamId, id));
}

export async function characterDetail(db: Conn, teamId: number, id: number): Promise<CharacterDetail> {
  const row = await getCharacterRow(db, teamId, id);
  const skeleton = skeletonOf(row);
  // The unit fix scales every rest position about the origin (engine/rig/skeleton-scale.ts scaledSkeleton).
  const k = unitScaleOf(row);
  return {
    character: characterFromRow(row),
    skeleton: {
      joints: skeleton.joints.map((j, i) => ({
        name: j.name,
        parent: j.parent,
        position: [skeleton.positions[3 * i] * k, skeleton.positions[3 * i + 1] * k, skeleton.positions[3 * i + 2] * k],
      })),
    },
    detectedLegs: JSON.parse(row.detected_legs_json) as DetectedLeg[],
    report: reportOf(row),
  };
}

/** For the build tool: each character with its profile and that profile's newest version. */
export async function charactersWithProfiles(db: Conn, teamId: number): Promise<ApiCharacterList['characters']> {
  type Row = { id: number; name: string; sha256: string; profile_id: number | null; latest: number | null };
  const rows = (await characterRows(db, teamId)
    .leftJoin('profiles as p', 'p.character_id', 'c.id')
    .leftJoin('profile_versions as v', 'v.profile_id', 'p.id')
    .groupBy('c.id')
    .clearSelect()
    .select('c.id', 'c.name', 'c.sha256', 'p.id as profile_id')
    .max({ latest: 'v.version' })
    .orderBy('c.name')
    .orderBy('c.id')) as unknown as Row[];
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    sha256: r.sha256,
    profile: r.profile_id && r.latest ? { id: r.profile_id, latestVersion: r.latest } : null,
  }));
}

/**
 * Saves an edited leg mapping. Topology (joints exist, hip → end is one path, no joint in two legs) is checked
 * against the stored skeleton first: a 400 whose fields name each problem, and nothing written.
 */
export async function updateCharacterLegs(db: Db, input: { teamId: number; id: number; legs: LegMapping[]; now: number }): Promise<Character> {
  const row = await getCharacterRow(db, input.teamId, input.id);
  const problems = legMappingProblems({ joints: skeletonOf(row).joints }, input.legs);
  const keys = Object.keys(problems);
  if (keys.length) throw new HttpError(400, 'invalid_legs', problems[keys[0]], problems);
  await db.transaction(async (trx) => {
    await trx('characters')
      .where({ id: row.id, team_id: input.teamId })
      .update({ legs_json: JSON.stringify(input.legs), leg_count: input.legs.length, legs_edited: true, updated_at: input.now });
  });
  return getCharacter(db, input.teamId, row.id);
}

/**
 * Stores a unit fix (the file stays as uploaded). The detected legs' evidence is measured again, in metres once a fix
 * is stored; the legs themselves do not change, since detection judges by proportions, not sizes.
 */
export async function updateCharacterUnitScale(db: Db, input: { teamId: number; id: number; unitScale: number; now: number }): Promise<Character> {
  const row = await getCharacterRow(db, input.teamId, input.id);
  const detected = JSON.parse(row.detected_legs_json) as DetectedLeg[];
  // Undone on a file that looks authored in another unit: the evidence goes back to that unit, as at import.
  const guess = reportOf(row).units?.guess;
  const unit = input.unitScale === 1 && guess?.certainty === 'likely' ? guess.unit : 'metres';
  const again = detectLegs(scaledSkeleton({ joints: skeletonOf(row).joints }, input.unitScale), { unit }).legs;
  const sameLegs = again.length === detected.length && again.every((l, i) => l.end === detected[i].end && l.joints.length === detected[i].joints.length);
  const refreshed = sameLegs ? detected.map((l, i) => ({ ...l, evidence: again[i].evidence })) : detected;
  await db.transaction(async (trx) => {
    await trx('characters')
      .where({ id: row.id, team_id: input.teamId })
      .update({ unit_scale: input.unitScale, detected_legs_json: JSON.stringify(refreshed), updated_at: input.now });
  });
  return getCharacter(db, input.teamId, row.id);
}

/** A character as a trial walks it, from its row: the rest skeleton in metres, the unit fix applied. */
export function trialCharacterOf(row: Pick<CharacterRow, 'name' | 'sha256' | 'skeleton_json' | 'legs_json'> & Partial<Pick<CharacterRow, 'unit_scale'>>): TrialCharacter {
  const skeleton = scaledSkeleton({ joints: skeletonOf(row).joints }, unitScaleOf(row));
  return { name: row.name, sha256: row.sha256, skeleton, legs: legsOf(row), unitScale: unitScaleOf(row) };
}

/**
 * The character's walking rig. A mapping the engine cannot build a rig from is a 400 naming why, under `field`
 * (the request field that picked the character).
 */
export function rigOf(c: TrialCharacter, field = 'characterId'): Rig {
  try {
    return rigFromCharacter(c.skeleton, c.legs, { name: c.name });
  } catch (err) {
    const why = `${c.name} cannot walk with its leg mapping: ${(err as Error).message}.`;
    throw new HttpError(400, 'unwalkable_character', `${why} Fix the legs on the character page.`, { [field]: why });
  }
}

/** A team's character and its walking rig: a 404 for a character not the team's, a 400 for legs that cannot walk. */
export async function loadCharacterRig(db: Conn, teamId: number, id: number, field = 'characterId'): Promise<WalkingCharacter> {
  const row = await getCharacterRow(db, teamId, id);
  const character = trialCharacterOf(row);
  return { id: row.id, name: row.name, rig: rigOf(character, field), character };
}

/** The team's character already made from this very file, if any. */
export async function findCharacterByFile(db: Conn, teamId: number, sha256: string): Promise<{ id: number; report: ImportReport } | null> {
  const row = await db('characters').where({ team_id: teamId, sha256 }).first('id', 'report_json');
  return row ? { id: row.id, report: reportOf(row) } : null;
}

/** Whether any character of any team uses this file. */
export async function fileInUse(db: Conn, sha256: string): Promise<boolean> {
  return Boolean(await db('characters').where({ sha256 }).first('id'));
}

export interface NewCharacter {
  teamId: number;
  userId: number;
  name: string;
  fileName: string;
  format: 'glb' | 'gltf';
  sha256: string;
  byteSize: number;
  skeleton: StoredSkeleton;
  detectedLegs: DetectedLeg[];
  report: ImportReport;
  now: number;
}

/** Inserts an imported character (inside the caller's transaction); its legs in use start as detected. */
export async function insertCharacter(trx: Conn, c: NewCharacter): Promise<number> {
  const [id] = await trx('characters').insert({
    team_id: c.teamId,
    name: c.name,
    file_name: c.fileName,
    format: c.format,
    sha256: c.sha256,
    byte_size: c.byteSize,
    joint_count: c.skeleton.joints.length,
    leg_count: c.detectedLegs.length,
    skeleton_json: JSON.stringify(c.skeleton),
    detected_legs_json: JSON.stringify(c.detectedLegs),
    legs_json: JSON.stringify(c.detectedLegs.map(mappingOf)),
    legs_edited: false,
    report_json: JSON.stringify(c.report),
    uploaded_by: c.userId,
    created_at: c.now,
    updated_at: c.now,
  });
  return id as number;
}

/** The character's stored file on disk; a 410 when it has gone missing from the data folder. */
export async function storedCharacterFile(db: Conn, dataDir: string, teamId: number, id: number): Promise<{ path: string; sha256: string }> {
  const row = await getCharacterRow(db, teamId, id);
  const file = characterFilePath(dataDir, row.sha256);
  if (!fs.existsSync(file)) throw new HttpError(410, 'file_missing', 'The stored file of this character is missing from the server. Upload it again.');
  return { path: file, sha256: row.sha256 };
}
