import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import Stripe from 'stripe';
import { PaymentsStore } from './store';
import { FakeStateFile } from './persistence';
import { WebhookSender, type Delivery } from './webhooks';
import { paymentsApi } from './api';
import { checkoutPage } from './checkout-page';

export interface PaymentsFakeOptions {
  /** 0 (the default) picks a free port. */
  port?: number;
  /** Where events are posted; a function when Treadle's address is known only once it listens. */
  webhookUrl?: string | (() => string | undefined);
  webhookSecret: string;
  /** The fake's own SQLite file; without one it keeps its state in a temporary file removed by stop(). */
  stateFile?: string;
}

export interface RunningPaymentsFake {
  url: string;
  port: number;
  setWebhookUrl(url: string): void;
  /** Every webhook delivery tried so far, oldest first. */
  deliveries: readonly Delivery[];
  /** Resolves once every event so far has been posted. */
  settled(): Promise<void>;
  resend(eventId: string): Promise<void>;
  /** Moves the fake's clock on by this many seconds: periods renew or, when cancelled, end. */
  advance(seconds: number): Promise<void>;
  store: PaymentsStore;
  stop(): Promise<void>;
}

/** A local fake of the payment service, on loopback only, spoken to through the real stripe SDK. */
export async function startPaymentsFake(options: PaymentsFakeOptions): Promise<RunningPaymentsFake> {
  let webhookUrl = options.webhookUrl;
  const sender = new WebhookSender(() => (typeof webhookUrl === 'function' ? webhookUrl() : webhookUrl), options.webhookSecret);
  const file = new FakeStateFile(options.stateFile);
  const store = new PaymentsStore((event) => sender.send(event), Stripe.API_VERSION, file);
  let base = '';

  const app = express();
  app.disable('x-powered-by');
  // The SDK sends list filters as lookup_keys[0]=…; the extended parser reads them back as arrays.
  app.set('query parser', 'extended');
  app.use('/v1', paymentsApi(store, () => base));
  app.use(checkoutPage(store, sender));
  app.get('/', (_req, res) => void res.type('text/plain').send('Treadle’s own test payment service, on this machine. No real money moves.'));
  // Quietly: the default handler would print the request's stack trace, and this page's requests carry card fields.
  app.use((_err: unknown, _req: express.Request, res: express.Response, _next: express.NextFunction) => {
    res.status(500).type('text/plain').send('The local payment fake failed; nothing was charged.');
  });

  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(options.port ?? 0, '127.0.0.1', () => resolve(s));
    s.on('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  base = `http://127.0.0.1:${port}`;

  return {
    url: base,
    port,
    setWebhookUrl: (url) => void (webhookUrl = url),
    deliveries: sender.deliveries,
    settled: () => sender.settled(),
    resend: (id) => sender.resend(id),
    async advance(seconds) {
      store.advance(seconds);
      await sender.settled();
    },
    store,
    async stop() {
      await sender.settled();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      file.close();
    },
  };
}
