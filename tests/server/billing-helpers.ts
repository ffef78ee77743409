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

/** Adds `n` characters straight in the database (the characters feature's own table), oldest first. */
export async function addCharacters(t: TestApp, teamId: number, uploadedBy: number, n: number): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 0; i < n; i += 1) {
    const [id] = await t.db('characters').insert({
      team_id: teamId,
      name: `Crawler ${i + 1}`,
      file_name: `crawler-${i + 1}.glb`,
      format: 'glb',
      sha256: `${teamId}-${i}`.padEnd(64, '0'),
      byte_size: 1024,
      joint_count: 12,
      leg_count: 6,
      skeleton_json: '{}',
      detected_legs_json: '[]',
      legs_json: '[]',
      report_json: '{}',
      uploaded_by: uploadedBy,
      created_at: 5000 + i,
      updated_at: 5000 + i,
    });
    ids.push(id);
  }
  return ids;
}

export const DAY = 24 * 3600;
