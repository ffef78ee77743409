import { openDatabase, migrateToLatest } from '../server/db';
import { readConfig } from '../server/config';
import { seedDemoStudio } from './demo-studio';

/** `npm run seed`: migrates, then (re)applies the demo studio; safe to run any number of times. */
async function main() {
  const db = openDatabase(readConfig().databaseFile);
  try {
    await migrateToLatest(db);
    await seedDemoStudio(db, { now: Date.now(), dataDir: readConfig().dataDir });
    console.log('Demo studio seeded.');
  } finally {
    await db.destroy();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
