import type { Db } from './db';
import type { Clock } from './clock';
import type { Mailer } from './services/mail';
import type Stripe from 'stripe';
import type { JobRunner } from './jobs/job-runner';

/** The payment service as the app uses it: the stripe SDK (pointed at the local fake), and its webhook signing secret. */
export interface PaymentsDeps {
  client: Stripe;
  webhookSecret: string;
  /** Shown on the billing screen: true while payments go to a test stand-in and no real money moves. */
  testMode: boolean;
}

/** Everything the app is built from, so tests build it with their own database, clock and fakes. */
export interface AppDeps {
  db: Db;
  clock: Clock;
  sessionSecret: string;
  /** Folder of the exported web app; omitted in API-only tests. */
  webDir?: string;
  /** Cookies get the Secure flag (set when served over HTTPS behind a proxy). */
  secureCookies?: boolean;
  /** Host names the Host header may carry besides the localhost forms (see allowedHostsOf in config.ts). */
  allowedHosts?: string[];
  /** The reverse proxy believed for X-Forwarded-For/-Proto (TRUST_PROXY); none by default. */
  trustProxy?: string[] | false;
  /** Logs each request (off in tests). */
  logRequests?: boolean;
  version: string;
  mailer: Mailer;
  /** The address people reach this instance at, for links in mail (never taken from a request's Host header). */
  publicUrl(): string;
  /** The local mail catcher's web inbox, shown by the app in development. */
  localInboxUrl?: string;
  /** Where uploaded files are kept (content-addressed); tests pass a temporary folder. */
  dataDir: string;
  payments: PaymentsDeps;
  /** Runs trials and dial-ins in the background; routes that start jobs answer 503 without it. */
  jobs?: JobRunner;
}
