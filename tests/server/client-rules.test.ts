/**
 * The client's rules (DEVELOPERS.md, "Add a screen"), read from its source:
 * - it asks for permissions by the server's action names (`useCan('courses.edit')`) and holds no role list of its
 *   own: every `useCan('…')` in app/, components/ and hooks/ is checked against the permission table the real app
 *   serves, so a renamed or mistyped action fails here instead of hiding a button for everyone; `useCan` is the
 *   client's only permission check;
 * - screens own their queries: no component imports a query or mutation hook from hooks/.
 */
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';

const ROOT = path.resolve(__dirname, '..', '..');
const CLIENT_DIRS = ['app', 'components', 'hooks'];

function clientFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return clientFiles(full);
    return /\.(ts|tsx)$/.test(e.name) ? [full] : [];
  });
}

const sources = CLIENT_DIRS.flatMap((d) => clientFiles(path.join(ROOT, d))).map((file) => ({ file: path.relative(ROOT, file), text: fs.readFileSync(file, 'utf8') }));

let t: TestApp;
beforeAll(async () => {
  t = await testApp();
});
afterAll(() => t.cleanup());

describe('the client asks for permissions by the server table\'s names', () => {
  it('names only actions the served permission table lists', async () => {
    const home = await createStudio(t.db, 'names');
    const owner = await signedIn(t.app, home.members.owner.email);
    const table = await owner.get('/api/permissions').expect(200);
    const known = new Set((table.body.actions as { action: string }[]).map((a) => a.action));
    expect(known.size).toBeGreaterThan(10);

    const asked = new Map<string, string>();
    for (const { file, text } of sources) for (const m of text.matchAll(/useCan\(\s*'([^']+)'\s*\)/g)) asked.set(m[1], file);
    // The screens gate uploads, legs, leg setups, trials, dial-ins, courses, suites, profiles, tokens and the team.
    expect(asked.size).toBeGreaterThanOrEqual(10);
    const unknown = [...asked].filter(([action]) => !known.has(action)).map(([action, file]) => `${action} (${file})`);
    expect(unknown).toEqual([]);
  });

  it('a role the table refuses an action gets no such permission in its session', async () => {
    const home = await createStudio(t.db, 'session');
    const artLead = await signedIn(t.app, home.members.art_lead.email);
    const me = await artLead.get('/api/me').expect(200);
    // Art leads compare and read; they do not edit courses (the table: owners and designers).
    expect(me.body.permissions).toContain('compare.run');
    expect(me.body.permissions).not.toContain('courses.edit');
    const anonymous = await request(t.app).get('/api/me/session').expect(200);
    expect(anonymous.body).toEqual({ signedIn: false });
  });

  it('useCan is the only place the client reads the permission list', () => {
    const readers = sources.filter(({ text }) => /\.permissions\.includes\(/.test(text)).map(({ file }) => file);
    expect(readers).toEqual([path.join('hooks', 'useCan.ts')]);
  });
});

/** UI hooks a component may call: they hold no server data. */
const UI_HOOKS = new Set(['useIsWide', 'useSchemaForm']);

/** The hooks a source imports (as values, not types) from hooks/ that are not UI hooks. */
function dataHooksImported(text: string): string[] {
  const found: string[] = [];
  for (const m of text.matchAll(/^import\s+\{([^}]*)\}\s+from\s+'(?:\.\.\/)+hooks\/[^']+';/gm)) {
    const names = m[1].split(',').map((n) => n.trim()).filter((n) => n && !n.startsWith('type '));
    for (const n of names) if (/^use[A-Z]/.test(n) && !UI_HOOKS.has(n)) found.push(n);
  }
  return found;
}

describe('screens own their queries', () => {
  it('no component imports a data hook', () => {
    const offenders = sources
      .filter(({ file }) => file.startsWith('components'))
      .flatMap(({ file, text }) => dataHooksImported(text).map((n) => `${file}: ${n}`));
    expect(offenders).toEqual([]);
  });

  it('the check sees a data hook where one is imported, and lets UI hooks and types through', () => {
    expect(dataHooksImported("import { useCourses, useIsWide } from '../../hooks/useCourses';\nimport type { Mutation } from '../../hooks/mutation';")).toEqual(['useCourses']);
    expect(dataHooksImported("import { type TrialRunner } from '../../hooks/useTrialRunner';")).toEqual([]);
  });
});
