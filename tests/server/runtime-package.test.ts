/**
 * treadle-runtime as a programmer meets it: built and packed by its script, installed with npm from the file
 * alone into an empty folder that cannot see this repository's node_modules, then imported and run by plain
 * Node, and type-checked by a TypeScript consumer with no other package.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { LEG_PROFILE_SCHEMA_ID } from '../../engine/profile/schema';
import { RUNTIME_TARBALL, RUNTIME_VERSION } from '../../packages/runtime/src/version';

jest.setTimeout(240_000);

const REPO = path.join(__dirname, '..', '..');
const TSC = path.join(REPO, 'node_modules', 'typescript', 'bin', 'tsc');
/** An environment that points nothing at the repository (no NODE_PATH, npm offline, no cache writes elsewhere). */
const cleanEnv = (home: string) => ({ PATH: process.env.PATH ?? '', HOME: home, npm_config_offline: 'true', npm_config_update_notifier: 'false', npm_config_fund: 'false', npm_config_audit: 'false', npm_config_cache: path.join(home, '.npm') }) as unknown as NodeJS.ProcessEnv;

let out: string;
let game: string;

beforeAll(() => {
  out = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-rt-build-'));
  game = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-rt-game-'));
  execFileSync(process.execPath, ['--import', 'tsx', path.join(REPO, 'packages', 'runtime', 'build.ts'), '--out', out], { cwd: REPO, stdio: 'pipe' });
});
afterAll(() => {
  fs.rmSync(out, { recursive: true, force: true });
  fs.rmSync(game, { recursive: true, force: true });
});

describe('the version', () => {
  it('has the leg-profile schema version as its major, in the source package.json too', () => {
    // Semantic Versioning 2.0.0 §8: the major changes when what the package accepts changes; here, the schema it reads.
    const schemaVersion = Number(/:(\d+)$/.exec(LEG_PROFILE_SCHEMA_ID)![1]);
    const source = JSON.parse(fs.readFileSync(path.join(REPO, 'packages', 'runtime', 'package.json'), 'utf8'));
    expect(source.version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(Number(source.version.split('.')[0])).toBe(schemaVersion);
    expect(source.version).toBe(RUNTIME_VERSION);
    expect(RUNTIME_TARBALL).toBe(`treadle-runtime-${source.version}.tgz`);
  });
});

describe('the packed tarball', () => {
  it('is what npm pack writes, an ES module with declarations and no dependencies', () => {
    const file = path.join(out, RUNTIME_TARBALL);
    expect(fs.existsSync(file)).toBe(true);
    // npm pack's tarballs are gzip (RFC 1952 §2.3.1: ID1 = 0x1f, ID2 = 0x8b) with the files under package/.
    const bytes = fs.readFileSync(file);
    expect([bytes[0], bytes[1]]).toEqual([0x1f, 0x8b]);
    const listing = execFileSync('tar', ['-tzf', file], { encoding: 'utf8' }).split('\n').filter(Boolean);
    expect(listing).toEqual(expect.arrayContaining(['package/package.json', 'package/index.js', 'package/index.d.ts', 'package/types.d.ts', 'package/version.d.ts', 'package/README.md', 'package/example.mjs', 'package/sample/game.js', 'package/sample/wicket.glb']));
    const manifest = JSON.parse(execFileSync('tar', ['-xzOf', file, 'package/package.json'], { encoding: 'utf8' }));
    expect(manifest).toMatchObject({ name: 'treadle-runtime', version: RUNTIME_VERSION, type: 'module', exports: { '.': { types: './index.d.ts', import: './index.js' } } });
    expect(manifest.dependencies ?? {}).toEqual({});
    expect(manifest.peerDependencies ?? {}).toEqual({});
    // Declarations that name only the package's own files: a game type-checks with nothing else installed.
    for (const d of ['index.d.ts', 'types.d.ts', 'version.d.ts']) {
      const text = execFileSync('tar', ['-xzOf', file, `package/${d}`], { encoding: 'utf8' });
      for (const m of text.matchAll(/from\s+['"]([^'"]+)['"]/g)) expect(m[1]).toMatch(/^\.\/(index|types|version)\.js$/);
    }
  });

  it('installs offline into an empty folder and its example runs under Node with no other package', () => {
    // Nothing above the folder may hold a node_modules that Node's resolution would find (Node.js docs, "Loading from node_modules folders").
    for (let dir = path.dirname(game); ; dir = path.dirname(dir)) {
      expect(fs.existsSync(path.join(dir, 'node_modules'))).toBe(false);
      if (path.dirname(dir) === dir) break;
    }
    fs.copyFileSync(path.join(out, RUNTIME_TARBALL), path.join(game, RUNTIME_TARBALL));
    fs.writeFileSync(path.join(game, 'package.json'), '{ "name": "a-game", "private": true }\n');
    const env = cleanEnv(game);
    const install = spawnSync('npm', ['install', '--offline', `./${RUNTIME_TARBALL}`], { cwd: game, env, encoding: 'utf8' });
    expect(install.stderr).not.toMatch(/ERR!/);
    expect(install.status).toBe(0);
    expect(fs.readdirSync(path.join(game, 'node_modules')).filter((n) => !n.startsWith('.'))).toEqual(['treadle-runtime']);

    const run = spawnSync(process.execPath, ['node_modules/treadle-runtime/example.mjs'], { cwd: game, env, encoding: 'utf8' });
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain(`treadle-runtime ${RUNTIME_VERSION}: Wicket v1`);
    // The body walked: 4 s at the example profile's speed leaves it metres along +Z, every figure a number.
    const z = Number(/body .* z (-?\d+\.\d+) m/.exec(run.stdout)![1]);
    expect(z).toBeGreaterThan(1);
    expect(run.stdout).not.toMatch(/NaN|Infinity/);
    expect(run.stdout.match(/(stance|swing) +x/g)).toHaveLength(2);
  });

  it('refuses a broken profile with errors a game can catch and read', () => {
    const script = `
      import { loadLegProfile, LegProfileError } from 'treadle-runtime';
      try { loadLegProfile('{"schema":"urn:treadle:schema:leg-profile:1","version":0}'); console.log('accepted'); }
      catch (err) { console.log(err instanceof LegProfileError, JSON.stringify(err.message)); }
      try { loadLegProfile('not json'); } catch (err) { console.log(err instanceof LegProfileError, JSON.stringify(err.message)); }
    `;
    const run = spawnSync(process.execPath, ['--input-type=module', '-e', script], { cwd: game, env: cleanEnv(game), encoding: 'utf8' });
    expect(run.stderr).toBe('');
    const [first, second] = run.stdout.trim().split('\n');
    expect(first).toMatch(/^true .*version/);
    expect(first).toMatch(/profileId/);
    expect(second).toMatch(/^true .*not JSON/);
  });

  it('type-checks a TypeScript game against its declarations alone', () => {
    fs.writeFileSync(
      path.join(game, 'game.ts'),
      `import { bindLegProfile, createLegRuntime, loadLegProfile, flatGround, skeletonFromGltf, type LegRuntime } from 'treadle-runtime';
declare const glb: Uint8Array;
const legs: LegRuntime = createLegRuntime(bindLegProfile(loadLegProfile('{}'), skeletonFromGltf(glb)), flatGround(20), { onError: (e) => console.log(e.message) });
legs.drive(0, 1, 0.5);
legs.update(1 / 60);
const z: number = legs.bodyPosition()[2];
const ground = createLegRuntime(bindLegProfile(loadLegProfile('{}'), skeletonFromGltf(glb)), (x, z2, normal) => (normal.fill(0), x * 0 + z2 * 0));
// @ts-expect-error drive takes numbers
legs.drive('fast');
export { z, ground };
`,
    );
    const compilerOptions = { noEmit: true, strict: true, module: 'nodenext', moduleResolution: 'nodenext', target: 'es2022', types: [] };
    fs.writeFileSync(path.join(game, 'tsconfig.json'), JSON.stringify({ compilerOptions, files: ['game.ts'] }));
    const tsc = spawnSync(process.execPath, [TSC, '-p', '.'], { cwd: game, env: cleanEnv(game), encoding: 'utf8' });
    expect(tsc.stdout + tsc.stderr).toBe('');
    expect(tsc.status).toBe(0);
  });
});
