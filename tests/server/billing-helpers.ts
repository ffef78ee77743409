import type { TestApp } from '../support/test-app';

/** Submits the fake's hosted checkout form the way a browser does (a urlencoded POST), without following the redirect. */
export async function payOnCheckoutPage(checkoutUrl: string, card: string) {
  const body = new URLSearchParams({ card, expiry: '12 / 34', cvc: '123', name: 'Ottoline Gear' });
  const res = await fetch(checkoutUrl, { method: 'POST', body, redirect: 'manual', headers: { 'Content-Type': 'application/x-www-form-urlencoded' } });
  return { status: res.status, location: res.headers.get('location'), html: await res.text() };
}

/** Adds `n` plain members to a team straight in the database, one millisecond apart so their order is clear. */
export async function addMembers(t: TestApp, teamId: number, n: number, from = 100): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 0; i < n; i += 1) {
    const [id] = await t.db('users').insert({ email: `extra${from + i}@team${teamId}.test`, name: `Extra ${from + i}`, password_hash: 'x', created_at: 1 });
    await t.db('memberships').insert({ team_id: teamId, user_id: id, role: 'designer', created_at: 1000 + from + i });
    ids.push(id);
  }
  return ids;
}

export const DAY = 24 * 3600;
