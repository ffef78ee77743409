/**
 * engine/ imports nothing outside engine/ (DEVELOPERS.md, ground rules: the engine is pure TypeScript
 * computation shared by the app, the server and the game runtime). Reads every engine file's imports with
 * the TypeScript compiler's own pre-processor (`ts.preProcessFile`, which lists `import`, `import type`,
 * `export … from`, `import()` and `require`), resolves the relative ones and fails naming each file and
 * specifier that leaves engine/ or names a package the engine may not use.
 */
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const ROOT = path.resolve(__dirname, '../..');
const ENGINE = path.join(ROOT, 'engine');
/** The only packages engine code may load: schemas, vector maths, seeded noise. */
const ALLOWED_PACKAGES = new Set(['zod', 'gl-matrix', 'simplex-noise']);

function engineFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return engineFiles(full);
    return /\.tsx?$/.test(entry.name) && !entry.name.endsWith('.d.ts') ? [full] : [];
  });
}

/** Every import of `source` (written as if it sat at `file`) that leaves engine/ or loads a package not allowed there. */
function importsLeavingEngine(file: string, source: string): string[] {
  const found = ts.preProcessFile(source, true, true).importedFiles.map((f) => f.fileName);
  return found.filter((spec) => {
    if (spec.startsWith('.')) {
      const target = path.resolve(path.dirname(file), spec);
      return path.relative(ENGINE, target).startsWith('..');
    }
    if (spec.startsWith('@/')) return !spec.startsWith('@/engine/');
    const pkg = spec.startsWith('@') ? spec.split('/').slice(0, 2).join('/') : spec.split('/')[0];
    return !ALLOWED_PACKAGES.has(pkg);
  });
}

describe('engine import graph', () => {
  const files = engineFiles(ENGINE);

  it('finds the engine files', () => {
    // A wrong root would make the next check pass over nothing.
    expect(files.length).toBeGreaterThan(50);
    expect(files).toContain(path.join(ENGINE, 'profile', 'runtime.ts'));
  });

  it('has no engine file importing from outside engine/', () => {
    const leaving = files.flatMap((file) =>
      importsLeavingEngine(file, fs.readFileSync(file, 'utf8')).map((spec) => `${path.relative(ROOT, file)} imports ${spec}`),
    );
    expect(leaving).toEqual([]);
  });

  it('catches each way out of engine/', () => {
    const file = path.join(ENGINE, 'profile', 'runtime.ts');
    const source = [
      "import type { LegMapping } from '../../schemas/characters';",
      "export { x } from '../../server/errors';",
      "import React from 'react';",
      "import fs from 'node:fs';",
      "const later = () => import('../../hooks/api');",
      "import { y } from '@/components/ui/Button';",
      "import { vec3 } from 'gl-matrix';",
      "import { solve } from '../ik/solve';",
      "import { z } from 'zod';",
    ].join('\n');
    expect(importsLeavingEngine(file, source)).toEqual([
      '../../schemas/characters',
      '../../server/errors',
      'react',
      'node:fs',
      '../../hooks/api',
      '@/components/ui/Button',
    ]);
  });
});
