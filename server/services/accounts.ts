import bcrypt from 'bcryptjs';
import type { Db } from '../db';
import type { Role } from '../../schemas/roles';
import { HttpError } from '../errors';

/** bcrypt work factor; 10 is the floor OWASP's password storage cheat sheet names for bcrypt. */
export const BCRYPT_COST = 11;

export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  session_generation: number;
  created_at: number;
}

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

// A hash of a throwaway password, compared against when the e-mail is unknown so both paths cost the same.
const DUMMY_HASH = bcrypt.hashSync('treadle-no-such-user', BCRYPT_COST);

/** Returns the user when the e-mail and password match; null otherwise, after the same amount of work. */
export async function verifyCredentials(db: Db, email: string, password: string): Promise<UserRow | null> {
  const user = await db<UserRow>('users').where({ email }).first();
  const ok = await bcrypt.compare(password, user?.password_hash ?? DUMMY_HASH);
  return user && ok ? user : null;
}

/** Makes the account, its studio and the owner's membership (call it with a transaction of the caller's). */
export async function createUserWithTeam(
  db: Db,
  input: { email: string; name: string; teamName: string; passwordHash: string },
  now: number,
): Promise<{ userId: number; teamId: number }> {
  return db.transaction(async (trx) => {
    const existing = await trx('users').where({ email: input.email }).first();
    if (existing) {
      throw new HttpError(409, 'email_taken', 'This address already has a Treadle account. Sign in instead.', {
        email: 'This address already has a Treadle account. Sign in instead.',
      });
    }
    const [userId] = await trx('users').insert({
      email: input.email,
      name: input.name,
      password_hash: input.passwordHash,
      created_at: now,
    });
    const [teamId] = await trx('teams').insert({ name: input.teamName, created_at: now });
    await trx('memberships').insert({ team_id: teamId, user_id: userId, role: 'owner' satisfies Role, created_at: now });
    return { userId, teamId };
  });
}

/** The team a user lands in at sign-in: the one they joined first. */
export async function defaultTeamOf(db: Db, userId: number): Promise<number | null> {
  const row = await db('memberships').where({ user_id: userId }).orderBy('created_at').orderBy('team_id').first('team_id');
  return row ? (row.team_id as number) : null;
}

/** The user's session generation: a session started under an older one is no longer valid. */
export async function sessionGenerationOf(db: Db, userId: number): Promise<number> {
  const { session_generation: generation } = await db('users').where({ id: userId }).first('session_generation');
  return generation as number;
}

/** Ends every session of the user, on every device, by moving the generation on. */
export async function endEverySession(db: Db, userId: number): Promise<void> {
  await db('users').where({ id: userId }).increment('session_generation', 1);
}
