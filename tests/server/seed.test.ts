import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freshDatabase } from '../support/test-db';
import { seedDemoStudio, DEMO_USERS, DEMO_PASSWORD } from '../../seeds/demo-studio';
import { verifyCredentials } from '../../server/services/accounts';

// The seed imports the three demo characters through the real glTF pipeline.
jest.setTimeout(60_000);

describe('the demo seed', () => {
  it('creates one member per role and is idempotent', async () => {
    const { db, cleanup } = await freshDatabase();
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-seed-'));
    await seedDemoStudio(db, { now: 1, dataDir });
    await seedDemoStudio(db, { now: 2, dataDir });
    const rows = await db('memberships as m').join('users as u', 'u.id', 'm.user_id').select('u.email', 'm.role').orderBy('u.email');
    expect(rows).toHaveLength(4);
    expect(new Set(rows.map((r) => r.role))).toEqual(new Set(['owner', 'designer', 'programmer', 'art_lead']));
    expect(Number((await db('teams').count({ n: '*' }).first())?.n)).toBe(1);
    for (const u of DEMO_USERS) expect(await verifyCredentials(db, u.email, DEMO_PASSWORD)).not.toBeNull();
    await cleanup();
  });

  it('dates everything before now, and each note’s measured scores are the stored trials’ own', async () => {
    const { db, cleanup } = await freshDatabase();
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-seed-'));
    const now = Date.UTC(2026, 11, 1, 9, 0, 0);
    await seedDemoStudio(db, { now, dataDir });
    for (const table of ['teams', 'users', 'memberships', 'characters', 'courses', 'suites', 'leg_setups', 'trials', 'profiles', 'profile_versions']) {
      const row = await db(table).max<{ latest: number }[]>({ latest: 'created_at' }).first();
      expect([table, Number(row?.latest)]).toEqual([table, expect.any(Number)]);
      expect(Number(row?.latest)).toBeLessThan(now);
    }
    const trials = await db('trials').select('leg_setup_id', 'course_name', 'footing_score');
    expect(trials.length).toBeGreaterThan(0);
    for (const t of trials) {
      const setup = await db('leg_setups').where({ id: t.leg_setup_id }).first('note');
      // The note quotes the score to one decimal, as every screen shows it.
      expect(setup.note).toContain(`${t.course_name} ${Number(t.footing_score).toFixed(1)}`);
    }
    await cleanup();
  });
});
