import type { Db } from '../db';
import type { LimitKind, PlanId, Usage } from '../../schemas/billing';
import { HttpError } from '../errors';
import { LIMIT_NOUNS, LIMIT_PERIODS, planById, upgradeFor } from './plans';
import { currentPlanOf } from './billing-state';

/**
 * Plan limits, for every feature to call. Stock kinds (seats, characters) count rows as they stand; monthly kinds
 * (dial-in candidates, profile publishes) count what the team used this UTC month, recorded with consumeAllowance.
 * When a plan shrinks nothing is deleted: the oldest items up to the limit stay writable, the rest are read-only.
 */

type StockKind = 'seats' | 'characters';
type MonthlyKind = 'dialInCandidates' | 'profilePublishes';

/** Where each stock kind is counted and in which order items keep their place (oldest first; the owner's seat first). */
const STOCK: Record<StockKind, { table: string; id: string; order: (q: ReturnType<Db>) => ReturnType<Db> }> = {
  seats: {
    table: 'memberships',
    id: 'user_id',
    order: (q) => q.orderByRaw("case when role = 'owner' then 0 else 1 end").orderBy('created_at').orderBy('user_id'),
  },
  characters: { table: 'characters', id: 'id', order: (q) => q.orderBy('created_at').orderBy('id') },
};

const isStock = (kind: LimitKind): kind is StockKind => LIMIT_PERIODS[kind] === 'total';

/** "2026-12": the month a monthly allowance is counted in. */
export const usageMonth = (now: number) => new Date(now).toISOString().slice(0, 7);

export interface LimitCheck {
  kind: LimitKind;
  plan: PlanId;
  used: number;
  limit: number;
  /** True when `adding` more would still fit. */
  allowed: boolean;
  /** The smallest plan that would allow it, if any. */
  upgradeTo: PlanId | null;
}

export async function usedOf(db: Db, teamId: number, kind: LimitKind, now = Date.now()): Promise<number> {
  if (isStock(kind)) {
    const { table } = STOCK[kind];
    // The characters table belongs to another feature; until it exists a team has none.
    if (!(await db.schema.hasTable(table))) return 0;
    const row = await db(table).where({ team_id: teamId }).count<{ n: number }[]>({ n: '*' }).first();
    return Number(row?.n ?? 0);
  }
  const row = await db('plan_usage').where({ team_id: teamId, kind, month: usageMonth(now) }).first('used');
  return Number(row?.used ?? 0) + (await heldOf(db, teamId, kind, now));
}

/** A reservation not yet tied to its job is counted this long (the job is made right after it, or never). */
const UNATTACHED_HOLD_MS = 60 * 60 * 1000;

/** Allowance held for jobs still queued or running this month (finished ones have turned theirs into use). */
async function heldOf(db: Db, teamId: number, kind: LimitKind, now: number): Promise<number> {
  const row = await db('allowance_reservations as r')
    .leftJoin('jobs as j', 'j.id', 'r.job_id')
    .where({ 'r.team_id': teamId, 'r.kind': kind, 'r.month': usageMonth(now) })
    .whereNull('r.settled_at')
    .where((q) => q.whereIn('j.status', ['queued', 'running']).orWhere((u) => u.whereNull('r.job_id').where('r.created_at', '>', now - UNATTACHED_HOLD_MS)))
    .sum<{ n: number | null }[]>({ n: 'r.amount' })
    .first();
  return Number(row?.n ?? 0);
}

export async function checkLimit(
  db: Db,
  teamId: number,
  kind: LimitKind,
  options: { adding?: number; now?: number; alsoHeld?: number } = {},
): Promise<LimitCheck> {
  const adding = options.adding ?? 1;
  const plan = await currentPlanOf(db, teamId);
  const limit = planById(plan).limits[kind];
  const used = (await usedOf(db, teamId, kind, options.now)) + (options.alsoHeld ?? 0);
  const allowed = used + adding <= limit;
  return { kind, plan, used, limit, allowed, upgradeTo: allowed ? null : (upgradeFor(plan, kind, used + adding)?.id ?? null) };
}

/**
 * Throws 403 plan_limit, saying what the plan allows and which plan to move to, when `adding` more would not fit.
 * For a limit to hold, call it inside the transaction that makes the new item (SQLite runs one write
 * transaction at a time, so two requests cannot both see room for one).
 */
export async function assertWithinLimit(
  db: Db,
  teamId: number,
  kind: LimitKind,
  options: { adding?: number; now?: number; alsoHeld?: number; heldAs?: string } = {},
): Promise<void> {
  const check = await checkLimit(db, teamId, kind, options);
  if (!check.allowed) throw planLimitError(check, options.adding ?? 1, options.heldAs);
}

/**
 * Checks and records use of a monthly allowance in one go; call it inside the transaction that does the work,
 * so a refused or failed job records nothing.
 */
export async function consumeAllowance(trx: Db, teamId: number, kind: MonthlyKind, amount: number, now = Date.now()): Promise<void> {
  await assertWithinLimit(trx, teamId, kind, { adding: amount, now });
  await recordUse(trx, teamId, kind, usageMonth(now), amount);
}

async function recordUse(trx: Db, teamId: number, kind: MonthlyKind, month: string, amount: number): Promise<void> {
  await trx('plan_usage')
    .insert({ team_id: teamId, kind, month, used: amount })
    .onConflict(['team_id', 'kind', 'month'])
    .merge({ used: trx.raw('plan_usage.used + ?', [amount]) });
}

/**
 * Holds `amount` of a monthly allowance for a job about to be accepted, refused with plan_limit when it would not
 * fit beside what is used and held already. The check and the hold are one transaction, so jobs started together
 * cannot each pass on the same room. Tie the hold to its job with attachReservation.
 */
export async function reserveAllowance(db: Db, teamId: number, kind: MonthlyKind, amount: number, now: number): Promise<number> {
  return db.transaction(async (trx) => {
    await assertWithinLimit(trx, teamId, kind, { adding: amount, now });
    const [id] = await trx('allowance_reservations').insert({ team_id: teamId, kind, month: usageMonth(now), amount, created_at: now });
    return id as number;
  });
}

/**
 * The hold now belongs to this job: it counts while the job is queued or running, and not after it failed or was
 * cancelled. A job quick enough to have finished already is settled here instead of in its own commit.
 */
export async function attachReservation(db: Db, reservationId: number, jobId: number): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('allowance_reservations').where({ id: reservationId }).update({ job_id: jobId });
    const job = await trx('jobs').where({ id: jobId }).first('status', 'result', 'finished_at');
    if (job?.status !== 'done') return;
    const tried = Number((JSON.parse(job.result ?? 'null') as { candidatesTried?: number } | null)?.candidatesTried ?? 0);
    await settleReservation(trx, jobId, tried, Number(job.finished_at));
  });
}

/** For an accept that did not go through: gives the whole hold back and passes the error on. */
export function releaseReservation(db: Db, reservationId: number) {
  return async (err: unknown): Promise<never> => {
    await db('allowance_reservations').where({ id: reservationId }).whereNull('settled_at').delete();
    throw err;
  };
}

/**
 * A finished job's hold becomes recorded use of what it actually ran, in the month it was accepted in; the rest
 * is refunded. Call it in the transaction that marks the job done.
 */
export async function settleReservation(trx: Db, jobId: number, used: number, now: number): Promise<void> {
  const held = await trx('allowance_reservations').where({ job_id: jobId }).whereNull('settled_at').first();
  if (!held) return;
  const charged = Math.max(0, Math.min(used, Number(held.amount)));
  await trx('allowance_reservations').where({ id: held.id }).update({ settled_at: now, used: charged });
  await recordUse(trx, held.team_id, held.kind as MonthlyKind, held.month, charged);
}

/**
 * Room for one more seat, checked inside the transaction that sends an invite (open invites hold a seat each,
 * apart from one to the same address, which the new invite replaces) or accepts one (only members count then).
 */
export async function assertSeatFree(trx: Db, teamId: number, options: { now: number; inviting?: string }): Promise<void> {
  const members = await usedOf(trx, teamId, 'seats');
  let invites = 0;
  if (options.inviting !== undefined) {
    const row = await trx('invites')
      .where({ team_id: teamId })
      .whereNull('accepted_at')
      .whereNull('revoked_at')
      .where('expires_at', '>', options.now)
      .whereNot({ email: options.inviting })
      .count<{ n: number }[]>({ n: '*' })
      .first();
    invites = Number(row?.n ?? 0);
  }
  const heldAs = invites ? `${members} ${members === 1 ? 'member' : 'members'} and ${invites} open ${invites === 1 ? 'invite' : 'invites'}` : undefined;
  await assertWithinLimit(trx, teamId, 'seats', { alsoHeld: invites, heldAs });
}

/** The ids of the team's items beyond its plan's limit (the newest ones): read-only until the team is back under it. */
export async function overLimitIds(db: Db, teamId: number, kind: StockKind): Promise<number[]> {
  const { table, id, order } = STOCK[kind];
  if (!(await db.schema.hasTable(table))) return [];
  const limit = planById(await currentPlanOf(db, teamId)).limits[kind];
  const rows: Record<string, number>[] = await order(db(table).where({ team_id: teamId }).select(`${id} as id`));
  return rows.slice(limit).map((r) => r.id);
}

export async function isOverLimit(db: Db, teamId: number, kind: StockKind, itemId: number): Promise<boolean> {
  return (await overLimitIds(db, teamId, kind)).includes(itemId);
}

/** Throws 403 plan_limit when the item is read-only because the team is over its plan's limit. */
export async function assertWritable(db: Db, teamId: number, kind: StockKind, itemId: number): Promise<void> {
  const over = await overLimitIds(db, teamId, kind);
  if (!over.includes(itemId)) return;
  const plan = planById(await currentPlanOf(db, teamId));
  const needed = plan.limits[kind] + over.length;
  const upgrade = upgradeFor(plan.id, kind, needed);
  const noun = LIMIT_NOUNS[kind].noun;
  throw new HttpError(
    403,
    'plan_limit',
    `This is read-only: the ${plan.name} plan allows ${plan.limits[kind]} ${noun} and the team has ${needed}. ` +
      `Nothing was deleted; remove ${over.length} ${over.length === 1 ? 'item' : 'items'}${upgrade ? ` or upgrade to ${upgrade.name}` : ''} to edit it again.`,
  );
}

/** Usage against every limit, for the billing screen. */
export async function usageOf(db: Db, teamId: number, now: number): Promise<Usage[]> {
  const plan = planById(await currentPlanOf(db, teamId));
  const kinds = Object.keys(LIMIT_NOUNS) as LimitKind[];
  return Promise.all(
    kinds.map(async (kind) => {
      const used = await usedOf(db, teamId, kind, now);
      return {
        kind,
        label: LIMIT_NOUNS[kind].label,
        used,
        limit: plan.limits[kind],
        period: LIMIT_PERIODS[kind],
        readOnly: isStock(kind) ? Math.max(0, used - plan.limits[kind]) : 0,
      };
    }),
  );
}

function planLimitError(check: LimitCheck, adding: number, heldAs?: string): HttpError {
  const plan = planById(check.plan);
  const noun = LIMIT_NOUNS[check.kind].noun;
  const upgrade = check.upgradeTo ? planById(check.upgradeTo) : null;
  const where = `The ${plan.name} plan allows ${check.limit} ${noun} and the team has used ${check.used}${heldAs ? ` (${heldAs})` : ''}`;
  const ask = adding === 1 ? '' : ` (this needs ${adding} more)`;
  const next = upgrade
    ? ` Upgrade to ${upgrade.name} (${upgrade.limits[check.kind]} ${noun}) under Team → Billing to go on.`
    : LIMIT_PERIODS[check.kind] === 'month'
      ? ` ${plan.name} is the largest plan; the allowance starts afresh on the 1st of next month (UTC).`
      : ` ${plan.name} is the largest plan; remove some first.`;
  return new HttpError(403, 'plan_limit', `${where}${ask}.${next}`);
}
