import { readConfig } from './config';
import { openDatabase, migrateToLatest } from './db';
import { ensureWebBuild } from './web-build';
import { startServer } from './index';
import { databaseIsEmpty, seedDemoStudio, DEMO_PASSWORD, DEMO_USERS } from '../seeds/demo-studio';

/** `npm start`: migrate, seed an empty database with the demo studio, export the web app if stale, listen. */
async function main() {
  const config = readConfig();
  const db = openDatabase(config.databaseFile);
  await migrateToLatest(db);
  if (await databaseIsEmpty(db)) {
    await seedDemoStudio(db, { now: Date.now(), dataDir: config.dataDir });
    console.log('Seeded the demo studio.');
  }
  await db.destroy();
  ensureWebBuild(config.webDir);
  const running = await startServer(config, { logRequests: process.env.LOG_REQUESTS === '1' });
  console.log(`\nTreadle is running at ${running.url}\n`);
  console.log(`Demo sign-ins (demo only, password "${DEMO_PASSWORD}"):`);
  for (const u of DEMO_USERS) console.log(`  ${u.email.padEnd(28)} ${u.role}`);
  if (config.host === '127.0.0.1') console.log('\nListening on this machine only; HOST=0.0.0.0 npm start opens it to your network.');
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
