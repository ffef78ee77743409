import type { LimitKind, Plan, PlanId } from '../../schemas/billing';

/**
 * The three team plans. Solo is free and roomy enough for the demo studio (four members and one invite, a few characters);
 * prices are monthly, before tax, in euro cents.
 */
export const PLANS: readonly Plan[] = [
  {
    id: 'solo',
    name: 'Solo',
    blurb: 'Free for a small team trying Treadle on a few characters.',
    monthlyPrice: 0,
    currency: 'eur',
    limits: { seats: 5, characters: 5, dialInCandidates: 500, profilePublishes: 10 },
  },
  {
    id: 'crew',
    name: 'Crew',
    blurb: 'For a studio tuning a game’s whole cast.',
    monthlyPrice: 2400,
    currency: 'eur',
    limits: { seats: 10, characters: 25, dialInCandidates: 5000, profilePublishes: 100 },
  },
  {
    id: 'studio',
    name: 'Studio',
    blurb: 'For several games at once and long dial-in searches.',
    monthlyPrice: 6900,
    currency: 'eur',
    limits: { seats: 30, characters: 100, dialInCandidates: 25000, profilePublishes: 500 },
  },
];

export const FREE_PLAN: PlanId = 'solo';

export function planById(id: PlanId): Plan {
  const plan = PLANS.find((p) => p.id === id);
  if (!plan) throw new Error(`Unknown plan ${id}`);
  return plan;
}

export function isPaidPlan(id: PlanId): boolean {
  return planById(id).monthlyPrice > 0;
}

/** The words a limit is counted in: "3 of 5 characters". */
export const LIMIT_NOUNS: Record<LimitKind, { label: string; noun: string }> = {
  seats: { label: 'Seats', noun: 'seats' },
  characters: { label: 'Characters', noun: 'characters' },
  dialInCandidates: { label: 'Dial-in candidates this month', noun: 'dial-in candidates a month' },
  profilePublishes: { label: 'Profile publishes this month', noun: 'profile publishes a month' },
};

export const LIMIT_PERIODS: Record<LimitKind, 'total' | 'month'> = {
  seats: 'total',
  characters: 'total',
  dialInCandidates: 'month',
  profilePublishes: 'month',
};

/** The smallest plan above `current` whose limit of this kind would take `needed`; null when none would. */
export function upgradeFor(current: PlanId, kind: LimitKind, needed: number): Plan | null {
  const from = PLANS.findIndex((p) => p.id === current);
  return PLANS.slice(from + 1).find((p) => p.limits[kind] >= needed) ?? null;
}

/** The provider's lookup key of a paid plan's monthly price; the catalogue is found and made by it. */
export const priceLookupKey = (id: PlanId) => `treadle_${id}_monthly`;

export function planOfLookupKey(key: string | null | undefined): PlanId | null {
  const plan = PLANS.find((p) => priceLookupKey(p.id) === key);
  return plan ? plan.id : null;
}
