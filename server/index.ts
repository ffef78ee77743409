import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { systemClock } from './clock';
import { openDatabase, migrateToLatest, type Db } from './db';
import { packageVersion, readConfig, type ServerConfig } from './config';
import type { Mailer } from './services/mail';
import type { PaymentsDeps } from './deps';
import { openJobRunner } from './jobs';
import { removeIncomingFiles } from './services/character-files';

export interface RunningServer {
  server: Server;
  db: Db;
  url: string;
  /** Where the payment service sends its webhook to this server (on loopback when listening on every address). */
  webhookUrl: string;
  close(): Promise<void>;
}

export interface ServerParts {
  mailer: Mailer;
  localInboxUrl?: string;
  logRequests?: boolean;
  /** The payment service (server/launch/local-payments.ts starts the local stand-in). */
  payments: PaymentsDeps;
}

/**
 * Opens the database, migrates it, and listens. What runs around it (seeding, the local stand-ins for mail and
 * payments) is started by the launchers in server/launch/.
 */
export async function startServer(config: ServerConfig, parts: ServerParts): Promise<RunningServer> {
  const db = openDatabase(config.databaseFile);
  await migrateToLatest(db);
  await removeIncomingFiles(config.dataDir); // temporary files of uploads a crash interrupted
  // Before serving: jobs a crash left running are marked failed, queued ones start again.
  // REDIS_URL: tasks go to `npm run worker` processes over BullMQ; otherwise to threads in this process.
  const jobs = await openJobRunner({ db, clock: systemClock, redisUrl: process.env.REDIS_URL });
  await jobs.start();
  let listenUrl = '';
  const app = createApp({
    db,
    clock: systemClock,
    sessionSecret: config.sessionSecret,
    webDir: config.webDir,
    secureCookies: config.secureCookies,
    allowedHosts: config.allowedHosts,
    trustProxy: config.trustProxy,
    logRequests: parts.logRequests ?? false,
    version: packageVersion(),
    dataDir: config.dataDir,
    mailer: parts.mailer,
    publicUrl: () => config.publicUrl ?? listenUrl,
    localInboxUrl: parts.localInboxUrl,
    payments: parts.payments,
    jobs,
  });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.on('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const shownHost = config.host === '0.0.0.0' || config.host === '127.0.0.1' ? 'localhost' : config.host;
  listenUrl = `http://${shownHost}:${port}`;
  const loopback = config.host === '0.0.0.0' || config.host === 'localhost' ? '127.0.0.1' : config.host;
  return {
    server,
    db,
    url: listenUrl,
    webhookUrl: `http://${loopback}:${port}/api/billing/webhook`,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await jobs.close();
      await db.destroy();
    },
  };
}
