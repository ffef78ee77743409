import path from 'node:path';
import type { Knex } from 'knex';

/** The development database lives under data/ (git-ignored); tests pass their own file to server/db.ts. */
export function knexConfig(filename: string): Knex.Config {
  return {
    client: 'better-sqlite3',
    connection: { filename },
    useNullAsDefault: true,
    migrations: {
      directory: path.join(__dirname, 'migrations'),
      extension: 'ts',
      loadExtensions: ['.ts'],
    },
    pool: {
      afterCreate(conn: { pragma(sql: string): unknown }, done: (err: Error | null, conn: unknown) => void) {
        conn.pragma('foreign_keys = ON');
        conn.pragma('journal_mode = WAL');
        conn.pragma('busy_timeout = 5000');
        done(null, conn);
      },
    },
  };
}

export const developmentDatabaseFile = process.env.TREADLE_DB ?? path.join(__dirname, 'data', 'treadle.sqlite');

const config: Record<string, Knex.Config> = {
  development: knexConfig(developmentDatabaseFile),
};

export default config;
