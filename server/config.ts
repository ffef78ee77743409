import crypto from 'node:crypto';
import path from 'node:path';
import { developmentDatabaseFile } from '../knexfile';

export const projectRoot = path.resolve(__dirname, '..');

export interface ServerConfig {
  port: number;
  host: string;
  databaseFile: string;
  /** Uploaded files, content-addressed. */
  dataDir: string;
  webDir: string;
  sessionSecret: string;
  secureCookies: boolean;
  /** Where people reach this instance, for links in mail; defaults to the address it listens on. */
  publicUrl?: string;
  /** A real SMTP relay; without one, `npm start` runs the local mail catcher. */
  smtp?: { host: string; port: number; secure: boolean; auth?: { user: string; pass: string } };
  /** Port of the local mail catcher's web inbox. */
  inboxPort: number;
}

export function readConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  const port = Number(env.PORT ?? 8080);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be a port number, got "${env.PORT}".`);
  return {
    port,
    host: env.HOST ?? '127.0.0.1',
    databaseFile: env.TREADLE_DB ?? developmentDatabaseFile,
    dataDir: env.TREADLE_DATA_DIR ?? path.join(projectRoot, 'data', 'files'),
    webDir: env.TREADLE_WEB_DIR ?? path.join(projectRoot, 'dist'),
    // A random secret per start signs everyone out on restart; set SESSION_SECRET to keep sessions.
    sessionSecret: env.SESSION_SECRET ?? crypto.randomBytes(32).toString('hex'),
    secureCookies: env.SECURE_COOKIES === '1',
    publicUrl: env.PUBLIC_URL?.replace(/\/$/, ''),
    smtp: env.SMTP_HOST
      ? {
          host: env.SMTP_HOST,
          port: Number(env.SMTP_PORT ?? 587),
          secure: env.SMTP_SECURE === '1',
          auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
        }
      : undefined,
    inboxPort: Number(env.INBOX_PORT ?? port + 1),
  };
}

export function packageVersion(): string {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  return (require(path.join(projectRoot, 'package.json')) as { version: string }).version;
}
