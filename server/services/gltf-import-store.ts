/**
 * Keeping an imported character: its file (durable at its content address first, character-files.ts) and then
 * its row (in one transaction). The seed stores its demo characters through here too, exactly like an upload.
 */
import type { Db } from '../db';
import type { Character, DetectedLeg, ImportReport, LegMapping } from '../../schemas/characters';
import type { SkeletonJoint } from '../../engine/rig/types';
import { importGltf, type UploadedFile } from './gltf-import';
import { placeCharacterFile, removeCharacterFile, sha256Hex } from './character-files';
import { faultPoint } from './gltf-import-faults';
import { assertWithinLimit } from './billing-limits';

export interface StoreDeps {
  db: Db;
  dataDir: string;
  now: () => number;
}

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
  uploaded_by: number;
  uploader_name: string;
  created_at: number;
  updated_at: number;
}

/** Rows with the uploader's name, always scoped to one team. */
export function characterRows(db: Db, teamId: number) {
  return db('characters as c').join('users as u', 'u.id', 'c.uploaded_by').where('c.team_id', teamId).select<CharacterRow[]>('c.*', 'u.name as uploader_name');
}

export async function findCharacterRow(db: Db, teamId: number, id: number): Promise<CharacterRow | undefined> {
  return (await characterRows(db, teamId).where('c.id', id))[0];
}

/** Strips what only detection knows (confidence, evidence) from a detected leg. */
export function mappingOf(leg: DetectedLeg): LegMapping {
  return { name: leg.name, side: leg.side, joints: leg.joints, end: leg.end };
}

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
    legs: JSON.parse(row.legs_json) as LegMapping[],
    legsEdited: Boolean(row.legs_edited),
  };
}

/** The first `max` characters by code point, so a cut never leaves half of a surrogate pair (an emoji, say). */
function clip(text: string, max: number): string {
  return Array.from(text).slice(0, max).join('');
}

function defaultName(fileName: string): string {
  const base = fileName.replace(/^.*[\\/]/, '').replace(/\.(glb|gltf)$/i, '').trim();
  return clip(base || 'Unnamed character', 60);
}

function isUniqueViolation(err: unknown): boolean {
  return err instanceof Error && /UNIQUE constraint failed/i.test(err.message);
}

export interface StoredUpload {
  id: number;
  existing: boolean;
  report: ImportReport;
}

/**
 * Uploads of the same bytes take turns from placing the file to committing (or failing to commit) the row, so a
 * failed upload never removes a file another one is about to commit. One server process owns the data folder.
 */
const storing = new Map<string, Promise<unknown>>();

async function oneAtATime<T>(sha256: string, work: () => Promise<T>): Promise<T> {
  const before = storing.get(sha256) ?? Promise.resolve();
  const mine = before.catch(() => undefined).then(work);
  const settled = mine.catch(() => undefined);
  storing.set(sha256, settled);
  try {
    return await mine;
  } finally {
    if (storing.get(sha256) === settled) storing.delete(sha256);
  }
}

/**
 * Imports the files and keeps the character for the team. The same file uploaded again by the team is
 * recognised by its sha256 and answered with the character already there (and its file put back if it was lost).
 * The file is durable at its content address before the row commits, so a crash never leaves a row without its file.
 */
export async function storeCharacterUpload(
  deps: StoreDeps,
  input: { teamId: number; userId: number; name?: string; files: UploadedFile[] },
): Promise<StoredUpload> {
  const imported = await importGltf(input.files);
  const sha256 = sha256Hex(imported.glb);
  const findExisting = async (): Promise<StoredUpload | null> => {
    const row = await deps.db('characters').where({ team_id: input.teamId, sha256 }).first('id', 'report_json');
    return row ? { id: row.id, existing: true, report: JSON.parse(row.report_json) as ImportReport } : null;
  };
  const skeleton: StoredSkeleton = {
    joints: imported.skeleton.joints,
    positions: Array.from(imported.positions),
    inverseBindMatrices: Array.from(imported.inverseBindMatrices),
  };
  const legs = imported.detection.legs;
  const now = deps.now();

  return oneAtATime(sha256, async () => {
    await placeCharacterFile(deps.dataDir, sha256, imported.glb);
    const existing = await findExisting();
    if (existing) return existing;
    let id: number;
    try {
      id = await deps.db.transaction(async (trx) => {
        await assertWithinLimit(trx, input.teamId, 'characters');
        const [newId] = await trx('characters').insert({
          team_id: input.teamId,
          name: input.name?.trim() || defaultName(imported.fileName),
          file_name: clip(imported.fileName, 255),
          format: imported.format,
          sha256,
          byte_size: imported.glb.byteLength,
          joint_count: imported.skeleton.joints.length,
          leg_count: legs.length,
          skeleton_json: JSON.stringify(skeleton),
          detected_legs_json: JSON.stringify(legs),
          legs_json: JSON.stringify(legs.map(mappingOf)),
          legs_edited: false,
          report_json: JSON.stringify(imported.report),
          uploaded_by: input.userId,
          created_at: now,
          updated_at: now,
        });
        await faultPoint('before-commit');
        return newId as number;
      });
    } catch (err) {
      // Two uploads of the same file racing: the other one won, and its character is the answer.
      if (isUniqueViolation(err)) {
        const raced = await findExisting();
        if (raced) return raced;
      }
      // Refused (a plan limit, say): take the file back out unless some character, of any team, uses it.
      if (!(await deps.db('characters').where({ sha256 }).first('id'))) await removeCharacterFile(deps.dataDir, sha256);
      throw err;
    }
    await faultPoint('after-commit');
    return { id, existing: false, report: imported.report };
  });
}
