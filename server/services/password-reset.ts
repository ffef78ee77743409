import type { AppDeps } from '../deps';
import { HttpError } from '../errors';
import { hashPassword } from './accounts';
import { hashToken, newLinkToken } from './tokens';

/** A reset link works for an hour (OWASP Forgot Password Cheat Sheet: short-lived, single-use tokens). */
export const RESET_TTL_MS = 60 * 60 * 1000;

/**
 * Sends a reset link when the address has an account; says nothing either way, so no one learns who has one.
 * Both paths make a token and look the address up, and the mail goes out without the answer waiting for it,
 * so a known address is not told apart by how long the answer takes.
 */
export async function requestReset(deps: AppDeps, email: string): Promise<void> {
  const now = deps.clock.now();
  const { token, hash } = newLinkToken();
  const user = await deps.db('users').where({ email }).first('id', 'name');
  if (!user) return;
  await deps.db('password_resets').insert({ user_id: user.id, token_hash: hash, created_at: now, expires_at: now + RESET_TTL_MS });
  const link = `${deps.publicUrl()}/reset-password/${token}`;
  deps.mailer
    .send({
      to: email,
      subject: 'Reset your Treadle password',
      text: [
        `Hello ${user.name},`,
        '',
        'Someone (we hope you) asked to reset the password of your Treadle account.',
        `Choose a new password here: ${link}`,
        '',
        'The link works once and expires in one hour. Setting a new password signs you out everywhere.',
        'If you did not ask for this, ignore this mail: your password stays as it is.',
      ].join('\n'),
    })
    .catch((err: unknown) => console.error(`Reset mail to ${email} failed:`, err instanceof Error ? err.message : err));
}

/** Sets the new password, spends the token, and ends every session of that user, all in one transaction. */
export async function resetPassword(deps: AppDeps, token: string, password: string): Promise<void> {
  const now = deps.clock.now();
  const passwordHash = await hashPassword(password);
  await deps.db.transaction(async (trx) => {
    const row = await trx('password_resets').where({ token_hash: hashToken(token) }).first();
    if (!row || row.used_at) throw new HttpError(410, 'reset_unusable', 'This reset link has already been used. Ask for a new one.');
    if (Number(row.expires_at) <= now) throw new HttpError(410, 'reset_expired', 'This reset link has expired. Ask for a new one.');
    const claimed = await trx('password_resets').where({ id: row.id }).whereNull('used_at').update({ used_at: now });
    if (!claimed) throw new HttpError(410, 'reset_unusable', 'This reset link has already been used. Ask for a new one.');
    await trx('users').where({ id: row.user_id }).update({ password_hash: passwordHash, session_generation: trx.raw('session_generation + 1') });
    // Other outstanding reset links of this user die with this one.
    await trx('password_resets').where({ user_id: row.user_id }).whereNull('used_at').update({ used_at: now });
  });
}
