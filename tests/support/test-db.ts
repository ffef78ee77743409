import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { openDatabase, migrateToLatest, type Db } from '../../server/db';

/** A fresh, migrated SQLite file of its own for one test file; removed by the returned cleanup. */
export async function freshDatabase(): Promise<{ db: Db; file: string; cleanup(): Promise<void> }> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-test-'));
  const file = path.join(dir, 'test.sqlite');
  const db = openDatabase(file);
  await migrateToLatest(db);
  return {
    db,
    file,
    async cleanup() {
      await db.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
