import crypto from 'node:crypto';
import os from 'node:os';
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
  /**
   * Host names (and IP addresses) requests may name in their Host header; anything else is answered 421, so a page on
   * a rebinding domain cannot talk to this instance. Localhost forms are always allowed.
   */
  allowedHosts?: string[];
  /**
   * The reverse proxy whose X-Forwarded-For and X-Forwarded-Proto are believed (express's "trust proxy": addresses,
   * subnets, or loopback/linklocal/uniquelocal). False: the connecting address is the client, whatever headers say.
   */
  trustProxy?: string[] | false;
  /** The local payment fake's own SQLite file. */
  paymentsFile?: string;
}

/** Host names that always reach a local instance. */
export const LOCALHOST_FORMS = ['localhost', '127.0.0.1', '[::1]', '::1'];

/** localhost forms, PUBLIC_URL's host, HOST's address (unless it listens on every interface) and ALLOWED_HOSTS. */
export function allowedHostsOf(env: { host: string; publicUrl?: string; extra?: string }): string[] {
  const hosts = new Set(LOCALHOST_FORMS);
  if (env.publicUrl) hosts.add(new URL(env.publicUrl).hostname.toLowerCase());
  if (env.host === '0.0.0.0' || env.host === '::') {
    // Listening on every interface (a phone on the same network): this machine's own addresses reach it.
    for (const list of Object.values(os.networkInterfaces())) for (const a of list ?? []) hosts.add(a.family === 'IPv6' ? `[${a.address}]` : a.address);
  } else if (env.host) hosts.add(env.host.toLowerCase());
  for (const h of (env.extra ?? '').split(',')) if (h.trim()) hosts.add(h.trim().toLowerCase());
  return [...hosts];
}

/**
 * TRUST_PROXY: a comma-separated list of the proxy's addresses or subnets, or loopback/linklocal/uniquelocal.
 * A hop count or "true" would believe whoever connects, which is what the setting exists to avoid, so it is refused.
 */
export function parseTrustProxy(raw: string | undefined): string[] | false {
  if (!raw?.trim()) return false;
  const parts = raw.split(',').map((p) => p.trim()).filter(Boolean);
  for (const p of parts) {
    if (/^\d+$/.test(p) || p === 'true' || p === '*') {
      throw new Error(`TRUST_PROXY names the proxy's address (e.g. 127.0.0.1, 10.0.0.0/8 or loopback), not "${p}": a hop count or "true" would trust anyone who connects.`);
    }
  }
  return parts;
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
    allowedHosts: allowedHostsOf({ host: env.HOST ?? '127.0.0.1', publicUrl: env.PUBLIC_URL, extra: env.ALLOWED_HOSTS }),
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    paymentsFile: env.PAYMENTS_DB ?? path.join(projectRoot, 'data', 'payments.sqlite'),
  };
}

export function packageVersion(): string {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  return (require(path.join(projectRoot, 'package.json')) as { version: string }).version;
}
