/**
 * Every input of the fuzz corpus (tests/fixtures/fuzz/corpus.ts), uploaded to the real app over a real SQLite
 * file: each is refused with a 4xx and a message, the server answers /api/health after each, and nothing of it
 * stays on disk or in the database. The corpus is generated with a fixed seed, so a failure here reproduces.
 */
import fs from 'node:fs';
import path from 'node:path';
import { testApp, type TestApp } from '../support/test-app';
import { seedDemoStudio } from '../../seeds/demo-studio';
import { closeImportPool } from '../../server/services/gltf-import-pool';
import { fuzzCorpus, type FuzzCase, type FuzzKind } from '../fixtures/fuzz/corpus';
import { glbOf, file, wicket } from '../fixtures/gltf/build-fixtures';
import { signedIn, upload, type Agent } from './characters-helpers';

jest.setTimeout(300_000);

let t: TestApp;
let designer: Agent;
let corpus: FuzzCase[];

beforeAll(async () => {
  t = await testApp();
  await seedDemoStudio(t.db, { now: t.clock.now(), dataDir: t.dataDir });
  designer = await signedIn(t.app, 'designer@brassmoth.test');
  corpus = await fuzzCorpus();
});
afterAll(async () => {
  await t.cleanup();
  await closeImportPool();
});

/** Rows of every table but the session store (a request may touch its own session), and every file under the data folder. */
async function footprint(): Promise<{ rows: Record<string, number>; files: string[] }> {
  const tables = (await t.db.raw("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '%session%'")) as { name: string }[];
  const rows: Record<string, number> = {};
  for (const { name } of tables) rows[name] = Number((await t.db(name).count({ n: '*' }).first())?.n);
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const entry of fs.existsSync(dir) ? fs.readdirSync(dir, { withFileTypes: true }) : []) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else files.push(path.relative(t.dataDir, full));
    }
  };
  walk(t.dataDir);
  return { rows, files: files.sort() };
}

describe('the fuzz corpus', () => {
  it('has at least 300 inputs covering every kind of damage', () => {
    expect(corpus.length).toBeGreaterThanOrEqual(300);
    const kinds = new Set(corpus.map((c) => c.kind));
    const all: FuzzKind[] = ['truncation', 'bit flip', 'header', 'chunk', 'huge length', 'accessor', 'non-finite', 'hierarchy', 'scene', 'deep nesting', 'object count', 'data uri', 'outside uri', 'zero bytes', 'wrong extension', 'file name', 'json shape', 'form'];
    for (const kind of all) expect(kinds).toContain(kind);
  });

  it('is the same on every run (seeded)', async () => {
    const again = await fuzzCorpus();
    expect(again.map((c) => c.what)).toEqual(corpus.map((c) => c.what));
    expect(Buffer.concat(again.flatMap((c) => c.files.map((f) => f.buffer))).equals(Buffer.concat(corpus.flatMap((c) => c.files.map((f) => f.buffer))))).toBe(true);
  });

  it('is refused input by input with a 4xx and a message, the server keeps answering, and nothing is kept', async () => {
    const before = await footprint();
    const wrong: { what: string; status: number; code?: string }[] = [];
    let afterwards = before;
    for (const c of corpus) {
      const res = await upload(designer, c.files);
      const message: unknown = res.body?.error?.message;
      if (res.status < 400 || res.status > 499 || typeof message !== 'string' || message.length < 15) wrong.push({ what: c.what, status: res.status, code: res.body?.error?.code });
      const health = await designer.get('/api/health');
      if (health.status !== 200) wrong.push({ what: `health after ${c.what}`, status: health.status });
      afterwards = await footprint();
      if (JSON.stringify(afterwards) !== JSON.stringify(before)) wrong.push({ what: `left something behind: ${c.what}`, status: res.status });
    }
    expect(wrong).toEqual([]);
    expect(afterwards).toEqual(before);
  });

  it('still takes a good character afterwards', async () => {
    const res = await upload(designer, [file('wicket-after-fuzz.glb', await glbOf({ ...wicket, name: 'Wicket after fuzz', parts: wicket.parts.slice(1) }))]);
    expect(res.status).toBe(201);
    expect(res.body.character.legCount).toBe(2);
  });
});
