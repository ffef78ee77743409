/**
 * GET /api/runtime…: the runtime package as the Profiles screen links it, built on the first request and then
 * served as it is; the sample game page for a profile; clear refusals for anything else.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gunzipSync } from 'node:zlib';
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { RUNTIME_TARBALL, RUNTIME_VERSION } from '../../packages/runtime/src/version';

jest.setTimeout(180_000);

let t: TestApp;
beforeAll(async () => {
  t = await testApp();
});
afterAll(async () => {
  await t.cleanup();
});

/** supertest's parser for a binary body: the raw bytes (its response is a Node stream at this point). */
const binary = (res: request.Response, done: (err: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('the runtime routes', () => {
  it('say what the package is, signed out too', async () => {
    const res = await request(t.app).get('/api/runtime').expect(200);
    expect(res.body).toEqual({ name: 'treadle-runtime', version: RUNTIME_VERSION, schema: 'urn:treadle:schema:leg-profile:1', file: RUNTIME_TARBALL, url: `/api/runtime/${RUNTIME_TARBALL}` });
  });

  it('serve the npm tarball as a download, the same bytes twice', async () => {
    const first = await request(t.app).get(`/api/runtime/${RUNTIME_TARBALL}`).buffer(true).parse(binary).expect(200);
    expect(first.headers['content-disposition']).toBe(`attachment; filename="${RUNTIME_TARBALL}"`);
    const body = first.body as Buffer;
    // gzip (RFC 1952 §2.3.1) around a POSIX ustar archive ("ustar" at offset 257 of the first header, POSIX.1-1988).
    expect([body[0], body[1]]).toEqual([0x1f, 0x8b]);
    const tar = gunzipSync(body);
    expect(tar.subarray(257, 262).toString('latin1')).toBe('ustar');
    expect(tar.subarray(0, 100).toString('latin1').replace(/\0+$/, '')).toMatch(/^package\//);
    const again = await request(t.app).get(`/api/runtime/${RUNTIME_TARBALL}`).buffer(true).parse(binary).expect(200);
    expect(Buffer.compare(again.body as Buffer, body)).toBe(0);

    // The downloaded file is the package a programmer installs: into an empty folder, offline, and its example runs.
    const game = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-download-'));
    try {
      fs.writeFileSync(path.join(game, RUNTIME_TARBALL), body);
      fs.writeFileSync(path.join(game, 'package.json'), '{ "name": "downloaded", "private": true }\n');
      const env = { PATH: process.env.PATH ?? '', HOME: game, npm_config_offline: 'true', npm_config_cache: path.join(game, '.npm'), npm_config_audit: 'false', npm_config_fund: 'false', npm_config_update_notifier: 'false' } as unknown as NodeJS.ProcessEnv;
      expect(spawnSync('npm', ['install', '--offline', `./${RUNTIME_TARBALL}`], { cwd: game, env, encoding: 'utf8' }).status).toBe(0);
      const run = spawnSync(process.execPath, ['node_modules/treadle-runtime/example.mjs'], { cwd: game, env, encoding: 'utf8' });
      expect(run.stderr).toBe('');
      expect(run.stdout).toContain(`treadle-runtime ${RUNTIME_VERSION}: Wicket v1`);
    } finally {
      fs.rmSync(game, { recursive: true, force: true });
    }
  });

  it('refuse another file name, naming the package that is here', async () => {
    const res = await request(t.app).get('/api/runtime/treadle-runtime-0.9.0.tgz').expect(404);
    expect(res.body.error.message).toContain(RUNTIME_TARBALL);
  });

  it('serve the sample game for a profile, and its script with three bundled', async () => {
    const page = await request(t.app).get('/api/runtime/sample/3').expect(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    expect(page.text).toContain('data-profile-id="3"');
    expect(page.text).toContain('<script type="module" src="/api/runtime/sample/game.js"></script>');
    // The page's own security policy allows scripts from the server only: no inline script in it.
    expect(page.text).not.toMatch(/<script(?![^>]*\bsrc=)[^>]*>/);
    const script = await request(t.app).get('/api/runtime/sample/game.js').expect(200);
    expect(script.headers['content-type']).toMatch(/javascript/);
    expect(script.text).toContain('GLTFLoader');
    await request(t.app).get('/api/runtime/sample/sample.css').expect(200).expect('content-type', /css/);
  });

  it('refuse a sample page for something that is not a profile id', async () => {
    for (const bad of ['abc', '0', '-1', '1.5']) await request(t.app).get(`/api/runtime/sample/${bad}`).expect(404);
  });
});
