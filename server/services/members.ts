import type { Knex } from 'knex';
import type { Db } from '../db';
import type { Role } from '../../schemas/roles';
import type { Member } from '../../schemas/team';
import { HttpError, notFound } from '../errors';
import { audit } from './audit';

export async function listMembers(db: Db, teamId: number): Promise<Member[]> {
  const rows = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.team_id', teamId)
    .orderBy('m.created_at')
    .select('u.id as userId', 'u.name', 'u.email', 'm.role', 'm.created_at as joinedAt');
  return rows.map((r) => ({ ...r, joinedAt: Number(r.joinedAt) }));
}

async function ownerCount(trx: Knex.Transaction, teamId: number): Promise<number> {
  const row = await trx('memberships').where({ team_id: teamId, role: 'owner' }).count<{ n: number }[]>({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

async function membershipOrNotFound(trx: Knex.Transaction, teamId: number, userId: number) {
  const member = await trx('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.team_id': teamId, 'm.user_id': userId })
    .first('m.role', 'u.email');
  if (!member) throw notFound('That member');
  return member as { role: Role; email: string };
}

const LAST_OWNER = 'A studio needs at least one owner. Make someone else an owner first.';

export async function changeRole(db: Db, teamId: number, actorId: number, userId: number, role: Role, now: number): Promise<void> {
  await db.transaction(async (trx) => {
    const member = await membershipOrNotFound(trx, teamId, userId);
    if (member.role === role) return;
    if (member.role === 'owner' && (await ownerCount(trx, teamId)) <= 1) throw new HttpError(409, 'last_owner', LAST_OWNER);
    await trx('memberships').where({ team_id: teamId, user_id: userId }).update({ role });
    await audit(trx, { teamId, actorUserId: actorId, action: 'member.role_changed', subject: member.email, detail: `${member.role} → ${role}`, at: now });
  });
}

export async function removeMember(db: Db, teamId: number, actorId: number, userId: number, now: number): Promise<void> {
  await db.transaction(async (trx) => {
    const member = await membershipOrNotFound(trx, teamId, userId);
    if (member.role === 'owner' && (await ownerCount(trx, teamId)) <= 1) throw new HttpError(409, 'last_owner', LAST_OWNER);
    await trx('memberships').where({ team_id: teamId, user_id: userId }).delete();
    await audit(trx, { teamId, actorUserId: actorId, action: 'member.removed', subject: member.email, detail: `was ${member.role}`, at: now });
  });
}

export async function teamsOf(db: Db, userId: number): Promise<{ id: number; name: string; role: Role }[]> {
  return db('memberships as m')
    .join('teams as t', 't.id', 'm.team_id')
    .where('m.user_id', userId)
    .orderBy('m.created_at')
    .select('t.id', 't.name', 'm.role');
}

/** Whether the user belongs to the team. */
export async function isMemberOf(db: Db, teamId: number, userId: number): Promise<boolean> {
  return Boolean(await db('memberships').where({ team_id: teamId, user_id: userId }).first('user_id'));
}
