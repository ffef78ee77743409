import { newId } from './ids';
import { badParam, missing } from './errors';
import { FakeStateFile, KeptMap } from './persistence';

/** The fake's objects, shaped like the provider's (only the fields Treadle reads, plus a few for realism). */
type Obj = Record<string, unknown> & { id: string };
export type FakeEvent = { id: string; object: 'event'; type: string; created: number; api_version: string; livemode: false; pending_webhooks: number; data: { object: Obj }; request: { id: null; idempotency_key: null } };

const PERIOD_SECONDS = 30 * 24 * 3600;

/** All state of the fake payment service, kept in its own SQLite file (persistence.ts) so a restart forgets nothing. */
export class PaymentsStore {
  readonly customers: KeptMap<Obj>;
  readonly products: KeptMap<Obj>;
  readonly prices: KeptMap<Obj>;
  readonly sessions: KeptMap<Obj & { line_price: string }>;
  readonly subscriptions: KeptMap<Obj>;
  readonly invoices: KeptMap<Obj>;
  private invoiceCount: number;
  private offsetSeconds: number;

  constructor(
    private readonly emit: (event: FakeEvent) => void,
    private readonly apiVersion: string,
    private readonly file: FakeStateFile,
  ) {
    this.customers = new KeptMap(file, 'customers');
    this.products = new KeptMap(file, 'products');
    this.prices = new KeptMap(file, 'prices');
    this.sessions = new KeptMap(file, 'sessions');
    this.subscriptions = new KeptMap(file, 'subscriptions');
    this.invoices = new KeptMap(file, 'invoices');
    this.invoiceCount = Number(file.meta('invoiceCount') ?? 0);
    this.offsetSeconds = Number(file.meta('offsetSeconds') ?? 0);
  }

  /** The fake's clock, in the provider's epoch seconds; tests move it with advance(). */
  now(): number {
    return Math.floor(Date.now() / 1000) + this.offsetSeconds;
  }

  event(type: string, object: Obj): void {
    this.emit({
      id: newId('event'),
      object: 'event',
      type,
      created: this.now(),
      api_version: this.apiVersion,
      livemode: false,
      pending_webhooks: 1,
      data: { object: structuredClone(object) },
      request: { id: null, idempotency_key: null },
    });
  }

  get(map: Map<string, Obj>, what: string, id: string): Obj {
    const found = map.get(id);
    if (!found) throw missing(what, id);
    return found;
  }

  createCustomer(p: Record<string, unknown>): Obj {
    const c: Obj = { id: newId('customer'), object: 'customer', created: this.now(), email: p.email ?? null, name: p.name ?? null, metadata: p.metadata ?? {}, livemode: false };
    this.customers.set(c.id, c);
    return c;
  }

  createProduct(p: Record<string, unknown>): Obj {
    if (!p.name) throw badParam('name', 'Missing required param: name.');
    const product: Obj = { id: newId('product'), object: 'product', active: true, name: p.name, metadata: p.metadata ?? {}, created: this.now(), livemode: false };
    this.products.set(product.id, product);
    return product;
  }

  createPrice(p: Record<string, unknown>): Obj {
    const product = this.get(this.products, 'product', String(p.product ?? ''));
    const unitAmount = Number(p.unit_amount);
    if (!Number.isInteger(unitAmount) || unitAmount < 0) throw badParam('unit_amount', 'Invalid integer: unit_amount.');
    const recurring = p.recurring as { interval?: string } | undefined;
    const price: Obj = {
      id: newId('price'),
      object: 'price',
      active: true,
      product: product.id,
      unit_amount: unitAmount,
      currency: String(p.currency ?? 'eur'),
      recurring: recurring?.interval ? { interval: recurring.interval, interval_count: 1 } : null,
      type: recurring?.interval ? 'recurring' : 'one_time',
      lookup_key: p.lookup_key ?? null,
      metadata: p.metadata ?? {},
      created: this.now(),
      livemode: false,
    };
    this.prices.set(price.id, price);
    return price;
  }

  createCheckoutSession(p: Record<string, unknown>, pageBase: string): Obj {
    if (p.mode !== 'subscription') throw badParam('mode', 'This fake supports Checkout only in mode "subscription".');
    if (!p.success_url) throw badParam('success_url', 'Missing required param: success_url.');
    const items = p.line_items as { price?: string; quantity?: string }[] | undefined;
    const priceId = items?.[0]?.price;
    if (!priceId || items.length !== 1) throw badParam('line_items', 'Pass exactly one line item with a price.');
    const price = this.get(this.prices, 'price', priceId);
    if (p.customer) this.get(this.customers, 'customer', String(p.customer));
    this.closeOpenCheckoutsOf(p.client_reference_id ?? null, p.customer ?? null);
    const id = newId('checkout');
    const session = {
      id,
      object: 'checkout.session',
      mode: 'subscription',
      status: 'open',
      payment_status: 'unpaid',
      customer: p.customer ?? null,
      client_reference_id: p.client_reference_id ?? null,
      metadata: p.metadata ?? {},
      subscription_metadata: (p.subscription_data as { metadata?: unknown } | undefined)?.metadata ?? {},
      success_url: p.success_url,
      cancel_url: p.cancel_url ?? null,
      url: `${pageBase}/pay/${id}`,
      amount_total: price.unit_amount,
      currency: price.currency,
      subscription: null,
      created: this.now(),
      expires_at: this.now() + 24 * 3600,
      livemode: false,
      line_price: priceId,
    };
    this.sessions.set(id, session);
    return session;
  }

  /** The hosted page's "pay" with a card that succeeded: subscription, first invoice, and their events. */
  completeCheckout(sessionId: string, card: { brand: string; last4: string }): Obj {
    const session = this.sessions.get(sessionId);
    if (!session || session.status !== 'open') throw badParam('session', 'This checkout is no longer open.');
    const customerId = (session.customer as string | null) ?? this.createCustomer({}).id;
    const price = this.get(this.prices, 'price', session.line_price);
    const start = this.now();
    const subId = newId('subscription');
    const sub: Obj = {
      id: subId,
      object: 'subscription',
      customer: customerId,
      status: 'active',
      created: start,
      start_date: start,
      cancel_at_period_end: false,
      cancel_at: null,
      canceled_at: null,
      ended_at: null,
      currency: price.currency,
      metadata: session.subscription_metadata,
      // Only the brand and last four digits are kept: the fake never holds a whole card number.
      default_payment_method: { id: newId('card'), object: 'payment_method', type: 'card', card: { brand: card.brand, last4: card.last4 } },
      items: { object: 'list', has_more: false, data: [this.subscriptionItem(subId, price, start)] },
      livemode: false,
    };
    this.subscriptions.set(subId, sub);
    const invoice = this.createInvoice(sub, 'subscription_create', price.unit_amount as number, `${this.productName(price)} (monthly)`);
    Object.assign(session, { status: 'complete', payment_status: 'paid', subscription: subId, customer: customerId });
    this.sessions.keep(session);
    sub.latest_invoice = invoice.id;
    this.subscriptions.keep(sub);
    this.event('customer.subscription.created', sub);
    this.event('invoice.paid', invoice);
    this.event('checkout.session.completed', this.publicSession(session));
    return session;
  }

  /**
   * One open checkout per team (by Treadle's team reference, else by customer): opening another closes the earlier
   * ones, so two checkouts of one studio can never both be paid.
   */
  private closeOpenCheckoutsOf(reference: unknown, customer: unknown): void {
    for (const other of this.sessions.values()) {
      if (other.status !== 'open') continue;
      const sameTeam = reference !== null ? other.client_reference_id === reference : customer !== null && other.customer === customer;
      if (!sameTeam) continue;
      Object.assign(other, { status: 'expired', replaced: true });
      this.sessions.keep(other);
      this.event('checkout.session.expired', this.publicSession(other));
    }
  }

  /** Open and not past its expiry; one that ran out is marked expired on the way. */
  isOpen(session: Obj & { line_price: string }): boolean {
    if (session.status === 'open' && (session.expires_at as number) <= this.now()) {
      Object.assign(session, { status: 'expired' });
      this.sessions.keep(session);
      this.event('checkout.session.expired', this.publicSession(session));
    }
    return session.status === 'open';
  }

  publicSession(session: Obj): Obj {
    const { line_price: _hidden, subscription_metadata: _meta, replaced: _replaced, ...rest } = session;
    return rest as Obj;
  }

  /** Plan change, cancel at period end or its undoing: the SDK's subscriptions.update. */
  updateSubscription(id: string, p: Record<string, unknown>): Obj {
    const sub = this.get(this.subscriptions, 'subscription', id);
    if (sub.status === 'canceled') throw badParam('subscription', 'A canceled subscription cannot be updated.');
    const previous: Record<string, unknown> = {};
    const items = p.items as { id?: string; price?: string }[] | undefined;
    if (items?.length) {
      const list = sub.items as { data: Obj[] };
      const item = list.data.find((i) => i.id === items[0].id);
      if (!item) throw badParam('items[0][id]', `No such subscription item: '${items[0].id}'`);
      const oldPrice = item.price as Obj;
      const newPrice = this.get(this.prices, 'price', String(items[0].price ?? ''));
      if (newPrice.id !== oldPrice.id) {
        previous.items = structuredClone(sub.items);
        item.price = newPrice;
        if (p.proration_behavior === 'always_invoice') {
          const periodEnd = item.current_period_end as number;
          const periodStart = item.current_period_start as number;
          const left = Math.max(0, periodEnd - this.now()) / (periodEnd - periodStart);
          const difference = Math.round(((newPrice.unit_amount as number) - (oldPrice.unit_amount as number)) * left);
          const invoice = this.createInvoice(sub, 'subscription_update', difference, `Change to ${this.productName(newPrice)}, rest of this period`);
          sub.latest_invoice = invoice.id;
          this.event('invoice.paid', invoice);
        }
      }
    }
    if (p.cancel_at_period_end !== undefined) {
      const cancel = p.cancel_at_period_end === 'true' || p.cancel_at_period_end === true;
      previous.cancel_at_period_end = sub.cancel_at_period_end;
      sub.cancel_at_period_end = cancel;
      sub.cancel_at = cancel ? this.periodEnd(sub) : null;
      sub.canceled_at = cancel ? this.now() : null;
    }
    if (p.metadata) sub.metadata = { ...(sub.metadata as object), ...(p.metadata as object) };
    this.subscriptions.keep(sub);
    this.event('customer.subscription.updated', { ...sub, previous_attributes: previous } as Obj);
    return sub;
  }

  cancelNow(id: string): Obj {
    const sub = this.get(this.subscriptions, 'subscription', id);
    Object.assign(sub, { status: 'canceled', ended_at: this.now(), canceled_at: this.now(), cancel_at_period_end: false });
    this.subscriptions.keep(sub);
    this.event('customer.subscription.deleted', sub);
    return sub;
  }

  /** Moves the fake's clock on; subscriptions whose period ended renew (with an invoice) or end. */
  advance(seconds: number): void {
    this.offsetSeconds += seconds;
    this.file.setMeta('offsetSeconds', String(this.offsetSeconds));
    for (const sub of this.subscriptions.values()) {
      while (sub.status === 'active' && this.periodEnd(sub) <= this.now()) {
        if (sub.cancel_at_period_end) {
          Object.assign(sub, { status: 'canceled', ended_at: this.periodEnd(sub) });
          this.subscriptions.keep(sub);
          this.event('customer.subscription.deleted', sub);
          break;
        }
        const item = (sub.items as { data: Obj[] }).data[0];
        item.current_period_start = item.current_period_end;
        item.current_period_end = (item.current_period_end as number) + PERIOD_SECONDS;
        const price = item.price as Obj;
        const invoice = this.createInvoice(sub, 'subscription_cycle', price.unit_amount as number, `${this.productName(price)} (monthly)`);
        sub.latest_invoice = invoice.id;
        this.subscriptions.keep(sub);
        this.event('invoice.paid', invoice);
        this.event('customer.subscription.updated', sub);
      }
    }
  }

  listInvoices(filter: { customer?: string; subscription?: string }): Obj[] {
    return [...this.invoices.values()]
      .filter((i) => (!filter.customer || i.customer === filter.customer) && (!filter.subscription || this.invoiceSubscription(i) === filter.subscription))
      .sort((a, b) => (b.created as number) - (a.created as number));
  }

  private invoiceSubscription(invoice: Obj): string | undefined {
    return (invoice.parent as { subscription_details?: { subscription?: string } } | null)?.subscription_details?.subscription;
  }

  private subscriptionItem(subId: string, price: Obj, start: number): Obj {
    return { id: newId('item'), object: 'subscription_item', subscription: subId, price, quantity: 1, created: start, current_period_start: start, current_period_end: start + PERIOD_SECONDS };
  }

  private periodEnd(sub: Obj): number {
    return (sub.items as { data: Obj[] }).data[0].current_period_end as number;
  }

  private productName(price: Obj): string {
    return String(this.products.get(price.product as string)?.name ?? 'Subscription');
  }

  private createInvoice(sub: Obj, reason: string, total: number, description: string): Obj {
    const item = (sub.items as { data: Obj[] }).data[0];
    this.invoiceCount += 1;
    this.file.setMeta('invoiceCount', String(this.invoiceCount));
    const amountDue = Math.max(0, total);
    const invoice: Obj = {
      id: newId('invoice'),
      object: 'invoice',
      number: `TT-${String(this.invoiceCount).padStart(4, '0')}`,
      customer: sub.customer,
      status: 'paid',
      billing_reason: reason,
      description,
      currency: sub.currency,
      subtotal: total,
      total,
      amount_due: amountDue,
      amount_paid: amountDue,
      amount_remaining: 0,
      created: this.now(),
      period_start: reason === 'subscription_update' ? this.now() : item.current_period_start,
      period_end: item.current_period_end,
      parent: { type: 'subscription_details', subscription_details: { subscription: sub.id, metadata: sub.metadata } },
      lines: { object: 'list', has_more: false, data: [{ object: 'line_item', amount: total, description, period: { start: item.current_period_start, end: item.current_period_end } }] },
      livemode: false,
    };
    this.invoices.set(invoice.id, invoice);
    return invoice;
  }
}
