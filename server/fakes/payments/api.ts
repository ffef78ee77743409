import express, { type Request, type Response, type NextFunction, Router } from 'express';
import type { PaymentsStore } from './store';
import { FakeApiError } from './errors';

type Params = Record<string, unknown>;

/** The provider's REST API under /v1, for the calls Treadle makes through the stripe SDK. */
export function paymentsApi(store: PaymentsStore, pageBase: () => string): Router {
  const api = Router();
  api.use(express.urlencoded({ extended: true, limit: '100kb' }));
  api.use(requireTestKey);
  api.use(replayIdempotentPosts());

  const body = (req: Request) => (req.body ?? {}) as Params;
  const list = (data: unknown[], url: string) => ({ object: 'list', data, has_more: false, url });

  api.post('/customers', (req, res) => void res.json(store.createCustomer(body(req))));
  api.get('/customers/:id', (req, res) => void res.json(store.get(store.customers, 'customer', req.params.id)));

  api.post('/products', (req, res) => void res.json(store.createProduct(body(req))));
  api.get('/products/:id', (req, res) => void res.json(store.get(store.products, 'product', req.params.id)));

  api.post('/prices', (req, res) => void res.json(store.createPrice(body(req))));
  api.get('/prices', (req, res) => {
    const keys = asArray(req.query.lookup_keys);
    const expandProduct = asArray(req.query.expand).includes('data.product');
    const prices = [...store.prices.values()]
      .filter((p) => p.active && (!keys.length || keys.includes(String(p.lookup_key))))
      .map((p) => (expandProduct ? { ...p, product: store.products.get(p.product as string) } : p));
    res.json(list(prices, '/v1/prices'));
  });
  api.get('/prices/:id', (req, res) => void res.json(store.get(store.prices, 'price', req.params.id)));

  api.post('/checkout/sessions', (req, res) => void res.json(store.publicSession(store.createCheckoutSession(body(req), pageBase()))));
  api.get('/checkout/sessions/:id', (req, res) => void res.json(store.publicSession(store.get(store.sessions, 'checkout session', req.params.id))));

  api.get('/subscriptions/:id', (req, res) => void res.json(store.get(store.subscriptions, 'subscription', req.params.id)));
  api.post('/subscriptions/:id', (req, res) => void res.json(store.updateSubscription(req.params.id, body(req))));
  api.delete('/subscriptions/:id', (req, res) => void res.json(store.cancelNow(req.params.id)));

  api.get('/invoices', (req, res) => {
    const filter = { customer: str(req.query.customer), subscription: str(req.query.subscription) };
    res.json(list(store.listInvoices(filter), '/v1/invoices'));
  });
  api.get('/invoices/:id', (req, res) => void res.json(store.get(store.invoices, 'invoice', req.params.id)));

  api.use((req, _res, next) => next(new FakeApiError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.originalUrl}). This local fake serves only the calls Treadle makes.`)));
  api.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    const error = err instanceof FakeApiError ? err : new FakeApiError(500, 'api_error', 'The fake payment service failed.');
    res.status(error.status).json(error.body());
  });
  return api;
}

/** Only test-mode secret keys: the fake is never to be mistaken for the real service. */
function requireTestKey(req: Request, _res: Response, next: NextFunction) {
  const key = /^Bearer (.+)$/.exec(req.get('authorization') ?? '')?.[1] ?? '';
  if (!key.startsWith('sk_test_')) return next(new FakeApiError(401, 'authentication_error', 'This fake accepts only test-mode secret keys (sk_test_…).'));
  next();
}

/** A POST repeated with the same Idempotency-Key (the SDK's retries) gets the first answer again, not a second object. */
function replayIdempotentPosts() {
  const answers = new Map<string, { status: number; body: unknown }>();
  return (req: Request, res: Response, next: NextFunction) => {
    const key = req.method === 'POST' ? req.get('idempotency-key') : undefined;
    if (!key) return next();
    const seen = answers.get(key);
    if (seen) return void res.status(seen.status).json(seen.body);
    const json = res.json.bind(res);
    res.json = (payload: unknown) => {
      answers.set(key, { status: res.statusCode, body: payload });
      return json(payload);
    };
    next();
  };
}

const str = (v: unknown) => (typeof v === 'string' ? v : undefined);
const asArray = (v: unknown): string[] => (Array.isArray(v) ? v.map(String) : typeof v === 'string' ? [v] : v && typeof v === 'object' ? Object.values(v).map(String) : []);
