/**
 * Character files on disk, content-addressed: <dataDir>/characters/<sha256>.glb. The order survives a crash at
 * any point: the bytes go to a temporary name, are fsync'd, renamed to their content address and the folder is
 * fsync'd, and only then does the character's row commit (gltf-import-store.ts). So a committed row always has
 * its file; a crash before the commit leaves at most an unreferenced file (reused by the next upload of the same
 * bytes) or a `.incoming-*` temporary, which removeIncomingFiles clears when the server starts.
 */
import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { faultPoint } from './gltf-import-faults';

/** Upload cap per request: 50 MB unless TREADLE_MAX_UPLOAD_MB says otherwise. */
export function uploadCapBytes(env: NodeJS.ProcessEnv = process.env): number {
  const mb = Number(env.TREADLE_MAX_UPLOAD_MB ?? 50);
  return Math.round((Number.isFinite(mb) && mb > 0 ? mb : 50) * 1024 * 1024);
}

export function sha256Hex(bytes: Uint8Array): string {
  return crypto.createHash('sha256').update(bytes).digest('hex');
}

function folder(dataDir: string): string {
  return path.join(dataDir, 'characters');
}

const INCOMING = /^\.incoming-/;

export function characterFilePath(dataDir: string, sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error('Not a sha256 digest.');
  return path.join(folder(dataDir), `${sha256}.glb`);
}

/** Makes a rename or a new entry in the folder durable (fsync of the directory; POSIX rename(2) and fsync(2)). */
async function syncFolder(dir: string): Promise<void> {
  const handle = await fs.open(dir, 'r');
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
}

async function sizeOf(file: string): Promise<number | null> {
  try {
    return (await fs.stat(file)).size;
  } catch {
    return null;
  }
}

/**
 * Puts the bytes at their content address, durably, and returns whether it wrote them. A file already there with
 * the right size is kept; a missing or wrong-sized one (lost in a crash, or damaged) is written anew.
 */
export async function placeCharacterFile(dataDir: string, sha256: string, bytes: Uint8Array): Promise<boolean> {
  const target = characterFilePath(dataDir, sha256);
  if ((await sizeOf(target)) === bytes.byteLength) return false;
  const dir = folder(dataDir);
  if (await fs.mkdir(dir, { recursive: true })) await syncFolder(path.dirname(dir));
  const temp = path.join(dir, `.incoming-${crypto.randomUUID()}.glb`);
  try {
    const handle = await fs.open(temp, 'wx');
    try {
      await handle.writeFile(bytes);
      await handle.sync();
    } finally {
      await handle.close();
    }
    await faultPoint('before-rename');
    await fs.rename(temp, target);
    await syncFolder(dir);
  } catch (err) {
    await fs.rm(temp, { force: true });
    throw err;
  }
  await faultPoint('after-rename');
  return true;
}

/** Removes a character file (only ever one that no row refers to; the caller checks). */
export async function removeCharacterFile(dataDir: string, sha256: string): Promise<void> {
  await fs.rm(characterFilePath(dataDir, sha256), { force: true });
}

/** Clears the temporary files an interrupted upload left behind; run at start, before any upload can be under way. */
export async function removeIncomingFiles(dataDir: string): Promise<string[]> {
  const dir = folder(dataDir);
  let names: string[];
  try {
    names = await fs.readdir(dir);
  } catch {
    return [];
  }
  const stale = names.filter((n) => INCOMING.test(n));
  for (const n of stale) await fs.rm(path.join(dir, n), { force: true });
  if (stale.length) await syncFolder(dir);
  return stale;
}
