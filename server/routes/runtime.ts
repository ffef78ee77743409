/**
 * The game runtime package for download, and the sample game that proves it is enough:
 *   GET /api/runtime                      what the package is: version, schema, file name and where to get it
 *   GET /api/runtime/treadle-runtime-x.y.z.tgz   the `npm pack` tarball
 *   GET /api/runtime/sample/:profileId    the sample game over that profile's character and the studio's courses
 * Public, like the treadle command: the package holds no secret (the sample page fetches the profile with the
 * reader's own session). The package is built on the first request (packages/runtime/build.ts in a child process,
 * about 15 s, off the request thread) and kept for the server's life.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { HttpError } from '../errors';
import { declareRoutes, idOf, permission } from './declare';
import { PROFILE_SCHEMA, RUNTIME_TARBALL, RUNTIME_VERSION } from '../../packages/runtime/src/version';

const REPO = path.join(__dirname, '..', '..');
const BUILD_SCRIPT = path.join(REPO, 'packages', 'runtime', 'build.ts');
const SAMPLE_DIR = path.join(REPO, 'packages', 'runtime', 'sample');
export const RUNTIME_URL = `/api/runtime/${RUNTIME_TARBALL}`;

interface Built {
  tarball: string;
  sampleBundle: string;
}

function buildOnce(): Promise<Built> {
  const out = fs.mkdtempSync(path.join(os.tmpdir(), `treadle-runtime-${RUNTIME_VERSION}-`));
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', BUILD_SCRIPT, '--out', out], { cwd: REPO, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('error', reject);
    child.on('close', (code) => {
      const last = stdout.trim().split('\n').pop() ?? '';
      if (code !== 0) return reject(new Error(`building the runtime package failed: ${(stderr || stdout).trim().slice(-500)}`));
      try {
        resolve(JSON.parse(last) as Built);
      } catch {
        reject(new Error(`building the runtime package said: ${last.slice(0, 200)}`));
      }
    });
  });
}

let built: Promise<Built> | undefined;
/** The package, built once per server (a failed build is tried again at the next request). */
export function runtimePackage(): Promise<Built> {
  built ??= buildOnce().catch((err: unknown) => {
    built = undefined;
    throw err;
  });
  return built;
}

const unavailable = (err: unknown) => new HttpError(503, 'runtime_unavailable', `The runtime package could not be built just now (${(err as Error).message}). Try again in a minute.`);

const samplePage = (profileId: number) => `<!doctype html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <meta name="viewport" content="width=device-width, initial-scale=1">
  <title>Sample game · treadle-runtime ${RUNTIME_VERSION}</title>
  <link rel="stylesheet" href="/api/runtime/sample/sample.css">
</head>
<body data-profile-id="${profileId}">
  <canvas id="view"></canvas>
  <div id="hud"><p id="status">Starting…</p><p id="stumbles"></p><p class="keys">W or ↑ walks · A D or ← → turn · or use the stick · <a href="${RUNTIME_URL}">treadle-runtime ${RUNTIME_VERSION}</a></p></div>
  <div id="stick" role="slider" aria-label="Walk stick: push up to walk, left or right to turn" aria-valuenow="0"><div></div></div>
  <script type="module" src="/api/runtime/sample/game.js"></script>
</body>
</html>
`;

/** Public, like the treadle command: the package holds no secret. */
const DOWNLOAD = permission('runtime.download', 'Download the game runtime package', 'public');

export function runtimeRoutes() {
  const routes = declareRoutes('/runtime');
  routes.id('profileId', 'That leg profile');
  routes.get('/', DOWNLOAD, (_req, res) => {
    res.json({ name: 'treadle-runtime', version: RUNTIME_VERSION, schema: PROFILE_SCHEMA, file: RUNTIME_TARBALL, url: RUNTIME_URL });
  });
  routes.get('/sample/game.js', DOWNLOAD, async (_req, res) => {
    const b = await runtimePackage().catch((err: unknown) => {
      throw unavailable(err);
    });
    res.type('text/javascript').sendFile(b.sampleBundle);
  });
  routes.get('/sample/sample.css', DOWNLOAD, (_req, res) => {
    res.type('text/css').sendFile(path.join(SAMPLE_DIR, 'sample.css'));
  });
  routes.get('/sample/:profileId', DOWNLOAD, (req, res) => {
    res.type('html').send(samplePage(idOf(req, 'profileId')));
  });
  routes.get('/:file', DOWNLOAD, async (req, res) => {
    if (req.params.file !== RUNTIME_TARBALL) {
      throw new HttpError(404, 'not_found', `There is no ${req.params.file}: the runtime package here is ${RUNTIME_TARBALL} (GET ${RUNTIME_URL}).`);
    }
    const b = await runtimePackage().catch((err: unknown) => {
      throw unavailable(err);
    });
    res.type('application/gzip').set('Content-Disposition', `attachment; filename="${RUNTIME_TARBALL}"`).sendFile(b.tarball);
  });
  return routes;
}
