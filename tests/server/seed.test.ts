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
});
