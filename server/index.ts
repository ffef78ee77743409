import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { systemClock } from './clock';
import { openDatabase, migrateToLatest, type Db } from './db';
import { packageVersion, readConfig, type ServerConfig } from './config';

export interface RunningServer {
  server: Server;
  db: Db;
  url: string;
  close(): Promise<void>;
}

/** Opens the database, migrates it, and listens. Used by `npm start` and by the browser tests. */
export async function startServer(config: ServerConfig, options: { logRequests?: boolean } = {}): Promise<RunningServer> {
  const db = openDatabase(config.databaseFile);
  await migrateToLatest(db);
  const app = createApp({
    db,
    clock: systemClock,
    sessionSecret: config.sessionSecret,
    webDir: config.webDir,
    secureCookies: config.secureCookies,
    logRequests: options.logRequests ?? false,
    version: packageVersion(),
    dataDir: config.dataDir,
  });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.on('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const shownHost = config.host === '0.0.0.0' || config.host === '127.0.0.1' ? 'localhost' : config.host;
  return {
    server,
    db,
    url: `http://${shownHost}:${port}`,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.destroy();
    },
  };
}

if (require.main === module) {
  startServer(readConfig(), { logRequests: true })
    .then(({ url }) => console.log(`Treadle is running at ${url}`))
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}
