import express, { Router, type Response } from 'express';
import type { PaymentsStore } from './store';
import type { WebhookSender } from './webhooks';
import { tryCard } from './test-cards';

type Session = ReturnType<PaymentsStore['sessions']['get']> & {};

/** The fake's own hosted checkout page: a plain server-rendered form, clearly a local test stand-in. */
export function checkoutPage(store: PaymentsStore, sender: WebhookSender): Router {
  const page = Router();
  page.use(express.urlencoded({ extended: false, limit: '10kb' }));

  page.get('/pay/:id', (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) return void send(res, 404, finishedPage('This checkout does not exist.'), null);
    if (session.status !== 'open') return void send(res, 410, finishedPage('This checkout has already finished.'), session);
    send(res, 200, payPage(store, session, {}), session);
  });

  page.post('/pay/:id', async (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session || session.status !== 'open') return void send(res, 410, finishedPage('This checkout has already finished.'), session ?? null);
    const form = req.body as Record<string, string | undefined>;
    const problems: Record<string, string> = {};
    if (!/^(0[1-9]|1[0-2])\s*\/\s*\d{2}$/.test(form.expiry ?? '')) problems.expiry = 'Enter the expiry as MM / YY, e.g. 12 / 30.';
    if (!/^\d{3,4}$/.test(form.cvc ?? '')) problems.cvc = 'Enter the 3 or 4 digits of the security code.';
    const card = tryCard(form.card ?? '');
    // A decline is said once, above the form; a number that is no test card is a problem of the field.
    if (!card.ok && card.code === 'not_a_test_card') problems.card = card.message;
    if (!card.ok || Object.keys(problems).length) {
      const refusal = !card.ok && card.code === 'card_declined' ? card.message : undefined;
      return void send(res, refusal ? 402 : 400, payPage(store, session, { problems, refusal, name: form.name }), session);
    }
    store.completeCheckout(session.id, card);
    // Treadle hears of the payment before the owner lands back on it, so the new plan is there to see.
    await sender.settled();
    res.redirect(303, String(session.success_url).replace('{CHECKOUT_SESSION_ID}', session.id));
  });

  return page;
}

function send(res: Response, status: number, html: string, session: Session | null) {
  const returnOrigins = session ? [session.success_url, session.cancel_url].filter(Boolean).map((u) => new URL(String(u)).origin) : [];
  res
    .status(status)
    .set({
      'Content-Type': 'text/html; charset=utf-8',
      'Cache-Control': 'no-store',
      // Chromium applies form-action to the redirect after the form, so Treadle's origin must be allowed there.
      'Content-Security-Policy': `default-src 'none'; style-src 'unsafe-inline'; form-action 'self' ${returnOrigins.join(' ')}; base-uri 'none'; frame-ancestors 'none'`,
      'Referrer-Policy': 'no-referrer',
    })
    .send(html);
}

const esc = (s: unknown) => String(s ?? '').replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const money = (minor: number, currency: string) => new Intl.NumberFormat('en-IE', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);

interface PageState {
  problems?: Record<string, string>;
  refusal?: string;
  name?: string;
}

function payPage(store: PaymentsStore, session: Session, state: PageState): string {
  const price = store.prices.get(session.line_price);
  const product = price ? store.products.get(price.product as string) : undefined;
  const amount = money(session.amount_total as number, String(session.currency));
  const p = state.problems ?? {};
  const field = (name: string, label: string, attrs: string, value = '') => `
      <label for="${name}">${label}</label>
      <input id="${name}" name="${name}" ${attrs} value="${esc(value)}"${p[name] ? ` aria-invalid="true" aria-describedby="${name}-problem"` : ''}>
      ${p[name] ? `<p class="problem" id="${name}-problem">${esc(p[name])}</p>` : ''}`;
  return layout(`
    <p class="badge">Test mode</p>
    <h1>Test payment page — no real money moves</h1>
    <p class="lede">A local stand-in for the payment service, started with Treadle. It accepts only the test card numbers below and never keeps a card number.</p>
    <section class="order" aria-label="Order">
      <div><span>${esc(product?.name ?? 'Subscription')}</span><span class="fig">${amount} / month</span></div>
      <p class="small">Prices are before tax. Billed monthly until cancelled.</p>
    </section>
    ${state.refusal ? `<div class="refusal" role="alert"><strong>Payment refused.</strong> ${esc(state.refusal)}</div>` : ''}
    <form method="post" action="/pay/${esc(session.id)}" novalidate>
      ${field('card', 'Card number', 'inputmode="numeric" autocomplete="off" placeholder="4242 4242 4242 4242"')}
      <div class="row">
        <div>${field('expiry', 'Expiry (MM / YY)', 'inputmode="numeric" autocomplete="off" placeholder="12 / 30"')}</div>
        <div>${field('cvc', 'Security code', 'inputmode="numeric" autocomplete="off" placeholder="123"')}</div>
      </div>
      ${field('name', 'Name on card', 'autocomplete="off"', state.name)}
      <button type="submit">Pay ${amount}</button>
    </form>
    ${session.cancel_url ? `<p><a href="${esc(session.cancel_url)}">Cancel and go back to Treadle</a></p>` : ''}
    <aside class="cards" aria-label="Test cards">
      <h2>Test cards</h2>
      <ul>
        <li><span class="fig">4242 4242 4242 4242</span> payment succeeds</li>
        <li><span class="fig">4000 0000 0000 0002</span> card is declined</li>
      </ul>
      <p class="small">Any future expiry and any three digits.</p>
    </aside>`);
}

function finishedPage(message: string): string {
  return layout(`<p class="badge">Test mode</p><h1>Test payment page — no real money moves</h1><p class="lede">${esc(message)}</p>`);
}

function layout(body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test payment — no real money moves</title>
<style>
  :root { --paper:#F5F1E8; --ink:#1E252B; --graphite:#5A6670; --ember:#E4572E; --rule:#D8D1C2; --card:#FBF9F4; --danger:#B3261E; }
  * { box-sizing: border-box; }
  body { margin:0; background:var(--paper); color:var(--ink); font: 16px/1.45 system-ui, -apple-system, "Segoe UI", sans-serif; }
  main { max-width: 480px; margin: 0 auto; padding: 24px 16px 48px; }
  h1 { font-size: 24px; line-height: 1.2; margin: 8px 0; }
  h2 { font-size: 16px; margin: 0 0 8px; }
  .badge { display:inline-block; margin:0; padding:2px 10px; border:2px dashed var(--ember); border-radius:999px; color:var(--ember); font-weight:700; font-size:13px; letter-spacing:.04em; text-transform:uppercase; }
  .lede, .small { color: var(--graphite); }
  .small { font-size: 13px; margin: 4px 0 0; }
  .order { background: var(--card); border:1px solid var(--rule); border-radius:16px; padding:16px; margin:16px 0; }
  .order div { display:flex; justify-content:space-between; gap:12px; font-weight:600; }
  .fig { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-variant-numeric: tabular-nums; }
  form { display:flex; flex-direction:column; gap:6px; }
  label { font-weight:600; font-size:14px; margin-top:8px; }
  input { min-height:44px; padding:8px 12px; font:inherit; border:1.5px solid var(--rule); border-radius:10px; background:#fff; color:var(--ink); width:100%; }
  input[aria-invalid="true"] { border-color: var(--danger); }
  .row { display:flex; gap:12px; } .row > div { flex:1; display:flex; flex-direction:column; gap:6px; }
  .problem { color: var(--danger); font-size: 13px; margin: 0; }
  button { margin-top:16px; min-height:48px; border:0; border-radius:10px; background:var(--ember); color:var(--paper); font:inherit; font-weight:700; cursor:pointer; }
  button:hover { background:#C4461F; }
  a { color: var(--ink); display:inline-block; min-height:44px; line-height:44px; }
  .refusal { border-left:4px solid var(--danger); background:#F6E3DF; padding:12px; border-radius:6px; margin: 8px 0 16px; }
  .cards { margin-top: 24px; border-top: 1px solid var(--rule); padding-top: 16px; }
  .cards ul { list-style:none; padding:0; margin:0; display:flex; flex-direction:column; gap:6px; }
</style></head>
<body><main>${body}</main></body></html>`;
}
