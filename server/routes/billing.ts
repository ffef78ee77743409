import express from 'express';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { choosePlanSchema, type CheckoutResponse } from '../../schemas/billing';
import { billingViewFor, changePlan, plansList, setCancelAtPeriodEnd, startCheckout } from '../services/billing';
import { handleWebhook } from '../services/billing-webhooks';
import { OWNER } from '../role-sets';
import { declareRoutes, permission } from './declare';

/** Plans and prices are what a studio reads before it signs up, and hold nothing of any team's. */
const PLANS = permission('plans.read', 'See the plans', 'public');
/** Every member may ask; the answer is shaped by role (the owner sees usage and invoices, others the plan's name). */
const READ = permission('billing.read', 'See the studio’s plan', 'member');
const MANAGE = permission('billing.manage', 'Change the plan and subscription', OWNER);
/** The provider calls this; the signature on the raw body is its authentication (checked in the route). */
const WEBHOOK = permission('billing.webhook', 'Receive payment news', 'public');

/** GET /api/plans. */
export function plansRoutes(deps: AppDeps) {
  const routes = declareRoutes('/plans');
  routes.get('/', PLANS, (_req, res) => {
    res.json(plansList(deps));
  });
  return routes;
}

/** The studio's plan: checkout, subscription changes, invoices. */
export function billingRoutes(deps: AppDeps) {
  const routes = declareRoutes('/billing');

  routes.get('/', READ, async (req, res) => {
    res.json(await billingViewFor(deps, viewerOf(req)));
  });

  routes.post('/checkout', MANAGE, async (req, res) => {
    const { plan } = parseWith(choosePlanSchema, req.body);
    const answer: CheckoutResponse = { url: await startCheckout(deps, viewerOf(req), plan) };
    res.json(answer);
  });

  routes.post('/plan', MANAGE, async (req, res) => {
    const { plan } = parseWith(choosePlanSchema, req.body);
    const viewer = viewerOf(req);
    await changePlan(deps, viewer, plan);
    res.json(await billingViewFor(deps, viewer));
  });

  routes.post('/cancel', MANAGE, async (req, res) => {
    const viewer = viewerOf(req);
    await setCancelAtPeriodEnd(deps, viewer, true);
    res.json(await billingViewFor(deps, viewer));
  });

  routes.post('/resume', MANAGE, async (req, res) => {
    const viewer = viewerOf(req);
    await setCancelAtPeriodEnd(deps, viewer, false);
    res.json(await billingViewFor(deps, viewer));
  });

  return routes;
}

/** The payment service's webhook: mounted before the JSON parser, since its signature covers the raw body. */
export function billingWebhookRoutes(deps: AppDeps) {
  const routes = declareRoutes('/billing/webhook');
  routes.post('/', WEBHOOK, express.raw({ type: () => true, limit: '512kb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    res.json({ received: true, ...(await handleWebhook(deps, body, req.get('stripe-signature'))) });
  });
  return routes;
}
