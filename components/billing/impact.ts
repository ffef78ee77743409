import type { Plan, Usage } from '../../schemas/billing';

/** What would turn read-only on `target`, in words: "11 seats and 2 characters"; null when everything fits. */
export function readOnlyAfter(usage: readonly Usage[], target: Plan): string | null {
  const parts = usage
    .filter((u) => u.period === 'total' && u.used > target.limits[u.kind])
    .map((u) => `${u.used - target.limits[u.kind]} ${u.kind === 'seats' ? 'seats' : 'characters'}`);
  return parts.length ? parts.join(' and ') : null;
}
