/**
 * Keeping an imported character: its file (durable at its content address first, character-files.ts) and then
 * its row (in one transaction, through characters.ts). The seed stores its demo characters through here too, exactly like an upload.
 */
import type { Db } from '../db';
import type { ImportReport } from '../../schemas/characters';
import { importGltf, type UploadedFile } from './gltf-import';
import { placeCharacterFile, removeCharacterFile, sha256Hex } from './character-files';
import { faultPoint } from './gltf-import-faults';
import { assertWithinLimit } from './billing-limits';
import { fileInUse, findCharacterByFile, insertCharacter, type StoredSkeleton } from './characters';

export interface StoreDeps {
  db: Db;
  dataDir: string;
  now: () => number;
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
    const found = await findCharacterByFile(deps.db, input.teamId, sha256);
    return found ? { ...found, existing: true } : null;
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
        const newId = await insertCharacter(trx, {
          teamId: input.teamId,
          userId: input.userId,
          name: input.name?.trim() || defaultName(imported.fileName),
          fileName: clip(imported.fileName, 255),
          format: imported.format,
          sha256,
          byteSize: imported.glb.byteLength,
          skeleton,
          detectedLegs: legs,
          report: imported.report,
          now,
        });
        await faultPoint('before-commit');
        return newId;
      });
    } catch (err) {
      // Two uploads of the same file racing: the other one won, and its character is the answer.
      if (isUniqueViolation(err)) {
        const raced = await findExisting();
        if (raced) return raced;
      }
      // Refused (a plan limit, say): take the file back out unless some character, of any team, uses it.
      if (!(await fileInUse(deps.db, sha256))) await removeCharacterFile(deps.dataDir, sha256);
      throw err;
    }
    await faultPoint('after-commit');
    return { id, existing: false, report: imported.report };
  });
}
