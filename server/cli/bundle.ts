/**
 * The `treadle` command as one file a game's repository can run with plain Node (20 or newer), with no
 * dependencies and no Treadle checkout: esbuild (installed with tsx) bundles server/cli/treadle.ts into an ES
 * module. `npm run build:cli` writes it to dist-cli/treadle.mjs; GET /api/cli/treadle.mjs serves the same bytes.
 *
 *   curl -fsSo treadle.mjs "$TREADLE_URL/api/cli/treadle.mjs"
 *   node treadle.mjs check --profile 3 --file build/wicket.glb
 */
import fs from 'node:fs';
import path from 'node:path';
import { build } from 'esbuild';
import { packageVersion } from '../config';

export const CLI_FILE_NAME = 'treadle.mjs';
export const CLI_OUT_FILE = path.join(__dirname, '..', '..', 'dist-cli', CLI_FILE_NAME);

const ENTRY = `import { main } from './treadle';
main(process.argv.slice(2)).then((code) => process.exit(code));
`;

/** The bundled command's text. */
export async function bundleTreadleCli(): Promise<string> {
  const result = await build({
    stdin: { contents: ENTRY, resolveDir: __dirname, sourcefile: 'treadle-entry.ts', loader: 'ts' },
    bundle: true,
    write: false,
    platform: 'node',
    target: 'node20',
    format: 'esm',
    legalComments: 'none',
    logLevel: 'silent',
    banner: { js: `#!/usr/bin/env node\n// treadle ${packageVersion()}: pull leg profiles and check builds against them. node treadle.mjs --help` },
  });
  return result.outputFiles[0].text;
}

let cached: Promise<string> | undefined;

/** Built once per server start (a fraction of a second) and then served from memory. */
export function treadleCliText(): Promise<string> {
  cached ??= bundleTreadleCli().catch((err: unknown) => {
    cached = undefined;
    throw err;
  });
  return cached;
}

if (require.main === module) {
  bundleTreadleCli().then((text) => {
    fs.mkdirSync(path.dirname(CLI_OUT_FILE), { recursive: true });
    fs.writeFileSync(CLI_OUT_FILE, text, { mode: 0o755 });
    console.log(`wrote ${path.relative(process.cwd(), CLI_OUT_FILE)} (${(text.length / 1024).toFixed(1)} KiB, no dependencies)`);
  });
}
