/**
 * The `treadle` command as a game's repository gets it: downloaded from the API as one file, run with plain
 * Node from a folder with no node_modules, against the real server. The same setup must reproduce the published
 * figures (trials are deterministic), so the check passes and calls every metric unchanged, stating its tolerance.
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { demoStudio } from './profiles-helpers';

jest.setTimeout(120_000);

const run = promisify(execFile);
let t: TestApp;
let s: Awaited<ReturnType<typeof demoStudio>>;
let dir: string;
let env: NodeJS.ProcessEnv;

beforeAll(async () => {
  t = await testApp();
  s = await demoStudio(t);
  const secret = (await s.agents.programmer.post('/api/tokens').send({ name: 'game CI' })).body.secret;
  // A folder outside the repository: nothing to resolve imports from but Node itself.
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'game-repo-'));
  env = { NODE_ENV: 'test', PATH: process.env.PATH, TREADLE_URL: t.url, TREADLE_TOKEN: secret };
});
afterAll(async () => {
  fs.rmSync(dir, { recursive: true, force: true });
  await t.cleanup();
});

async function node(...args: string[]) {
  try {
    const { stdout, stderr } = await run(process.execPath, ['treadle.mjs', ...args], { cwd: dir, env });
    return { code: 0, stdout, stderr };
  } catch (err) {
    const e = err as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

describe('the downloadable treadle command', () => {
  it('is served without signing in as one ES module that imports only node: built-ins', async () => {
    const res = await request(t.app).get('/api/cli/treadle.mjs');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['content-disposition']).toMatch(/treadle\.mjs/);
    const imports = [...res.text.matchAll(/^import .* from "([^"]+)";$/gm)].map((m) => m[1]);
    expect(imports.length).toBeGreaterThan(0);
    expect(imports.filter((i) => !i.startsWith('node:'))).toEqual([]);
    fs.writeFileSync(path.join(dir, 'treadle.mjs'), res.text);
  });

  it('pulls a profile whose leg setup carries no float noise', async () => {
    const out = await node('pull', '--profile', String(s.profiles.Wicket.id), '--out', 'wicket.leg-profile.json');
    expect(out.stderr).toBe('');
    expect(out.code).toBe(0);
    const text = fs.readFileSync(path.join(dir, 'wicket.leg-profile.json'), 'utf8');
    const setup = JSON.stringify(JSON.parse(text).legSetup);
    // More than 6 decimals is noise by the schema's own statement (PROFILE_DECIMALS).
    expect(setup.match(/\d+\.\d{7,}/g)).toBeNull();
  });

  it('checks the stored character: passes, says "unchanged" and states its tolerance', async () => {
    const out = await node('check', '--profile', String(s.profiles.Wicket.id));
    expect(out.code).toBe(0);
    expect(out.stdout).toMatch(/Footing score .*= unchanged/);
    expect(out.stdout).not.toMatch(/better|worse/);
    expect(out.stdout).toMatch(/Tolerance: footing score ±0\.5 points/);
    expect(out.stdout).toMatch(/PASS/);
  });

  it('exits 2 with the usage when the token is missing', async () => {
    const saved = env;
    env = { NODE_ENV: 'test', PATH: process.env.PATH, TREADLE_URL: t.url };
    const out = await node('check', '--profile', '1');
    env = saved;
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/Give an API token/);
  });
});
