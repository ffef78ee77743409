/**
 * The server with the local payment stand-in (server/fakes/payments): the fake is started first, Treadle is
 * given its SDK, and once Treadle listens the fake is told where Treadle's webhook is.
 */
import type { ServerConfig } from '../config';
import { startServer, type RunningServer, type ServerParts } from '../index';
import { startLocalPayments, type LocalPayments } from '../fakes/payments/connect';

export interface RunningWithPayments extends RunningServer {
  /** The local payment fake's address (its checkout pages live there). */
  paymentsUrl: string;
}

/** Starts the server over `payments`, or over a fresh stand-in started here and stopped with the server. */
export async function startWithLocalPayments(
  config: ServerConfig,
  parts: Omit<ServerParts, 'payments'> & { payments?: LocalPayments },
): Promise<RunningWithPayments> {
  const payments = parts.payments ?? (await startLocalPayments({ stateFile: config.paymentsFile }));
  let running: RunningServer;
  try {
    running = await startServer(config, { ...parts, payments: payments.deps });
  } catch (err) {
    if (!parts.payments) await payments.fake.stop();
    throw err;
  }
  payments.fake.setWebhookUrl(running.webhookUrl);
  return {
    ...running,
    paymentsUrl: payments.fake.url,
    async close() {
      await running.close();
      if (!parts.payments) await payments.fake.stop();
    },
  };
}
