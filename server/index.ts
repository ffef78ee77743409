import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { systemClock } from './clock';
import { openDatabase, migrateToLatest, type Db } from './db';
import { packageVersion, readConfig, type ServerConfig } from './config';
import type { Mailer } from './services/mail';
import { startLocalPayments, type LocalPayments } from './fakes/payments/connect';
import { openJobRunner } from './jobs';
import { removeIncomingFiles } from './services/character-files';

export interface RunningServer {
  server: Server;
  db: Db;
  url: string;
  /** The local payment fake's address (its checkout pages live there). */
  paymentsUrl: string;
  close(): Promise<void>;
}

export interface ServerParts {
  mailer: Mailer;
  localInboxUrl?: string;
  logRequests?: boolean;
  /** The payment service; when omitted a local fake is started here and stopped with the server. */
  payments?: LocalPayments;
}

/** Opens the database, migrates it, and listens. Used by `npm start` and by the browser tests. */
export async function startServer(config: ServerConfig, parts: ServerParts): Promise<RunningServer> {
  const db = openDatabase(config.databaseFile);
  await migrateToLatest(db);
  await removeIncomingFiles(config.dataDir); // temporary files of uploads a crash interrupted
  const payments = parts.payments ?? (await startLocalPayments({ stateFile: config.paymentsFile }));
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
    payments: payments.deps,
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
  payments.fake.setWebhookUrl(`http://${loopback}:${port}/api/billing/webhook`);
  return {
    server,
    db,
    url: listenUrl,
    paymentsUrl: payments.fake.url,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      if (!parts.payments) await payments.fake.stop();
      await jobs.close();
      await db.destroy();
    },
  };
}

if (require.main === module) {
  const config = readConfig();
  if (!config.smtp) {
    console.error('server/index.ts needs SMTP_HOST for mail; `npm start` runs a local mail catcher instead.');
    process.exit(1);
  }
  import('./services/mail')
    .then(({ smtpMailer }) => startServer(config, { mailer: smtpMailer(config.smtp!), logRequests: true }))
    .then(({ url }) => console.log(`Treadle is running at ${url}`))
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}
