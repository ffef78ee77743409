import type { RouteRule } from '../permissions';

/** Permission rules of the plan and billing routes (server/routes/billing.ts). */
export const billingRules: RouteRule[] = [];
