/**
 * Builds the treadle-runtime package and packs it with `npm pack`:
 *
 *   npm run build:runtime            # dist-runtime/package/ (the files) and dist-runtime/treadle-runtime-x.y.z.tgz
 *   npm run build:runtime -- --out DIR
 *
 * esbuild bundles src/index.ts with the engine code it reaches (and zod, gl-matrix) into one ES module, so the
 * package has no dependencies; TypeScript writes its declarations from src/'s own public types (types.ts), so
 * they stand alone too. The packed package.json adds `"type": "module"` (the sources here are TypeScript that the
 * repository's own tools load) and carries RUNTIME_VERSION (src/version.ts: the leg-profile schema
 * version is its major). It also bundles the sample game with three for Treadle to serve (sample.bundle.js).
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { build } from 'esbuild';
import ts from 'typescript';
import { exampleFiles } from './example-files';
import { PROFILE_SCHEMA_VERSION, RUNTIME_TARBALL, RUNTIME_VERSION } from './src/version';

export const RUNTIME_DIR = __dirname;
const REPO = path.join(__dirname, '..', '..');
export const DEFAULT_OUT = path.join(REPO, 'dist-runtime');
/** The declarations shipped: src/'s public files, nothing from the engine. */
const DECLARED = ['index', 'types', 'version'];
/** The served sample game's script, bundled with three and the packed runtime. */
export const SAMPLE_BUNDLE = 'sample.bundle.js';

export interface BuiltRuntime {
  tarball: string;
  packageDir: string;
  sampleBundle: string;
  version: string;
}

/** The source package.json, read as the packed one is written: its version must be RUNTIME_VERSION. */
export function sourcePackageJson(): { name: string; version: string; dependencies?: object; [k: string]: unknown } {
  return JSON.parse(fs.readFileSync(path.join(RUNTIME_DIR, 'package.json'), 'utf8'));
}

function declarations(): Map<string, string> {
  const options: ts.CompilerOptions = {
    declaration: true,
    emitDeclarationOnly: true,
    strict: true,
    skipLibCheck: true,
    target: ts.ScriptTarget.ES2022,
    module: ts.ModuleKind.ESNext,
    moduleResolution: ts.ModuleResolutionKind.Bundler,
    lib: ['lib.es2022.d.ts'],
    types: [],
    rootDir: REPO,
    outDir: '/declarations',
  };
  const program = ts.createProgram([path.join(RUNTIME_DIR, 'src', 'index.ts')], options);
  // The package's own files must type-check; the engine's are the repository's type check to hold (npm run typecheck).
  const ownDir = path.join(RUNTIME_DIR, 'src');
  const problems = ts.getPreEmitDiagnostics(program).filter((d) => d.category === ts.DiagnosticCategory.Error && (!d.file || d.file.fileName.startsWith(ownDir)));
  if (problems.length) throw new Error(`the runtime does not type-check:\n${ts.formatDiagnosticsWithColorAndContext(problems.slice(0, 10), { getCanonicalFileName: (f) => f, getCurrentDirectory: () => REPO, getNewLine: () => '\n' })}`);
  const out = new Map<string, string>();
  const srcOut = path.posix.join('/declarations', 'packages', 'runtime', 'src');
  program.emit(undefined, (file, text) => {
    const rel = path.posix.relative(srcOut, file);
    const name = rel.replace(/\.d\.ts$/, '');
    if (DECLARED.includes(name)) out.set(name, text);
  });
  for (const [name, text] of out) {
    for (const m of text.matchAll(/from\s+['"]([^'"]+)['"]/g)) {
      if (!DECLARED.map((d) => `./${d}`).includes(m[1])) throw new Error(`${name}.d.ts imports ${m[1]}: the public declarations may use only src/{${DECLARED.join(',')}}.ts`);
    }
    // ES module resolution (TypeScript's node16/nodenext, like Node itself) wants the file's extension written out.
    out.set(name, text.replace(/(from\s+['"]\.\/(?:[a-z]+))(['"])/g, '$1.js$2'));
  }
  if (out.size !== DECLARED.length) throw new Error(`declarations missing: wrote ${[...out.keys()].join(', ')}`);
  return out;
}

export async function buildRuntime(outDir = DEFAULT_OUT): Promise<BuiltRuntime> {
  const source = sourcePackageJson();
  if (source.version !== RUNTIME_VERSION) {
    throw new Error(`packages/runtime/package.json says version ${source.version}, but the leg-profile schema version ${PROFILE_SCHEMA_VERSION} makes it ${RUNTIME_VERSION} (src/version.ts): set them alike.`);
  }
  if (source.dependencies && Object.keys(source.dependencies).length) throw new Error('treadle-runtime must have no dependencies: the engine code it needs is bundled.');
  const packageDir = path.join(outDir, 'package');
  fs.rmSync(packageDir, { recursive: true, force: true });
  fs.mkdirSync(packageDir, { recursive: true });

  await build({
    entryPoints: [path.join(RUNTIME_DIR, 'src', 'index.ts')],
    outfile: path.join(packageDir, 'index.js'),
    bundle: true,
    format: 'esm',
    platform: 'neutral',
    mainFields: ['module', 'main'],
    target: 'es2020',
    minify: true,
    keepNames: true,
    legalComments: 'eof',
    logLevel: 'silent',
    banner: { js: `// treadle-runtime ${RUNTIME_VERSION}: reads leg profiles of schema version ${PROFILE_SCHEMA_VERSION}. Bundles zod and gl-matrix (MIT; notices at the end).` },
  });
  for (const [name, text] of declarations()) fs.writeFileSync(path.join(packageDir, `${name}.d.ts`), text);
  fs.copyFileSync(path.join(RUNTIME_DIR, 'README.md'), path.join(packageDir, 'README.md'));
  fs.copyFileSync(path.join(RUNTIME_DIR, 'example.mjs'), path.join(packageDir, 'example.mjs'));
  fs.cpSync(path.join(RUNTIME_DIR, 'sample'), path.join(packageDir, 'sample'), { recursive: true });
  for (const [name, bytes] of Object.entries(await exampleFiles())) fs.writeFileSync(path.join(packageDir, 'sample', name), bytes);
  fs.writeFileSync(path.join(packageDir, 'package.json'), `${JSON.stringify({ ...source, version: RUNTIME_VERSION, type: 'module' }, null, 2)}\n`);

  const packed = spawnSync('npm', ['pack', '--json', '--pack-destination', outDir], { cwd: packageDir, encoding: 'utf8', env: { ...process.env, npm_config_offline: 'true', npm_config_update_notifier: 'false', npm_config_fund: 'false' } });
  if (packed.status !== 0) throw new Error(`npm pack failed: ${packed.stderr || packed.stdout}`);
  const tarball = path.join(outDir, RUNTIME_TARBALL);
  if (!fs.existsSync(tarball)) throw new Error(`npm pack did not write ${RUNTIME_TARBALL}: ${packed.stdout}`);

  // The page Treadle serves: the sample game with three from Treadle's own node_modules and the runtime just packed.
  const sampleBundle = path.join(outDir, SAMPLE_BUNDLE);
  await build({
    entryPoints: [path.join(RUNTIME_DIR, 'sample', 'game.js')],
    outfile: sampleBundle,
    bundle: true,
    format: 'esm',
    platform: 'browser',
    target: 'es2020',
    minify: true,
    legalComments: 'eof',
    logLevel: 'silent',
    alias: { 'treadle-runtime': path.join(packageDir, 'index.js') },
    nodePaths: [path.join(REPO, 'node_modules')],
  });
  return { tarball, packageDir, sampleBundle, version: RUNTIME_VERSION };
}

if (require.main === module) {
  const at = process.argv.indexOf('--out');
  const out = at > 0 ? path.resolve(process.argv[at + 1]) : DEFAULT_OUT;
  buildRuntime(out).then(
    (b) => {
      // One JSON line last: the server reads it when it builds the package for download.
      console.log(`wrote ${path.relative(process.cwd(), b.tarball)} (${(fs.statSync(b.tarball).size / 1024).toFixed(1)} KiB) and ${path.relative(process.cwd(), b.sampleBundle)}`);
      console.log(JSON.stringify(b));
    },
    (err: Error) => {
      console.error(`build:runtime: ${err.message}`);
      process.exit(1);
    },
  );
}
