import { readConfig } from '../config';
import { openDatabase, migrateToLatest } from '../db';
import { ensureWebBuild } from '../web-build';
import { assertRedisReachable, shownUrl } from '../jobs/redis';
import { smtpMailer } from '../services/mail';
import { startMailCatcher } from '../fakes/mail-catcher';
import { startLocalPayments } from '../fakes/payments/connect';
import { databaseIsEmpty, seedDemoStudio, DEMO_PASSWORD, DEMO_USERS } from '../../seeds/demo-studio';
import { startWithLocalPayments } from './local-payments';

/**
 * `npm start`: migrate, seed an empty database with the demo studio, export the web app if stale, listen.
 * The launchers are the only part of server/ that imports seeds/: the server itself (index.ts) never seeds.
 */
async function main() {
  const config = readConfig();
  if (process.env.REDIS_URL) {
    // With a queue configured but unreachable, say so in one line and stop before anything starts.
    try {
      await assertRedisReachable(process.env.REDIS_URL);
    } catch (err) {
      console.error((err as Error).message);
      process.exit(1);
    }
  }
  const db = openDatabase(config.databaseFile);
  await migrateToLatest(db);
  if (await databaseIsEmpty(db)) {
    await seedDemoStudio(db, { now: Date.now(), dataDir: config.dataDir });
    console.log('Seeded the demo studio.');
  }
  await db.destroy();
  ensureWebBuild(config.webDir);
  let mailer;
  let localInboxUrl: string | undefined;
  if (config.smtp) {
    mailer = smtpMailer(config.smtp);
  } else {
    const catcher = await startMailCatcher({ inboxPort: config.inboxPort });
    mailer = smtpMailer({ host: '127.0.0.1', port: catcher.smtpPort });
    localInboxUrl = catcher.inboxUrl;
  }
  // The payment fake first: Treadle's webhook address is given to it once Treadle listens.
  // Its own SQLite file (PAYMENTS_DB, data/payments.sqlite by default), so subscriptions paid in it survive a restart.
  const payments = await startLocalPayments({ port: Number(process.env.PAYMENTS_PORT ?? 0), stateFile: config.paymentsFile });
  const running = await startWithLocalPayments(config, { mailer, localInboxUrl, payments, logRequests: process.env.LOG_REQUESTS === '1' });
  console.log(`\nTreadle is running at ${running.url}\n`);
  if (process.env.REDIS_URL) console.log(`Trials and dial-ins are queued on Redis at ${shownUrl(process.env.REDIS_URL)}: start \`npm run worker\` on each machine that should run them.`);
  console.log(`Payments (local test stand-in, no real money moves): ${payments.fake.url}`);
  if (localInboxUrl) console.log(`Local inbox (mail Treadle sends, kept on this machine): ${localInboxUrl}`);
  console.log(`Demo sign-ins (demo only, password "${DEMO_PASSWORD}"):`);
  for (const u of DEMO_USERS) console.log(`  ${u.email.padEnd(28)} ${u.role}`);
  if (config.host === '127.0.0.1') console.log('\nListening on this machine only; HOST=0.0.0.0 npm start opens it to your network.');
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
