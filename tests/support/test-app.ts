import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import type { AppDeps } from '../../server/deps';
import type { Clock } from '../../server/clock';
import type { Db } from '../../server/db';
import { freshDatabase } from './test-db';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail-catcher';
import { smtpMailer } from '../../server/services/mail';
import { startLocalPayments, type LocalPayments } from '../../server/fakes/payments/connect';
import { createJobRunner } from '../../server/jobs';

export const TEST_PUBLIC_URL = 'http://treadle.test';

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
  /** The real SMTP catcher on loopback that the app's mail goes to. */
  mail: MailCatcher;
  /** The local payment fake; the app also listens on loopback (`url`) so the fake's webhooks reach it. */
  payments: LocalPayments;
  /** The background job runner (piscina pool of 2 threads); `idle()` waits until no job runs. */
  jobs: ReturnType<typeof createJobRunner>;
  url: string;
  cleanup(): Promise<void>;
}

/** The real Express app over a fresh SQLite file and an empty data folder of its own; `overrides` replace its parts. */
export async function testApp(overrides: Partial<AppDeps> = {}): Promise<TestApp> {
  const database = await freshDatabase();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-files-'));
  const clock = manualClock();
  const mail = await startMailCatcher();
  const mailer = smtpMailer({ host: '127.0.0.1', port: mail.smtpPort });
  const payments = await startLocalPayments();
  const jobs = createJobRunner({ db: database.db, clock, threads: 2 });
  await jobs.start();
  const app = createApp({
    db: database.db,
    clock,
    sessionSecret: 'test-secret',
    version: 'test',
    dataDir,
    mailer,
    publicUrl: () => TEST_PUBLIC_URL,
    payments: payments.deps,
    jobs,
    ...overrides,
  });
  const listener = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(listener.address() as import('node:net').AddressInfo).port}`;
  payments.fake.setWebhookUrl(`${url}/api/billing/webhook`);
  return {
    app,
    db: database.db,
    clock,
    dataDir,
    mail,
    payments,
    jobs,
    url,
    async cleanup() {
      await payments.fake.stop();
      await new Promise<void>((resolve) => {
        listener.close(() => resolve());
        listener.closeAllConnections();
      });
      mailer.close();
      await mail.stop();
      await jobs.close();
      await database.cleanup();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
