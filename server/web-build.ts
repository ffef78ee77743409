import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { projectRoot } from './config';

const SOURCES = ['app', 'components', 'hooks', 'constants', 'schemas', 'engine', 'assets', 'fonts', 'app.json', 'babel.config.js', 'package.json'];

function newestMtime(entry: string): number {
  if (!fs.existsSync(entry)) return 0;
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const child of fs.readdirSync(entry)) newest = Math.max(newest, newestMtime(path.join(entry, child)));
  return newest;
}

export function webBuildIsStale(webDir: string): boolean {
  const index = path.join(webDir, 'index.html');
  if (!fs.existsSync(index)) return true;
  const built = fs.statSync(index).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(projectRoot, s)) > built);
}

/** Exports the web app into webDir when it is missing or older than its sources. */
export function ensureWebBuild(webDir: string, log: (line: string) => void = console.log): void {
  if (!webBuildIsStale(webDir)) return;
  log('Exporting the web app (the first time takes a couple of minutes)…');
  const result = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', webDir], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, CI: '1', EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1' },
  });
  if (result.status !== 0) throw new Error(`expo export failed with exit code ${result.status}.`);
}

if (require.main === module) ensureWebBuild(process.argv[2] ?? path.join(projectRoot, 'dist'));
