import crypto from 'node:crypto';
import type { FakeEvent } from './store';

/**
 * The provider's webhook signature header: "t=<unix seconds>,v1=<hex HMAC-SHA256 of `${t}.${payload}` keyed by the
 * endpoint secret>" — the scheme the stripe SDK's constructEvent verifies and generateTestHeaderString produces.
 */
export function signatureHeader(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = crypto.createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

export interface Delivery {
  event: FakeEvent;
  payload: string;
  header: string;
  /** HTTP status Treadle answered, or null when it could not be reached (or no webhook address was set yet). */
  status: number | null;
}

/** Posts events to the webhook address one after another, in the order they happened, and keeps a log of each try. */
export class WebhookSender {
  readonly deliveries: Delivery[] = [];
  private queue: Promise<void> = Promise.resolve();

  constructor(
    private readonly url: () => string | undefined,
    private readonly secret: string,
  ) {}

  send(event: FakeEvent): void {
    this.queue = this.queue.then(() => this.deliver(event));
  }

  /** Resolves once every event sent so far has been delivered (or failed to be). */
  settled(): Promise<void> {
    return this.queue;
  }

  /** Sends an event again, freshly signed, as the provider does when a delivery failed. */
  resend(eventId: string): Promise<void> {
    const first = this.deliveries.find((d) => d.event.id === eventId);
    if (!first) return Promise.reject(new Error(`No event ${eventId}`));
    this.send(first.event);
    return this.settled();
  }

  private async deliver(event: FakeEvent): Promise<void> {
    const payload = JSON.stringify(event, null, 2);
    const header = signatureHeader(payload, this.secret);
    const url = this.url();
    const delivery: Delivery = { event, payload, header, status: null };
    this.deliveries.push(delivery);
    if (!url) return;
    try {
      const res = await fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': header }, body: payload });
      delivery.status = res.status;
      await res.arrayBuffer();
    } catch {
      delivery.status = null;
    }
  }
}
