import type { Knex } from 'knex';

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
