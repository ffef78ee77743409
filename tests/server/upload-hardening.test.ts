/**
 * The upload findings of the hardening review, one block each, against the real app over a real SQLite file:
 * 1 deeply nested JSON, 2 the request as a whole capped while it streams, 3 the file durable before its row,
 * 4 object counts no character reaches, 9 the smaller ones (an undecodable path, `nodes` as an object, UTF-8 names).
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { startWithLocalPayments } from '../../server/launch/local-payments';
import { characterFilePath } from '../../server/services/character-files';
import { closeImportPool } from '../../server/services/gltf-import-pool';
import { storeCharacterUpload } from '../../server/services/gltf-import-store';
import { DEMO_PASSWORD } from '../../seeds/demo-studio';
import { DEFAULT_JSON_BOUNDS, scanJsonBounds } from '../../server/services/gltf-import-json-scan';
import { MAX_OBJECTS } from '../../server/services/gltf-import-refusals';
import { mulberry32, type Rng } from '../../engine/math/random';
import { assembleGlb } from '../fixtures/fuzz/corpus';
import { file, glbOf, wicket, wicketAsGltf } from '../fixtures/gltf/build-fixtures';
import { footprint, upload, type Agent } from './characters-helpers';
import { demoStudio } from './profiles-helpers';

jest.setTimeout(180_000);

const CAP_MB = 4;
const CAP = CAP_MB * 1024 * 1024;

let t: TestApp;
let s: Awaited<ReturnType<typeof demoStudio>>;
let designer: Agent;
let secret: string;
let wicketGlb: Uint8Array;

beforeAll(async () => {
  // The cap is read when the routers are built.
  process.env.TREADLE_MAX_UPLOAD_MB = String(CAP_MB);
  t = await testApp();
  delete process.env.TREADLE_MAX_UPLOAD_MB;
  s = await demoStudio(t);
  designer = s.agents.designer;
  secret = (await s.agents.programmer.post('/api/tokens').send({ name: 'CI build' })).body.secret;
  wicketGlb = await glbOf(wicket);
});
afterAll(async () => {
  await t.cleanup();
  await closeImportPool();
});

/** Wicket's GLB with its JSON text passed through `edit`. */
function editedGlb(edit: (json: string) => string): Uint8Array {
  const view = new DataView(wicketGlb.buffer, wicketGlb.byteOffset);
  const jsonLength = view.getUint32(12, true);
  const json = Buffer.from(wicketGlb.subarray(20, 20 + jsonLength)).toString('utf8').trimEnd();
  const bin = wicketGlb.subarray(28 + jsonLength, 28 + jsonLength + view.getUint32(20 + jsonLength, true));
  return assembleGlb(edit(json), bin);
}

const deepExtras = (depth: number) => (json: string) => json.replace('"asset":{', `"asset":{"extras":${'['.repeat(depth)}${']'.repeat(depth)},`);
const check = () => request(t.app).post(`/api/v1/profiles/${s.profiles.Wicket.id}/check`).set('Authorization', `Bearer ${secret}`);

/** Takes a character a test stored back out again, so the team stays within its plan's character limit. */
async function discard(res: { status: number; body: { character?: { id: number; sha256: string } } }): Promise<void> {
  if (res.status !== 201 || !res.body.character) return;
  await t.db('characters').where({ id: res.body.character.id }).delete();
  fs.rmSync(characterFilePath(t.dataDir, res.body.character.sha256), { force: true });
}

async function stillServing(): Promise<void> {
  expect((await request(t.app).get('/api/health')).status).toBe(200);
}

describe('1. deeply nested JSON never reaches a recursive parser', () => {
  it('refuses a GLB nesting arrays 30,000 deep in asset.extras, naming the problem, and keeps serving', async () => {
    const before = await footprint(t.db, t.dataDir);
    const res = await upload(designer, [file('deep.glb', editedGlb(deepExtras(30_000)))]);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('json_too_deep');
    expect(res.body.error.message).toMatch(/more than 64 levels deep/);
    expect(res.body.error.fields.file).toBe(res.body.error.message);
    expect(await footprint(t.db, t.dataDir)).toEqual(before);
    await stillServing();
  });

  it('refuses the same nesting in a .gltf', async () => {
    const { gltf } = await wicketAsGltf(true);
    const res = await upload(designer, [file('deep.gltf', deepExtras(30_000)(gltf))]);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('json_too_deep');
    await stillServing();
  });

  it('refuses it on the token route POST /api/v1/profiles/:id/check too', async () => {
    const res = await check().attach('file', Buffer.from(editedGlb(deepExtras(30_000))), 'deep.glb');
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('json_too_deep');
    await stillServing();
  });

  it('takes a file whose strings are full of brackets and escaped quotes (only structure counts)', async () => {
    const tricky = '[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[\\"{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{{\\\\';
    const res = await upload(designer, [file('tricky.glb', editedGlb((json) => json.replace('"asset":{', `"asset":{"extras":{"note":"${tricky}"},`)))], 'Wicket with a tricky note');
    expect(res.status).toBe(201);
    await discard(res);
  });

  it('measures nesting exactly as JSON.parse reads it, for seeded random documents (RFC 8259 grammar)', () => {
    // Reference: the depth of the value JSON.parse builds, walked with an explicit stack.
    const depthOf = (value: unknown): number => {
      let deepest = 0;
      const stack: [unknown, number][] = [[value, 0]];
      while (stack.length) {
        const [v, d] = stack.pop()!;
        if (v && typeof v === 'object') {
          deepest = Math.max(deepest, d + 1);
          for (const child of Object.values(v)) stack.push([child, d + 1]);
        }
      }
      return deepest;
    };
    const rng = mulberry32(20261201);
    const pieces = ['"', '\\"', '[', ']', '{', '}', ',', ':', '\\\\', 'é', '😀'];
    const randomString = (r: Rng) => Array.from({ length: r.int(6) }, () => pieces[r.int(pieces.length)]).join('');
    const randomValue = (r: Rng, depth: number): unknown => {
      const roll = r.int(depth > 12 ? 3 : 6);
      if (roll === 0) return r.range(-1e6, 1e6);
      if (roll === 1) return randomString(r);
      if (roll === 2) return null;
      if (roll === 3) return Array.from({ length: r.int(4) }, () => randomValue(r, depth + 1));
      return Object.fromEntries(Array.from({ length: r.int(4) }, () => [randomString(r), randomValue(r, depth + 1)]));
    };
    for (let i = 0; i < 300; i++) {
      const text = JSON.stringify(randomValue(rng, 0));
      const bytes = Buffer.from(text, 'utf8');
      const depth = depthOf(JSON.parse(text));
      expect(() => scanJsonBounds(bytes, 'doc', { ...DEFAULT_JSON_BOUNDS, maxDepth: depth })).not.toThrow();
      if (depth > 0) expect(() => scanJsonBounds(bytes, 'doc', { ...DEFAULT_JSON_BOUNDS, maxDepth: depth - 1 })).toThrow(/levels deep/);
    }
  });

  it('reads uploads where a failure cannot end the server: with the bound lifted, the reader thread overflows and the server answers 4xx', async () => {
    // An operator setting that lifts the scan's bound lets the 30,000-deep file reach the validator, whose
    // recursion overflows the reader thread's stack. On the request thread this ended the whole process.
    const { gltf } = await wicketAsGltf(true);
    process.env.TREADLE_IMPORT_JSON_DEPTH = '1000000';
    let res;
    try {
      res = await upload(designer, [file('deep.gltf', deepExtras(30_000)(gltf))]);
    } finally {
      delete process.env.TREADLE_IMPORT_JSON_DEPTH;
    }
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unreadable');
    expect(res.body.error.message).toMatch(/deep\.gltf/);
    await stillServing();
    const after = await upload(designer, [file('wicket-again.glb', await glbOf({ ...wicket, parts: wicket.parts.slice(2) }))], 'Wicket after the overflow');
    expect(after.status).toBe(201);
    await discard(after);
  });

  it('holds the reader threads to their memory limit: a thread that runs out ends alone and the upload gets a 422', async () => {
    await closeImportPool();
    process.env.TREADLE_IMPORT_HEAP_MB = '12';
    let res;
    try {
      res = await upload(designer, [file('wicket-small-heap.glb', wicketGlb)]);
    } finally {
      delete process.env.TREADLE_IMPORT_HEAP_MB;
      await closeImportPool();
    }
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unreadable');
    expect(res.body.error.message).toMatch(/needed more memory than Treadle gives one upload/);
    await stillServing();
  });
});

/** Signs in with fetch and returns the session cookie, for requests written by hand. */
async function sessionCookie(email: string): Promise<string> {
  const res = await fetch(`${t.url}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
  expect(res.status).toBeLessThan(300);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

/**
 * Sends multipart parts of `partBytes` each, stopping (without ending the request) once `stopAfter` bytes are out,
 * and resolves with the server's answer. An answer can then only come from a server that refused while streaming.
 */
function streamUpload(route: string, headers: Record<string, string>, partBytes: number, parts: number, stopAfter: number): Promise<{ status: number; body: any; sent: number }> {
  const boundary = 'treadle-hardening-boundary';
  return new Promise((resolve, reject) => {
    let sent = 0;
    const req = http.request(`${t.url}${route}`, { method: 'POST', headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, ...headers } });
    req.on('error', () => undefined); // the socket may close after the answer; the answer is what counts
    req.on('response', (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        req.destroy();
        const text = Buffer.concat(chunks).toString('utf8');
        try {
          resolve({ status: res.statusCode ?? 0, body: JSON.parse(text), sent });
        } catch (err) {
          reject(err);
        }
      });
    });
    const part = Buffer.alloc(partBytes, 0x41);
    const write = (i: number) => {
      if (i >= parts || sent >= stopAfter) return; // hold the request open
      const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="part-${i}.bin"\r\nContent-Type: application/octet-stream\r\n\r\n`);
      const ok = req.write(Buffer.concat([head, part, Buffer.from('\r\n')]));
      sent += head.length + part.length + 2;
      if (ok) setImmediate(() => write(i + 1));
      else req.once('drain', () => write(i + 1));
    };
    if (headers['content-length']) {
      req.write(`--${boundary}\r\n`);
      return;
    }
    write(0);
  });
}

describe('2. every upload request is capped as a whole while it streams', () => {
  it('answers 20 files of 0.95 × the cap with 413 after the third, while the rest is still unsent', async () => {
    const cookie = await sessionCookie('designer@brassmoth.test');
    const before = await footprint(t.db, t.dataDir);
    const res = await streamUpload('/api/characters', { cookie }, Math.floor(0.95 * CAP), 20, 3 * CAP);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect(res.body.error.message).toMatch(new RegExp(`${CAP_MB} MB, the limit for all files of one upload together`));
    // Refused with a little over three files sent: the other seventeen were never held.
    expect(res.sent).toBeLessThan(4 * CAP);
    expect(await footprint(t.db, t.dataDir)).toEqual(before);
    await stillServing();
  });

  it('caps the token route the same way', async () => {
    const res = await streamUpload(`/api/v1/profiles/${s.profiles.Wicket.id}/check`, { authorization: `Bearer ${secret}` }, Math.floor(0.95 * CAP), 20, 3 * CAP);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    await stillServing();
  });

  it('answers a request that declares more than the cap before reading its body', async () => {
    const cookie = await sessionCookie('designer@brassmoth.test');
    const res = await streamUpload('/api/characters', { cookie, 'content-length': String(20 * 49 * 1024 * 1024) }, 0, 0, 0);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('refuses too many files, too many fields and an overlong field, each with a message', async () => {
    let req = designer.post('/api/characters');
    for (let i = 0; i < 33; i++) req = req.attach('file', Buffer.alloc(8), `part-${i}.bin`);
    const files = await req;
    expect(files.status).toBe(400);
    expect(files.body.error.code).toBe('too_many_files');
    expect(files.body.error.message).toMatch(/at most 32 files/);

    let many = designer.post('/api/characters');
    for (let i = 0; i < 6; i++) many = many.field(`f${i}`, 'x');
    const fields = await many.attach('file', Buffer.from(wicketGlb), 'wicket.glb');
    expect(fields.status).toBe(400);
    expect(fields.body.error.message).toMatch(/more form fields/);

    const long = await designer.post('/api/characters').field('name', 'n'.repeat(2000)).attach('file', Buffer.from(wicketGlb), 'wicket.glb');
    expect(long.status).toBe(400);
    expect(long.body.error.fields).toHaveProperty('name');
  });
});

describe('3. a committed character always has its file', () => {
  it('puts a lost file back when the same bytes are uploaded again', async () => {
    const glb = await glbOf({ ...wicket, name: 'Wicket lost', parts: wicket.parts.slice(1) });
    const first = await upload(designer, [file('wicket-lost.glb', glb)]);
    expect(first.status).toBe(201);
    const stored = characterFilePath(t.dataDir, first.body.character.sha256);
    fs.rmSync(stored);
    expect((await designer.get(`/api/characters/${first.body.character.id}/file`)).status).toBe(410);
    const again = await upload(designer, [file('wicket-lost.glb', glb)]);
    expect(again.status).toBe(200);
    expect(again.body.existing).toBe(true);
    const served = await designer.get(`/api/characters/${first.body.character.id}/file`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(served.status).toBe(200);
    expect(Buffer.compare(served.body as Buffer, Buffer.from(glb))).toBe(0);
    await discard(first);
  });

  it('leaves no file when the row is refused, but keeps one another team\'s character uses', async () => {
    const glb = await glbOf({ ...wicket, name: 'Wicket refused', parts: wicket.parts.slice(3) });
    await t.db.raw("CREATE TRIGGER refuse_characters BEFORE INSERT ON characters BEGIN SELECT RAISE(ABORT, 'refused by the test'); END");
    try {
      const before = await footprint(t.db, t.dataDir);
      const refused = await upload(designer, [file('wicket-refused.glb', glb)]);
      expect(refused.status).toBe(500);
      expect(await footprint(t.db, t.dataDir)).toEqual(before);
    } finally {
      await t.db.raw('DROP TRIGGER refuse_characters');
    }
    // The demo team's Wicket file: another team's refused insert of the same bytes must not take it away.
    const demo = await t.db('characters').where({ team_id: s.teamId, name: 'Wicket' }).first('sha256', 'uploaded_by');
    const [otherTeam] = await t.db('teams').insert({ name: 'Other studio', created_at: t.clock.now() });
    await t.db.raw("CREATE TRIGGER refuse_characters BEFORE INSERT ON characters BEGIN SELECT RAISE(ABORT, 'refused by the test'); END");
    try {
      const store = { db: t.db, dataDir: t.dataDir, now: () => t.clock.now() };
      // better-sqlite3's SqliteError comes from outside jest's realm, so its message is compared rather than its class.
      const refusal = await storeCharacterUpload(store, { teamId: otherTeam, userId: demo.uploaded_by, files: [file('wicket.glb', wicketGlb)] }).then(
        () => 'stored',
        (err: { message?: string }) => err.message,
      );
      expect(refusal).toMatch(/refused by the test/);
    } finally {
      await t.db.raw('DROP TRIGGER refuse_characters');
    }
    expect(fs.existsSync(characterFilePath(t.dataDir, demo.sha256))).toBe(true);
  });

  it('clears temporary files of interrupted uploads when the server starts, and keeps the stored ones', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-start-'));
    const files = path.join(dir, 'files', 'characters');
    fs.mkdirSync(files, { recursive: true });
    const kept = `${'a'.repeat(64)}.glb`;
    for (const name of ['.incoming-1.glb', '.incoming-2.glb', kept]) fs.writeFileSync(path.join(files, name), 'x');
    const running = await startWithLocalPayments(
      { port: 0, host: '127.0.0.1', databaseFile: path.join(dir, 'db.sqlite'), dataDir: path.join(dir, 'files'), webDir: path.join(dir, 'no-web'), sessionSecret: 's', secureCookies: false, inboxPort: 0 } as Parameters<typeof startWithLocalPayments>[0],
      { mailer: { send: async () => undefined } as never },
    );
    try {
      expect(fs.readdirSync(files)).toEqual([kept]);
    } finally {
      await running.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('4. object counts no game character reaches are refused before the heavy read', () => {
  const nodesGlb = (count: number) =>
    editedGlb((json) => {
      const doc = JSON.parse(json);
      doc.nodes.push(...Array.from({ length: count - doc.nodes.length }, () => ({})));
      return JSON.stringify(doc);
    });

  it('refuses 10,001 nodes, saying no character has that many', async () => {
    const res = await upload(designer, [file('nodes.glb', nodesGlb(MAX_OBJECTS.nodes + 1))]);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('too_many_objects');
    expect(res.body.error.message).toMatch(/10,001 nodes; Treadle accepts at most 10,000, far more than any game character has/);
  });

  it('does not refuse 10,000 nodes for their count', async () => {
    const res = await upload(designer, [file('nodes.glb', nodesGlb(MAX_OBJECTS.nodes))], 'Wicket with many helpers');
    expect(res.body.error?.code).not.toBe('too_many_objects');
    await discard(res);
  });

  it('refuses 300,000 empty nodes and keeps answering meanwhile', async () => {
    const text = JSON.stringify({ asset: { version: '2.0' }, nodes: Array.from({ length: 300_000 }, () => ({})) });
    const res = await upload(designer, [file('empty-nodes.gltf', text)]);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('too_many_objects');
    await stillServing();
  });

  it.each([
    ['accessors', MAX_OBJECTS.accessors + 1, { componentType: 5126, type: 'SCALAR', count: 1 }],
    ['meshes', MAX_OBJECTS.meshes + 1, { primitives: [] }],
    ['skins', MAX_OBJECTS.skins + 1, { joints: [0] }],
  ] as const)('refuses %s past the cap', async (key, count, item) => {
    const res = await upload(designer, [file(`${key}.gltf`, JSON.stringify({ asset: { version: '2.0' }, nodes: [{}], [key]: Array.from({ length: count }, () => item) }))]);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('too_many_objects');
    expect(res.body.error.message).toContain(`${count.toLocaleString('en')} ${key}`);
  });
});

describe('9. the smaller upload findings', () => {
  it('answers a path that is not valid percent-encoding with 400', async () => {
    const res = await designer.get('/api/characters/%ZZ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_path');
  });

  it('refuses a GLB whose nodes is an object with 422 and the property named', async () => {
    const res = await upload(designer, [file('nodes-object.glb', editedGlb((json) => {
      const doc = JSON.parse(json);
      doc.nodes = Object.fromEntries(doc.nodes.map((n: { name: string }) => [n.name, n]));
      return JSON.stringify(doc);
    }))]);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('bad_structure');
    expect(res.body.error.message).toMatch(/"nodes" must be an array of objects/);
  });

  it('keeps a Unicode file name as it was sent (UTF-8, RFC 3629), not decoded as latin1', async () => {
    const name = 'Füße-ヒーロー-😀.glb';
    const res = await upload(designer, [file(name, await glbOf({ ...wicket, parts: wicket.parts.slice(4) }))]);
    expect(res.status).toBe(201);
    expect(res.body.character.fileName).toBe(name);
    expect(res.body.character.name).toBe('Füße-ヒーロー-😀');
    await discard(res);
  });

  it('keeps a hostile file name as text only: its folders dropped, never used as a path', async () => {
    const name = `../../../etc/${'😀'.repeat(59)}<script>.glb`;
    const res = await upload(designer, [file(name, await glbOf({ ...wicket, parts: wicket.parts.slice(5) }))]);
    expect(res.status).toBe(201);
    // busboy keeps only the last path segment of a part's filename (its preservePath option is off).
    expect(res.body.character.fileName).toBe(`${'😀'.repeat(59)}<script>.glb`);
    // The default name drops the folders and stops at 60 characters, never inside an emoji's surrogate pair.
    expect(res.body.character.name).toBe(`${'😀'.repeat(59)}<`);
    expect(fs.readdirSync(path.join(t.dataDir, 'characters'))).toContain(`${res.body.character.sha256}.glb`);
    expect(fs.existsSync(path.join(t.dataDir, '..', 'etc'))).toBe(false);
    await discard(res);
  });
});
