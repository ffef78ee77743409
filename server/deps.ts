import type { Db } from './db';
import type { Clock } from './clock';

/** Everything the app is built from, so tests build it with their own database, clock and fakes. */
export interface AppDeps {
  db: Db;
  clock: Clock;
  sessionSecret: string;
  /** Folder of the exported web app; omitted in API-only tests. */
  webDir?: string;
  /** Cookies get the Secure flag (set when served over HTTPS behind a proxy). */
  secureCookies?: boolean;
  /** Logs each request (off in tests). */
  logRequests?: boolean;
  version: string;
  /** Where uploaded files are kept (content-addressed); tests pass a temporary folder. */
  dataDir: string;
}
