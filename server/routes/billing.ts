import { Router } from 'express';
import type { AppDeps } from '../deps';

/** Plans, checkout, subscription changes, invoices (JSON routes under /api). */
export function billingRouter(_deps: AppDeps): Router {
  return Router();
}

/** The payment service's webhook: mounted before the JSON parser, since its signature covers the raw body. */
export function billingWebhookRouter(_deps: AppDeps): Router {
  return Router();
}
