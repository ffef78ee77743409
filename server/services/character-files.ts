/**
 * Character files on disk, content-addressed: <dataDir>/characters/<sha256>.glb. A new file is written
 * under a temporary name first and renamed into place only after its database row has committed, so a
 * failed import leaves nothing behind and a reader never sees half a file.
 */
import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';

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

export function characterFilePath(dataDir: string, sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error('Not a sha256 digest.');
  return path.join(folder(dataDir), `${sha256}.glb`);
}

/** Writes the bytes under a temporary name in the same folder (so the later rename is atomic) and returns that path. */
export async function writeIncoming(dataDir: string, bytes: Uint8Array): Promise<string> {
  await fs.mkdir(folder(dataDir), { recursive: true });
  const temp = path.join(folder(dataDir), `.incoming-${crypto.randomUUID()}.glb`);
  await fs.writeFile(temp, bytes, { flag: 'wx' });
  return temp;
}

/** Moves a committed upload to its content address; when that file already exists (same bytes), drops the temporary one. */
export async function settleIncoming(dataDir: string, temp: string, sha256: string): Promise<void> {
  const target = characterFilePath(dataDir, sha256);
  try {
    await fs.access(target);
    await discardIncoming(temp);
  } catch {
    await fs.rename(temp, target);
  }
}

export async function discardIncoming(temp: string): Promise<void> {
  await fs.rm(temp, { force: true });
}
