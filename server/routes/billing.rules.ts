import type { RouteRule } from '../permissions';

const OWNER: RouteRule['access'] = ['owner'];

/** Permission rules of the plan and billing routes (server/routes/billing.ts). */
export const billingRules: RouteRule[] = [
  // Plans and prices are what a studio reads before it signs up, and hold nothing of any team's.
  { method: 'GET', path: '/plans', action: 'plans.read', label: 'See the plans', access: 'public' },
  // Every member may ask; the answer is shaped by role (the owner sees usage and invoices, others the plan's name).
  { method: 'GET', path: '/billing', action: 'billing.read', label: 'See the studio’s plan', access: 'member' },
  { method: 'POST', path: '/billing/checkout', action: 'billing.manage', label: 'Change the plan and subscription', access: OWNER },
  { method: 'POST', path: '/billing/plan', action: 'billing.manage', label: 'Change the plan and subscription', access: OWNER },
  { method: 'POST', path: '/billing/cancel', action: 'billing.manage', label: 'Change the plan and subscription', access: OWNER },
  { method: 'POST', path: '/billing/resume', action: 'billing.manage', label: 'Change the plan and subscription', access: OWNER },
  // The provider calls this; the signature on the raw body is its authentication (checked in the route).
  { method: 'POST', path: '/billing/webhook', action: 'billing.webhook', label: 'Receive payment news', access: 'public' },
];
