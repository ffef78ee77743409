/**
 * Sign-up without telling anyone who has an account (OWASP Authentication Cheat Sheet, "Authentication and Error
 * Messages"; ASVS 4.0 V2.2): the answer is the same for every address, and the address's own inbox learns the rest,
 * either a link that finishes setting up the studio or a notice that an account already exists.
 */
import type { AppDeps } from '../deps';
import type { SignUpInput } from '../../schemas/auth';
import type { OutgoingMail } from './mail';
import { HttpError } from '../errors';
import { createUserWithTeam, hashPassword } from './accounts';
import { hashToken, newLinkToken } from './tokens';

/** A sign-up link works for a day (common practice, no source). */
export const SIGN_UP_TTL_MS = 24 * 3600 * 1000;

export const signUpAnswer = (email: string) =>
  `We sent a mail to ${email}. Open the link in it to finish setting up your studio; it works for 24 hours. No mail after a few minutes? Check the spam folder.`;

/** Both paths do the same work (a bcrypt hash, a token, one lookup) and send their mail without waiting for it. */
export async function requestSignUp(deps: AppDeps, input: SignUpInput): Promise<void> {
  const now = deps.clock.now();
  const passwordHash = await hashPassword(input.password);
  const { token, hash } = newLinkToken();
  const existing = await deps.db('users').where({ email: input.email }).first('id', 'name');
  if (existing) {
    sendInBackground(deps, alreadyHaveAccountMail(deps, input.email, existing.name));
    return;
  }
  await deps.db.transaction(async (trx) => {
    // A second sign-up of the same address replaces the first: only the newest link works.
    await trx('sign_up_requests').where({ email: input.email }).whereNull('used_at').update({ used_at: now });
    await trx('sign_up_requests').insert({
      email: input.email,
      name: input.name,
      team_name: input.teamName,
      password_hash: passwordHash,
      token_hash: hash,
      created_at: now,
      expires_at: now + SIGN_UP_TTL_MS,
    });
  });
  sendInBackground(deps, confirmMail(deps, input.email, input.name, token));
}

const UNUSABLE = 'This sign-up link has been used or replaced by a newer one. Sign in, or set up the studio again.';

/** Spends the link and makes the account, its studio and the owner's membership in one transaction. */
export async function confirmSignUp(deps: AppDeps, token: string): Promise<{ userId: number; teamId: number }> {
  const now = deps.clock.now();
  return deps.db.transaction(async (trx) => {
    const row = await trx('sign_up_requests').where({ token_hash: hashToken(token) }).first();
    if (!row || row.used_at) throw new HttpError(410, 'sign_up_unusable', UNUSABLE);
    if (Number(row.expires_at) <= now) throw new HttpError(410, 'sign_up_expired', 'This sign-up link has expired. Set up the studio again to get a new one.');
    const claimed = await trx('sign_up_requests').where({ id: row.id }).whereNull('used_at').update({ used_at: now });
    if (!claimed) throw new HttpError(410, 'sign_up_unusable', UNUSABLE);
    return createUserWithTeam(trx, { email: row.email, name: row.name, teamName: row.team_name, passwordHash: row.password_hash }, now);
  });
}

function sendInBackground(deps: AppDeps, mail: OutgoingMail): void {
  deps.mailer.send(mail).catch((err: unknown) => console.error(`Sign-up mail to ${mail.to} failed:`, err instanceof Error ? err.message : err));
}

function confirmMail(deps: AppDeps, to: string, name: string, token: string): OutgoingMail {
  return {
    to,
    subject: 'Finish setting up your Treadle studio',
    text: [
      `Hello ${name},`,
      '',
      'Someone (we hope you) set up a Treadle studio with this address.',
      `Open this link to finish and sign in: ${deps.publicUrl()}/sign-up-confirm/${token}`,
      '',
      'The link works once, for 24 hours. If you did not ask for this, ignore this mail: no account is made.',
    ].join('\n'),
  };
}

function alreadyHaveAccountMail(deps: AppDeps, to: string, name: string): OutgoingMail {
  return {
    to,
    subject: 'You already have a Treadle account',
    text: [
      `Hello ${name},`,
      '',
      'Someone (we hope you) tried to set up a new Treadle studio with this address, which already has an account.',
      `Sign in here: ${deps.publicUrl()}/sign-in`,
      `Forgot the password? Ask for a new one: ${deps.publicUrl()}/forgot-password`,
      '',
      'To start another studio, sign in first. If this was not you, ignore this mail: nothing has changed.',
    ].join('\n'),
  };
}
