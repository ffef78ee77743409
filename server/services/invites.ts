import type { Db } from '../db';
import type { AppDeps } from '../deps';
import type { CreateInviteInput, Invite, InvitePreview } from '../../schemas/team';
import { acceptInviteNewAccountSchema, type AcceptInviteInput } from '../../schemas/team';
import { roleLabels, type Role } from '../../schemas/roles';
import { HttpError, notFound, parseWith } from '../errors';
import { audit } from './audit';
import { hashToken, newLinkToken } from './tokens';
import { hashPassword, verifyCredentials } from './accounts';
import { assertSeatFree } from './billing-limits';

/** An invite link works for a week (common practice, no source). */
export const INVITE_TTL_MS = 7 * 24 * 3600 * 1000;

interface InviteRow {
  id: number;
  team_id: number;
  email: string;
  role: Role;
  invited_by: number;
  token_hash: string;
  created_at: number;
  expires_at: number;
  accepted_at: number | null;
  revoked_at: number | null;
}

export async function pendingInvites(db: Db, teamId: number, now: number): Promise<Invite[]> {
  const rows = await db('invites as i')
    .join('users as u', 'u.id', 'i.invited_by')
    .where('i.team_id', teamId)
    .whereNull('i.accepted_at')
    .whereNull('i.revoked_at')
    .where('i.expires_at', '>', now)
    .orderBy('i.created_at', 'desc')
    .select('i.id', 'i.email', 'i.role', 'u.name as invitedBy', 'i.created_at as createdAt', 'i.expires_at as expiresAt');
  return rows.map((r) => ({ ...r, createdAt: Number(r.createdAt), expiresAt: Number(r.expiresAt) }));
}

function inviteMail(deps: AppDeps, to: string, token: string, inviter: string, teamName: string, role: Role) {
  const link = `${deps.publicUrl()}/invite/${token}`;
  return {
    to,
    subject: `${inviter} invited you to ${teamName} on Treadle`,
    text: [
      `${inviter} invited you to join ${teamName} on Treadle as ${roleLabels[role]}.`,
      '',
      'Treadle is where the studio tunes how its characters plant their feet on uneven ground.',
      '',
      `Accept the invite: ${link}`,
      '',
      `The link works once and expires in 7 days. If you did not expect this mail, ignore it: nothing happens unless you open the link.`,
    ].join('\n'),
  };
}

export async function createInvite(deps: AppDeps, teamId: number, actor: { id: number; name: string }, teamName: string, input: CreateInviteInput): Promise<void> {
  const now = deps.clock.now();
  const { token, hash } = newLinkToken();
  await deps.db.transaction(async (trx) => {
    const alreadyMember = await trx('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.team_id': teamId, 'u.email': input.email }).first();
    if (alreadyMember) throw new HttpError(409, 'already_member', `${input.email} is already in this studio.`, { email: `${input.email} is already in this studio.` });
    await assertSeatFree(trx, teamId, { now, inviting: input.email });
    // A new invite to the same address replaces the old one, so only the latest link works.
    await trx('invites').where({ team_id: teamId, email: input.email }).whereNull('accepted_at').whereNull('revoked_at').update({ revoked_at: now });
    await trx('invites').insert({ team_id: teamId, email: input.email, role: input.role, token_hash: hash, invited_by: actor.id, created_at: now, expires_at: now + INVITE_TTL_MS });
    await audit(trx, { teamId, actorUserId: actor.id, action: 'invite.sent', subject: input.email, detail: `as ${input.role}`, at: now });
  });
  await deps.mailer.send(inviteMail(deps, input.email, token, actor.name, teamName, input.role));
}

async function openInvite(db: Db, teamId: number, inviteId: number): Promise<InviteRow> {
  const row = await db<InviteRow>('invites').where({ id: inviteId, team_id: teamId }).whereNull('accepted_at').whereNull('revoked_at').first();
  if (!row) throw notFound('That invite');
  return row;
}

export async function resendInvite(deps: AppDeps, teamId: number, actor: { id: number; name: string }, teamName: string, inviteId: number): Promise<void> {
  const now = deps.clock.now();
  const row = await openInvite(deps.db, teamId, inviteId);
  const { token, hash } = newLinkToken();
  // A resend issues a fresh link and voids the old one, so a leaked earlier mail is useless.
  await deps.db.transaction(async (trx) => {
    await trx('invites').where({ id: row.id }).update({ token_hash: hash, expires_at: now + INVITE_TTL_MS, created_at: now });
    await audit(trx, { teamId, actorUserId: actor.id, action: 'invite.resent', subject: row.email, at: now });
  });
  await deps.mailer.send(inviteMail(deps, row.email, token, actor.name, teamName, row.role));
}

export async function revokeInvite(deps: AppDeps, teamId: number, actorId: number, inviteId: number): Promise<void> {
  const now = deps.clock.now();
  const row = await openInvite(deps.db, teamId, inviteId);
  await deps.db.transaction(async (trx) => {
    await trx('invites').where({ id: row.id }).update({ revoked_at: now });
    await audit(trx, { teamId, actorUserId: actorId, action: 'invite.revoked', subject: row.email, at: now });
  });
}

const UNUSABLE = 'This invite link has been used, revoked or replaced. Ask the studio owner for a new one.';
const EXPIRED = 'This invite link has expired. Ask the studio owner to send it again.';

/** The invite a token opens, refused with a reason a person can act on. */
async function inviteByToken(db: Db, token: string, now: number): Promise<InviteRow> {
  const row = await db<InviteRow>('invites').where({ token_hash: hashToken(token) }).first();
  if (!row || row.accepted_at || row.revoked_at) throw new HttpError(410, 'invite_unusable', UNUSABLE);
  if (Number(row.expires_at) <= now) throw new HttpError(410, 'invite_expired', EXPIRED);
  return row;
}

export async function previewInvite(db: Db, token: string, now: number): Promise<InvitePreview> {
  const row = await inviteByToken(db, token, now);
  const team = await db('teams').where({ id: row.team_id }).first('name');
  const inviter = await db('users').where({ id: row.invited_by }).first('name');
  const account = await db('users').where({ email: row.email }).first('id');
  return { teamName: team.name, role: row.role, email: row.email, invitedBy: inviter?.name ?? 'A studio owner', hasAccount: !!account };
}

/** Accepts an invite: joins an existing account (its password proves it) or creates one. */
export async function acceptInvite(db: Db, token: string, input: AcceptInviteInput, now: number): Promise<{ userId: number; teamId: number }> {
  const row = await inviteByToken(db, token, now);
  const existing = await db('users').where({ email: row.email }).first('id');
  let passwordHash: string | null = null;
  let name = '';
  if (existing) {
    const user = await verifyCredentials(db, row.email, input.password);
    if (!user) throw new HttpError(401, 'wrong_credentials', 'That is not the password of this account.', { password: 'That is not the password of this account.' });
  } else {
    const fresh = parseWith(acceptInviteNewAccountSchema, input);
    passwordHash = await hashPassword(fresh.password);
    name = fresh.name;
  }
  return db.transaction(async (trx) => {
    // Claim the invite first: of two accepts racing on one link, only one updates the row.
    const claimed = await trx('invites').where({ id: row.id }).whereNull('accepted_at').whereNull('revoked_at').update({ accepted_at: now });
    if (!claimed) throw new HttpError(410, 'invite_unusable', UNUSABLE);
    let userId: number = existing?.id;
    if (!existing) [userId] = await trx('users').insert({ email: row.email, name, password_hash: passwordHash, created_at: now });
    const member = await trx('memberships').where({ team_id: row.team_id, user_id: userId }).first();
    if (!member) await assertSeatFree(trx, row.team_id, { now });
    if (!member) await trx('memberships').insert({ team_id: row.team_id, user_id: userId, role: row.role, created_at: now });
    await audit(trx, { teamId: row.team_id, actorUserId: userId, action: 'member.joined', subject: row.email, detail: `as ${row.role}`, at: now });
    return { userId, teamId: row.team_id };
  });
}
