/**
 * kill -9 of a real server process in the middle of an upload, at each forced point of the storage path
 * (TREADLE_UPLOAD_FAULT, server/services/gltf-import-faults.ts): before and after the rename into the content
 * address, before and after the commit of the row. After a restart: every committed character has its file, no
 * temporary file remains, SQLite's `PRAGMA integrity_check` answers ok, and the same upload succeeds again.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { openDatabase, migrateToLatest } from '../../server/db';
import { projectRoot } from '../../server/config';
import { characterFilePath, sha256Hex } from '../../server/services/character-files';
import { closeImportPool } from '../../server/services/gltf-import-pool';
import { FAULT_PAUSED_LINE, type FaultPoint } from '../../server/services/gltf-import-faults';
import { DEMO_PASSWORD, seedDemoStudio } from '../../seeds/demo-studio';
import { glbOf, wicket } from '../fixtures/gltf/build-fixtures';

jest.setTimeout(300_000);

const ENTRY = path.join(__dirname, 'upload-crash-server.ts');
let dir: string;
let dbFile: string;
let dataDir: string;
let server: { child: ChildProcess; url: string; lines: string[] } | null = null;

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-crash-'));
  dbFile = path.join(dir, 'treadle.sqlite');
  dataDir = path.join(dir, 'files');
  const db = openDatabase(dbFile);
  await migrateToLatest(db);
  await seedDemoStudio(db, { now: Date.now(), dataDir });
  await db.destroy();
  await closeImportPool();
});
afterAll(async () => {
  if (server) await kill9();
  fs.rmSync(dir, { recursive: true, force: true });
});

/** Starts the server process and resolves once it listens; `fault` arms one forced stop. */
function start(fault?: string): Promise<void> {
  const env: NodeJS.ProcessEnv = { ...process.env, TREADLE_DB: dbFile, TREADLE_DATA_DIR: dataDir, TREADLE_UPLOAD_FAULT: fault ?? '', NODE_ENV: 'test', TREADLE_WORKERS: '1' };
  const child = spawn(process.execPath, ['--import', 'tsx', ENTRY], { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
  const lines: string[] = [];
  let stderr = '';
  child.stderr!.on('data', (c: Buffer) => (stderr += c.toString()));
  return new Promise((resolve, reject) => {
    let buffered = '';
    child.stdout!.on('data', (c: Buffer) => {
      buffered += c.toString();
      const parts = buffered.split('\n');
      buffered = parts.pop()!;
      for (const line of parts) {
        lines.push(line);
        const m = /^listening (\S+)/.exec(line);
        if (m) {
          server = { child, url: m[1], lines };
          resolve();
        }
      }
    });
    child.on('exit', (code, signal) => {
      if (!server || server.child !== child) reject(new Error(`server exited (${code ?? signal}) before listening: ${stderr}`));
    });
  });
}

function waitForLine(pattern: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const s = server!;
    const seen = () => s.lines.some((l) => l.includes(pattern));
    if (seen()) return resolve();
    const onData = () => {
      if (seen()) {
        s.child.stdout!.off('data', onData);
        resolve();
      }
    };
    s.child.stdout!.on('data', onData);
    s.child.once('exit', () => (seen() ? resolve() : reject(new Error(`server ended before "${pattern}"`))));
  });
}

/** kill -9, and wait until the process is gone. */
async function kill9(): Promise<void> {
  const s = server!;
  server = null;
  if (s.child.exitCode !== null || s.child.signalCode !== null) return;
  await new Promise<void>((resolve) => {
    s.child.once('exit', () => resolve());
    s.child.kill('SIGKILL');
  });
}

async function signIn(url: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'designer@brassmoth.test', password: DEMO_PASSWORD }) });
  expect(res.status).toBeLessThan(300);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

function uploadTo(url: string, cookie: string, glb: Uint8Array, name: string): Promise<Response> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(glb)]), `${name}.glb`);
  return fetch(`${url}/api/characters`, { method: 'POST', headers: { cookie }, body: form });
}

/** What a crash must never break. */
function checkStore(): { rows: { id: number; sha256: string }[]; temps: string[] } {
  const db = new Database(dbFile, { readonly: true });
  try {
    expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
    const rows = db.prepare('SELECT id, sha256 FROM characters').all() as { id: number; sha256: string }[];
    for (const r of rows) expect({ id: r.id, file: fs.existsSync(characterFilePath(dataDir, r.sha256)) }).toEqual({ id: r.id, file: true });
    const folder = path.join(dataDir, 'characters');
    const temps = fs.readdirSync(folder).filter((n) => n.startsWith('.incoming-'));
    return { rows, temps };
  } finally {
    db.close();
  }
}

const POINTS: FaultPoint[] = ['before-rename', 'after-rename', 'before-commit', 'after-commit'];

describe('kill -9 during an upload', () => {
  it.each(POINTS.map((p, i) => [p, i] as const))('at %s leaves every committed character with its file, and the upload can be repeated', async (point, i) => {
    const glb = await glbOf({ ...wicket, name: `Wicket crash ${i}`, parts: wicket.parts.slice(i + 1) });
    const sha = sha256Hex(glb);
    await start(`${point}:pause`);
    const cookie = await signIn(server!.url);
    const pending = uploadTo(server!.url, cookie, glb, `crash-${point}`).catch(() => null);
    await waitForLine(`${FAULT_PAUSED_LINE} ${point}`);
    // The forced point is where it says: a temporary file before the rename, the file in place after it.
    const folder = path.join(dataDir, 'characters');
    const temps = fs.readdirSync(folder).filter((n) => n.startsWith('.incoming-'));
    if (point === 'before-rename') expect(temps).toHaveLength(1);
    else expect(fs.existsSync(characterFilePath(dataDir, sha))).toBe(true);
    await kill9();
    expect(await pending).toBeNull();

    const crashed = checkStore();
    expect(crashed.rows.some((r) => r.sha256 === sha)).toBe(point === 'after-commit');

    await start();
    const after = checkStore();
    expect(after.temps).toEqual([]);
    const again = await uploadTo(server!.url, await signIn(server!.url), glb, `crash-${point}`);
    expect(again.status).toBe(point === 'after-commit' ? 200 : 201);
    const body = (await again.json()) as { character: { id: number } };
    const file = await fetch(`${server!.url}/api/characters/${body.character.id}/file`, { headers: { cookie: await signIn(server!.url) } });
    expect(file.status).toBe(200);
    expect(Buffer.compare(Buffer.from(await file.arrayBuffer()), Buffer.from(glb))).toBe(0);
    await kill9();
    // Keep the team within its plan's character limit for the next round.
    const db = new Database(dbFile);
    db.prepare('DELETE FROM characters WHERE sha256 = ?').run(sha);
    db.close();
    checkStore();
  });

  it('survives the process killing itself at the rename (TREADLE_UPLOAD_FAULT=…:exit)', async () => {
    const glb = await glbOf({ ...wicket, name: 'Wicket self-kill', parts: wicket.parts.slice(6) });
    await start('before-rename:exit');
    const res = await uploadTo(server!.url, await signIn(server!.url), glb, 'self-kill').catch(() => null);
    expect(res).toBeNull();
    await new Promise<void>((resolve) => (server!.child.exitCode !== null || server!.child.signalCode !== null ? resolve() : server!.child.once('exit', () => resolve())));
    expect(server!.child.signalCode).toBe('SIGKILL');
    server = null;
    expect(checkStore().temps).toHaveLength(1);
    await start();
    expect(checkStore().temps).toEqual([]);
    await kill9();
  });
});
