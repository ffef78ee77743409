import type Stripe from 'stripe';
import type { PlanId } from '../../schemas/billing';
import { PLANS, priceLookupKey } from './plans';

const catalogs = new WeakMap<Stripe, Promise<Map<PlanId, string>>>();

/**
 * The provider's price id of each paid plan, found by lookup key and created when missing
 * (the first start against an empty local test service). Remembered per client for the life of the process.
 */
export function priceIds(client: Stripe): Promise<Map<PlanId, string>> {
  let catalog = catalogs.get(client);
  if (!catalog) {
    catalog = ensureCatalog(client);
    catalog.catch(() => catalogs.delete(client));
    catalogs.set(client, catalog);
  }
  return catalog;
}

async function ensureCatalog(client: Stripe): Promise<Map<PlanId, string>> {
  const paid = PLANS.filter((p) => p.monthlyPrice > 0);
  const existing = await client.prices.list({ lookup_keys: paid.map((p) => priceLookupKey(p.id)), limit: 10 });
  const ids = new Map<PlanId, string>();
  for (const plan of paid) {
    const found = existing.data.find((price) => price.lookup_key === priceLookupKey(plan.id));
    if (found) {
      ids.set(plan.id, found.id);
      continue;
    }
    const product = await client.products.create({ name: `Treadle ${plan.name}`, metadata: { plan: plan.id } });
    const price = await client.prices.create({
      product: product.id,
      unit_amount: plan.monthlyPrice,
      currency: plan.currency,
      recurring: { interval: 'month' },
      lookup_key: priceLookupKey(plan.id),
      metadata: { plan: plan.id },
    });
    ids.set(plan.id, price.id);
  }
  return ids;
}
