import type { Knex } from 'knex';
import type { AuditEntry } from '../../schemas/team';

export type AuditAction =
  | 'member.role_changed'
  | 'member.removed'
  | 'member.joined'
  | 'invite.sent'
  | 'invite.resent'
  | 'invite.revoked';

/** Records a change to who is in the team and with what role; runs inside the change's own transaction. */
export async function audit(
  trx: Knex | Knex.Transaction,
  entry: { teamId: number; actorUserId: number | null; action: AuditAction; subject: string; detail?: string; at: number },
): Promise<void> {
  await trx('audit_log').insert({
    team_id: entry.teamId,
    actor_user_id: entry.actorUserId,
    action: entry.action,
    subject: entry.subject,
    detail: entry.detail ?? '',
    created_at: entry.at,
  });
}

/** The team log, newest first (the last 200 entries); a member who has left shows as "A former member". */
export async function auditEntries(db: Knex, teamId: number): Promise<AuditEntry[]> {
  const rows = await db('audit_log as a')
    .leftJoin('users as u', 'u.id', 'a.actor_user_id')
    .where('a.team_id', teamId)
    .orderBy('a.id', 'desc')
    .limit(200)
    .select('a.id', 'a.created_at as at', 'u.name as actor', 'a.action', 'a.subject', 'a.detail');
  return rows.map((r) => ({ ...r, at: Number(r.at), actor: r.actor ?? 'A former member' }));
}
