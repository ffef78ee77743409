import crypto from 'node:crypto';
import Stripe from 'stripe';
import type { PaymentsDeps } from '../../deps';
import { startPaymentsFake, type RunningPaymentsFake } from './index';

/** The real stripe SDK pointed at the local fake (plain HTTP on loopback). */
export function stripeForFake(fakeUrl: string, secretKey = 'sk_test_treadle_local'): Stripe {
  const { hostname, port } = new URL(fakeUrl);
  return new Stripe(secretKey, { host: hostname, port: Number(port), protocol: 'http', telemetry: false, maxNetworkRetries: 1 });
}

export interface LocalPayments {
  deps: PaymentsDeps;
  fake: RunningPaymentsFake;
}

/**
 * Starts the fake with a fresh webhook secret and builds the app's payment dependencies over it. `stateFile` is the
 * fake's own SQLite file (data/payments.sqlite for `npm start`); without it the state lasts until stop().
 */
export async function startLocalPayments(options: { port?: number; webhookUrl?: string; stateFile?: string } = {}): Promise<LocalPayments> {
  const webhookSecret = `whsec_${crypto.randomBytes(24).toString('hex')}`;
  const fake = await startPaymentsFake({ port: options.port, webhookUrl: options.webhookUrl, webhookSecret, stateFile: options.stateFile });
  return { fake, deps: { client: stripeForFake(fake.url), webhookSecret, testMode: true } };
}
