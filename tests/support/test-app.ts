import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import type { Clock } from '../../server/clock';
import type { Db } from '../../server/db';
import { freshDatabase } from './test-db';

/** A clock the test moves by hand. */
export function manualClock(start = Date.UTC(2026, 11, 1, 9, 0, 0)): Clock & { advance(ms: number): void } {
  let now = start;
  return { now: () => now, advance: (ms) => void (now += ms) };
}

export interface TestApp {
  app: Express;
  db: Db;
  clock: ReturnType<typeof manualClock>;
  dataDir: string;
  cleanup(): Promise<void>;
}

/** The real Express app over a fresh SQLite file and an empty data folder of its own. */
export async function testApp(): Promise<TestApp> {
  const database = await freshDatabase();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-files-'));
  const clock = manualClock();
  const app = createApp({ db: database.db, clock, sessionSecret: 'test-secret', version: 'test', dataDir });
  return {
    app,
    db: database.db,
    clock,
    dataDir,
    async cleanup() {
      await database.cleanup();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
