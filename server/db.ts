import fs from 'node:fs';
import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
import { knexConfig } from '../knexfile';

export type Db = Knex;

/** Opens (creating its folder if needed) the SQLite file with foreign keys on and WAL journaling. */
export function openDatabase(filename: string): Db {
  if (filename !== ':memory:') fs.mkdirSync(path.dirname(filename), { recursive: true });
  return knexFactory(knexConfig(filename));
}

export async function migrateToLatest(db: Db): Promise<void> {
  await db.migrate.latest();
}
