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

export async function testApp(): Promise<{ app: Express; db: Db; clock: ReturnType<typeof manualClock>; cleanup(): Promise<void> }> {
  const { db, cleanup } = await freshDatabase();
  const clock = manualClock();
  const app = createApp({ db, clock, sessionSecret: 'test-secret', version: 'test' });
  return { app, db, clock, cleanup };
}
