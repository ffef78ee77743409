import express, { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { choosePlanSchema, type CheckoutResponse } from '../../schemas/billing';
import { billingViewFor, changePlan, plansList, setCancelAtPeriodEnd, startCheckout } from '../services/billing';
import { handleWebhook } from '../services/billing-webhooks';

/** Plans, checkout, subscription changes, invoices (JSON routes under /api; who may call each is in billing.rules.ts). */
export function billingRouter(deps: AppDeps): Router {
  const router = Router();

  router.get('/plans', (_req, res) => {
    res.json(plansList(deps));
  });

  router.get('/billing', async (req, res) => {
    res.json(await billingViewFor(deps, viewerOf(req)));
  });

  router.post('/billing/checkout', async (req, res) => {
    const { plan } = parseWith(choosePlanSchema, req.body);
    const answer: CheckoutResponse = { url: await startCheckout(deps, viewerOf(req), plan) };
    res.json(answer);
  });

  router.post('/billing/plan', async (req, res) => {
    const { plan } = parseWith(choosePlanSchema, req.body);
    const viewer = viewerOf(req);
    await changePlan(deps, viewer, plan);
    res.json(await billingViewFor(deps, viewer));
  });

  router.post('/billing/cancel', async (req, res) => {
    const viewer = viewerOf(req);
    await setCancelAtPeriodEnd(deps, viewer, true);
    res.json(await billingViewFor(deps, viewer));
  });

  router.post('/billing/resume', async (req, res) => {
    const viewer = viewerOf(req);
    await setCancelAtPeriodEnd(deps, viewer, false);
    res.json(await billingViewFor(deps, viewer));
  });

  return router;
}

/** The payment service's webhook: mounted before the JSON parser, since its signature covers the raw body. */
export function billingWebhookRouter(deps: AppDeps): Router {
  const router = Router();
  router.post('/', express.raw({ type: () => true, limit: '512kb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    res.json({ received: true, ...(await handleWebhook(deps, body, req.get('stripe-signature'))) });
  });
  return router;
}
