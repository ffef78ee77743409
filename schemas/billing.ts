import { z } from 'zod';

/** Treadle's three team plans (our own names). */
export const planIdSchema = z.enum(['solo', 'crew', 'studio'], { error: 'Choose one of the plans: solo, crew or studio.' });
export type PlanId = z.infer<typeof planIdSchema>;

/** What a plan limits. Seats and characters are counted as they stand; the other two per calendar month (UTC). */
export const limitKindSchema = z.enum(['seats', 'characters', 'dialInCandidates', 'profilePublishes']);
export type LimitKind = z.infer<typeof limitKindSchema>;

export const limitsSchema = z.object({
  seats: z.number().int(),
  characters: z.number().int(),
  dialInCandidates: z.number().int(),
  profilePublishes: z.number().int(),
});
export type Limits = z.infer<typeof limitsSchema>;

export const planSchema = z.object({
  id: planIdSchema,
  name: z.string(),
  blurb: z.string(),
  /** Monthly price before tax, in the currency's minor unit (cents). 0 for the free plan. */
  monthlyPrice: z.number().int(),
  currency: z.string(),
  limits: limitsSchema,
});
export type Plan = z.infer<typeof planSchema>;

/** GET /api/plans */
export const plansResponseSchema = z.object({ plans: z.array(planSchema), testMode: z.boolean() });
export type PlansResponse = z.infer<typeof plansResponseSchema>;

export const usageSchema = z.object({
  kind: limitKindSchema,
  label: z.string(),
  used: z.number().int(),
  limit: z.number().int(),
  period: z.enum(['total', 'month']),
  /** How many items sit beyond the limit and are read-only until the team is back under it (stock kinds only). */
  readOnly: z.number().int(),
});
export type Usage = z.infer<typeof usageSchema>;

export const invoiceSchema = z.object({
  id: z.string(),
  number: z.string().nullable(),
  status: z.string(),
  description: z.string(),
  /** Minor units; negative when a plan change left a credit. */
  total: z.number().int(),
  amountPaid: z.number().int(),
  currency: z.string(),
  createdAt: z.number().int(),
  periodStart: z.number().int(),
  periodEnd: z.number().int(),
});
export type Invoice = z.infer<typeof invoiceSchema>;

/** The provider's subscription status, or "free" while the team has never paid or its subscription has ended. */
export const billingStatusSchema = z.enum(['free', 'active', 'trialing', 'past_due', 'unpaid', 'canceled', 'incomplete', 'incomplete_expired', 'paused']);
export type BillingStatus = z.infer<typeof billingStatusSchema>;

/** GET /api/billing as the owner sees it. Times are epoch milliseconds. */
export const ownerBillingSchema = z.object({
  view: z.literal('owner'),
  plan: planSchema,
  status: billingStatusSchema,
  cancelAtPeriodEnd: z.boolean(),
  currentPeriodEnd: z.number().int().nullable(),
  usage: z.array(usageSchema),
  invoices: z.array(invoiceSchema),
  testMode: z.boolean(),
});
export type OwnerBilling = z.infer<typeof ownerBillingSchema>;

/** GET /api/billing as every other role sees it: the plan's name only. */
export const memberBillingSchema = z.object({
  view: z.literal('member'),
  plan: z.object({ id: planIdSchema, name: z.string() }),
});
export type MemberBilling = z.infer<typeof memberBillingSchema>;

export const billingViewSchema = z.discriminatedUnion('view', [ownerBillingSchema, memberBillingSchema]);
export type BillingView = z.infer<typeof billingViewSchema>;

/** POST /api/billing/checkout and POST /api/billing/plan */
export const choosePlanSchema = z.object({ plan: planIdSchema });
export type ChoosePlanInput = z.infer<typeof choosePlanSchema>;

/** POST /api/billing/checkout answers with the address of the payment service's checkout page. */
export const checkoutResponseSchema = z.object({ url: z.string() });
export type CheckoutResponse = z.infer<typeof checkoutResponseSchema>;
