import path from 'node:path';
import express, { Router, type Response } from 'express';
import type { PaymentsStore } from './store';
import type { WebhookSender } from './webhooks';
import { tryCard } from './test-cards';
import { colors, fonts } from '../../../constants/palette';
import { projectRoot } from '../../config';

type Session = ReturnType<PaymentsStore['sessions']['get']> & {};

/** The fake's own hosted checkout page: a plain server-rendered form in Treadle's identity, plainly a test on this machine. */
export function checkoutPage(store: PaymentsStore, sender: WebhookSender): Router {
  const page = Router();
  page.use(express.urlencoded({ extended: false, limit: '10kb' }));

  page.get('/fonts/:file', (req, res) => {
    if (!CHECKOUT_FONTS[req.params.file]) return void res.status(404).type('text/plain').send('No such font.');
    res.set('Cache-Control', 'public, max-age=86400').type('font/ttf').sendFile(path.join(projectRoot, 'fonts', req.params.file));
  });

  page.get('/pay/:id', (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) return void send(res, 404, finishedPage('This checkout does not exist.'), null);
    if (!store.isOpen(session)) return void send(res, 410, finishedPage(closedReason(session)), session);
    send(res, 200, payPage(store, session, {}), session);
  });

  page.post('/pay/:id', async (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session || !store.isOpen(session)) return void send(res, 410, finishedPage(session ? closedReason(session) : 'This checkout does not exist.'), session ?? null);
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

function closedReason(session: Session): string {
  if (session.replaced) return 'The studio opened a newer checkout, which replaces this one: only one can be open at a time. Go back to Treadle and use the newest, or start again.';
  if (session.status === 'expired') return 'This checkout has expired. Go back to Treadle and start the checkout again.';
  return 'This checkout has already been paid. Nothing more to do here.';
}

function send(res: Response, status: number, html: string, session: Session | null) {
  const returnOrigins = session ? [session.success_url, session.cancel_url].filter(Boolean).map((u) => new URL(String(u)).origin) : [];
  res
    .status(status)
    .set({
      'Content-Type': 'text/html; charset=utf-8',
      'Cache-Control': 'no-store',
      // Chromium applies form-action to the redirect after the form, so Treadle's origin must be allowed there.
      'Content-Security-Policy': `default-src 'none'; style-src 'unsafe-inline'; font-src 'self'; form-action 'self' ${returnOrigins.join(' ')}; base-uri 'none'; frame-ancestors 'none'`,
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
  const field = (name: string, label: string, attrs: string, hint = '', value = '') => {
    const described = [hint ? `${name}-hint` : '', p[name] ? `${name}-problem` : ''].filter(Boolean).join(' ');
    return `
      <label for="${name}">${label}</label>
      ${hint ? `<p class="hint" id="${name}-hint">${hint}</p>` : ''}
      <input id="${name}" name="${name}" ${attrs} value="${esc(value)}"${p[name] ? ' aria-invalid="true"' : ''}${described ? ` aria-describedby="${described}"` : ''}>
      ${p[name] ? `<p class="problem" id="${name}-problem">${esc(p[name])}</p>` : ''}`;
  };
  return layout(`
    <h1>Treadle test checkout — no real money moves</h1>
    ${onThisMachine}
    <section class="slip" aria-label="What you are paying for">
      <p class="slip-label">Plan</p>
      <div class="slip-row"><span class="plan">${esc(product?.name ?? 'Subscription')}</span><span class="fig">${amount} a month</span></div>
      <p class="small">Before tax. Billed monthly until the studio cancels. Reference <span class="fig">${esc(session.id)}</span></p>
    </section>
    ${state.refusal ? `<div class="refusal" role="alert"><strong>Payment refused.</strong> ${esc(state.refusal)}</div>` : ''}
    <form method="post" action="/pay/${esc(session.id)}" novalidate>
      ${field('card', 'Card number', 'inputmode="numeric" autocomplete="off"', 'Type one of the test numbers listed below. Never a real card.')}
      <div class="row">
        <div>${field('expiry', 'Expiry (MM / YY)', 'inputmode="numeric" autocomplete="off" placeholder="MM / YY"')}</div>
        <div>${field('cvc', 'Security code', 'inputmode="numeric" autocomplete="off" placeholder="3 digits"')}</div>
      </div>
      ${field('name', 'Name on card', 'autocomplete="off"', '', state.name)}
      <button type="submit">Pay ${amount}</button>
    </form>
    ${session.cancel_url ? `<p><a href="${esc(session.cancel_url)}">Cancel and go back to Treadle</a></p>` : ''}
    <section class="cards" aria-label="Test cards">
      <h2>Test cards</h2>
      <table>
        <tr><td class="fig">4242 4242 4242 4242</td><td>the payment goes through</td></tr>
        <tr><td class="fig">4000 0000 0000 0002</td><td>the card is declined</td></tr>
      </table>
      <p class="small">With any expiry in the future and any three digits. Every other number is refused.</p>
    </section>`);
}

const onThisMachine = `<p class="note">This page belongs to Treadle’s own test payment service, which runs on this computer together with Treadle. It takes only the test card numbers listed below, keeps no card number, and charges nothing.</p>`;

function finishedPage(message: string): string {
  return layout(`<h1>Treadle test checkout — no real money moves</h1>${onThisMachine}<p class="lede">${esc(message)}</p>`);
}

/** The font files the page may load from this service (Treadle's own, SIL Open Font License). */
export const CHECKOUT_FONTS: Record<string, string> = {
  [`${fonts.heading}.ttf`]: fonts.heading,
  [`${fonts.body}.ttf`]: fonts.body,
  [`${fonts.bodyStrong}.ttf`]: fonts.bodyStrong,
  [`${fonts.mono}.ttf`]: fonts.mono,
};

const fontFaces = Object.entries(CHECKOUT_FONTS)
  .map(([file, family]) => `@font-face { font-family: "${family}"; src: url("/fonts/${file}") format("truetype"); font-display: swap; }`)
  .join('\n  ');

function layout(body: string): string {
  const c = colors;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Treadle test checkout — no real money moves</title>
<style>
  ${fontFaces}
  * { box-sizing: border-box; }
  body { margin:0; background:${c.paper}; color:${c.ink}; font: 16px/1.45 "${fonts.body}", system-ui, sans-serif; }
  header { background:${c.ink}; color:${c.onInk}; }
  header div { max-width: 520px; margin: 0 auto; padding: 14px 16px; display:flex; align-items:baseline; justify-content:space-between; gap:12px; flex-wrap:wrap; }
  .wordmark { font: 24px/1 "${fonts.heading}", system-ui, sans-serif; letter-spacing: .01em; }
  .wordmark span { color:${c.ember}; }
  .where { font-size: 13px; color:${c.rule}; }
  main { max-width: 520px; margin: 0 auto; padding: 20px 16px 48px; }
  h1 { font: 25px/30px "${fonts.heading}", system-ui, sans-serif; margin: 8px 0 12px; }
  h2 { font: 17px/22px "${fonts.heading}", system-ui, sans-serif; margin: 0 0 8px; }
  .note { margin:0 0 16px; padding:12px 14px; background:${c.paperDeep}; border-left:4px solid ${c.ember}; border-radius:6px; font-size:14px; }
  .lede, .small, .hint { color:${c.graphite}; }
  .small, .hint { font-size: 13px; margin: 4px 0 0; }
  .slip { background:${c.card}; border:1px solid ${c.rule}; border-radius:10px; padding:14px 16px; margin:0 0 16px; }
  .slip-label { margin:0; font-size:12px; letter-spacing:.06em; text-transform:uppercase; color:${c.graphite}; }
  .slip-row { display:flex; justify-content:space-between; align-items:baseline; gap:12px; margin-top:4px; }
  .plan { font: 20px/26px "${fonts.heading}", system-ui, sans-serif; }
  .fig { font-family: "${fonts.mono}", ui-monospace, monospace; font-variant-numeric: tabular-nums; }
  form { display:flex; flex-direction:column; gap:6px; }
  label { font-family:"${fonts.bodyStrong}", system-ui, sans-serif; font-size:14px; margin-top:10px; }
  .hint { margin:0; }
  input { min-height:44px; padding:8px 12px; font:inherit; border:1.5px solid ${c.rule}; border-radius:10px; background:${c.card}; color:${c.ink}; width:100%; }
  input::placeholder { color:${c.graphite}; opacity:.7; }
  input:focus { outline: 3px solid ${c.ember}; outline-offset: 1px; }
  input[aria-invalid="true"] { border-color:${c.danger}; }
  .row { display:flex; gap:12px; } .row > div { flex:1; display:flex; flex-direction:column; gap:6px; }
  .problem { color:${c.danger}; font-size:13px; margin:0; }
  button { margin-top:18px; min-height:48px; border:0; border-radius:10px; background:${c.ember}; color:${c.onInk}; font: 16px "${fonts.bodyStrong}", system-ui, sans-serif; cursor:pointer; }
  button:hover { background:${c.emberPressed}; }
  a { color:${c.ink}; display:inline-block; min-height:44px; line-height:44px; font-family:"${fonts.bodyStrong}", system-ui, sans-serif; }
  .refusal { border-left:4px solid ${c.danger}; background:#F6E3DF; padding:12px; border-radius:6px; margin: 0 0 12px; }
  .cards { margin-top: 24px; border-top: 1px solid ${c.rule}; padding-top: 16px; }
  .cards table { border-collapse: collapse; width: 100%; }
  .cards td { padding: 6px 0; border-bottom: 1px solid ${c.rule}; vertical-align: top; }
  .cards td.fig { white-space: nowrap; padding-right: 16px; }
</style></head>
<body><header><div><span class="wordmark">Treadle<span>.</span></span><span class="where">Test checkout · on this computer</span></div></header><main>${body}</main></body></html>`;
}
