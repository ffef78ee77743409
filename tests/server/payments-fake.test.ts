/**
 * The local test payment service: its state lives in its own SQLite file and survives a restart, only one
 * checkout per studio is open at a time, and its page is plainly Treadle's own test checkout.
 * Spoken to through the real stripe SDK, as Treadle does.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startLocalPayments, type LocalPayments } from '../../server/fakes/payments/connect';
import { colors } from '../../constants/palette'; // what constants/theme.ts exports to the app
import { payOnCheckoutPage } from './billing-helpers';

jest.setTimeout(30_000);

let dir: string;
let file: string;
const running: LocalPayments[] = [];
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-payments-test-'));
  file = path.join(dir, 'payments.sqlite');
});
afterAll(async () => {
  for (const p of running) await p.fake.stop().catch(() => undefined);
  fs.rmSync(dir, { recursive: true, force: true });
});

async function start(stateFile = file) {
  const p = await startLocalPayments({ stateFile });
  running.push(p);
  return p;
}

async function openCheckout(p: LocalPayments, team: string, customer?: string) {
  const client = p.deps.client;
  const product = await client.products.create({ name: 'Treadle Crew' });
  const price = await client.prices.create({ product: product.id, unit_amount: 2400, currency: 'eur', recurring: { interval: 'month' } });
  const cus = customer ?? (await client.customers.create({ name: `Studio ${team}` })).id;
  const session = await client.checkout.sessions.create({
    mode: 'subscription',
    customer: cus,
    client_reference_id: team,
    line_items: [{ price: price.id, quantity: 1 }],
    metadata: { team_id: team },
    success_url: 'http://127.0.0.1:9/team/billing?checkout=done',
    cancel_url: 'http://127.0.0.1:9/team/billing?checkout=cancelled',
  });
  return { session, customer: cus, price };
}

describe('state across a restart', () => {
  it('keeps customers, a paid subscription, its invoice and the invoice numbering in its own file', async () => {
    const first = await start();
    const { session, customer } = await openCheckout(first, '41');
    expect((await payOnCheckoutPage(session.url!, '4242 4242 4242 4242')).status).toBe(303);
    const paid = await first.deps.client.checkout.sessions.retrieve(session.id);
    const subId = paid.subscription as string;
    await first.fake.stop();
    running.pop();
    expect(fs.existsSync(file)).toBe(true);

    const second = await start();
    const client = second.deps.client;
    expect((await client.customers.retrieve(customer)).id).toBe(customer);
    const sub = await client.subscriptions.retrieve(subId);
    expect(sub).toMatchObject({ status: 'active', customer });
    // A change after the restart works on the remembered subscription and continues its invoice numbers.
    const changed = await client.subscriptions.update(subId, { cancel_at_period_end: true });
    expect(changed.cancel_at_period_end).toBe(true);
    const { session: next } = await openCheckout(second, '42');
    expect((await payOnCheckoutPage(next.url!, '4242 4242 4242 4242')).status).toBe(303);
    const numbers = (await client.invoices.list({ limit: 10 })).data.map((i) => i.number).sort();
    expect(numbers).toEqual(['TT-0001', 'TT-0002']);
    // The finished checkout is still finished after the restart (the service listens on a new port now).
    expect((await fetch(session.url!.replace(first.fake.url, second.fake.url))).status).toBe(410);
  });

  it('keeps no state between runs when no file is named (tests), and removes its temporary file', async () => {
    const scratch = await startLocalPayments();
    const { session } = await openCheckout(scratch, '7');
    await scratch.fake.stop();
    const again = await startLocalPayments();
    running.push(again);
    await expect(again.deps.client.checkout.sessions.retrieve(session.id)).rejects.toMatchObject({ code: 'resource_missing' });
  });
});

describe('one open checkout per studio', () => {
  it('closes the earlier checkout when the studio opens another, so only the newest can be paid', async () => {
    const p = await start(path.join(dir, 'one-open.sqlite'));
    const earlier = await openCheckout(p, '9');
    const later = await openCheckout(p, '9', earlier.customer);
    const stale = await payOnCheckoutPage(earlier.session.url!, '4242 4242 4242 4242');
    expect(stale.status).toBe(410);
    expect(stale.html).toContain('only one can be open at a time');
    expect((await p.deps.client.checkout.sessions.retrieve(earlier.session.id)).status).toBe('expired');
    expect((await payOnCheckoutPage(later.session.url!, '4242 4242 4242 4242')).status).toBe(303);
    expect([...p.fake.store.subscriptions.values()]).toHaveLength(1);
    await p.fake.settled();
    expect(p.fake.deliveries.map((d) => d.event.type)).toContain('checkout.session.expired');
  });

  it('leaves another studio’s open checkout alone', async () => {
    const p = await start(path.join(dir, 'two-studios.sqlite'));
    const a = await openCheckout(p, '1');
    await openCheckout(p, '2');
    expect((await fetch(a.session.url!)).status).toBe(200);
  });
});

describe('the page is Treadle’s own test checkout', () => {
  it('uses Treadle’s ids, words, palette and fonts, not a provider’s conventions, and a card field that looks empty', async () => {
    const p = await start(path.join(dir, 'page.sqlite'));
    const { session } = await openCheckout(p, '5');
    expect(session.id).toMatch(/^treadle-test-checkout-[0-9a-f]{18}$/);
    expect(session.customer).toMatch(/^treadle-test-customer-/);
    const res = await fetch(session.url!);
    const html = await res.text();
    expect(html).toContain('<h1>Treadle test checkout — no real money moves</h1>');
    expect(html).toContain('runs on this computer together with Treadle');
    // No provider-style ids (cs_…, cus_…, sub_…) and no "test mode" pill anywhere on the page.
    expect(html).not.toMatch(/\b(cs|cus|sub|pi|pm|evt|in)_test_/);
    expect(html).not.toMatch(/test mode/i);
    // The card field is empty and has no placeholder that could pass for a card number already filled in.
    const cardInput = /<input id="card"[^>]*>/.exec(html)![0];
    expect(cardInput).not.toMatch(/placeholder=/);
    expect(cardInput).toContain('value=""');
    // Treadle's palette (constants/theme.ts) and fonts, served by the service itself under a CSP that allows only them.
    for (const colour of [colors.paper, colors.ink, colors.ember]) expect(html).toContain(colour);
    expect(html).toMatch(/font-family: "SpaceGrotesk_700Bold"; src: url\("\/fonts\/SpaceGrotesk_700Bold\.ttf"\)/);
    expect(res.headers.get('content-security-policy')).toContain("font-src 'self'");
    const font = await fetch(`${p.fake.url}/fonts/SpaceGrotesk_700Bold.ttf`);
    expect(font.status).toBe(200);
    // TrueType files begin with the sfnt version 0x00010000 (OpenType spec, "Organization of an OpenType Font").
    expect(Buffer.from(await font.arrayBuffer()).subarray(0, 4).toString('hex')).toBe('00010000');
    expect((await fetch(`${p.fake.url}/fonts/..%2Fpackage.json`)).status).toBe(404);
  });
});
