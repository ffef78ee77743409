/** Read-only API tokens: made once (the secret is only ever in the create answer), stored as a SHA-256, revocable. */
import crypto from 'node:crypto';
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import { TOKEN_PREFIX, type ApiToken } from '../../schemas/tokens';
import { hashToken } from './tokens';

interface TokenRow {
  id: number;
  team_id: number;
  name: string;
  hash: string;
  created_by: number;
  creator_name: string;
  created_at: number;
  last_used_at: number | null;
  revoked_at: number | null;
}

const rows = (db: Db) => db('api_tokens as t').join('users as u', 'u.id', 't.created_by').select<TokenRow[]>('t.*', 'u.name as creator_name');

const toApi = (r: TokenRow): ApiToken => ({
  id: r.id,
  name: r.name,
  createdBy: { id: r.created_by, name: r.creator_name },
  createdAt: Number(r.created_at),
  lastUsedAt: r.last_used_at === null ? null : Number(r.last_used_at),
  revokedAt: r.revoked_at === null ? null : Number(r.revoked_at),
});

export async function listTokens(db: Db, teamId: number): Promise<ApiToken[]> {
  return (await rows(db).where('t.team_id', teamId).orderBy('t.created_at', 'desc').orderBy('t.id', 'desc')).map(toApi);
}

export async function createToken(db: Db, input: { teamId: number; userId: number; name: string; now: number }): Promise<{ token: ApiToken; secret: string }> {
  const secret = TOKEN_PREFIX + crypto.randomBytes(32).toString('base64url');
  const [id] = await db('api_tokens').insert({ team_id: input.teamId, name: input.name, hash: hashToken(secret), created_by: input.userId, created_at: input.now });
  const row = (await rows(db).where('t.id', id))[0];
  return { token: toApi(row), secret };
}

export async function revokeToken(db: Db, teamId: number, id: number, now: number): Promise<ApiToken> {
  const row = (await rows(db).where({ 't.id': id, 't.team_id': teamId }))[0];
  if (!row) throw notFound('That token');
  if (row.revoked_at === null) await db('api_tokens').where({ id, team_id: teamId }).update({ revoked_at: now });
  return toApi((await rows(db).where('t.id', id))[0]);
}

export interface TokenHolder {
  tokenId: number;
  tokenName: string;
  teamId: number;
  teamName: string;
  user: { id: number; email: string; name: string };
}

/** The team a presented token belongs to, recording its use; unknown or revoked tokens are a 401 that says which. */
export async function authenticateToken(db: Db, secret: string, now: number): Promise<TokenHolder> {
  const row = await db('api_tokens as t')
    .join('teams as m', 'm.id', 't.team_id')
    .join('users as u', 'u.id', 't.created_by')
    .where('t.hash', hashToken(secret))
    .first('t.id', 't.name', 't.team_id', 't.revoked_at', 'm.name as team_name', 'u.id as user_id', 'u.email', 'u.name as user_name');
  if (!row) throw new HttpError(401, 'invalid_token', 'This API token is not known. Check it was copied whole, or create a new one under Tokens.');
  if (row.revoked_at !== null) {
    throw new HttpError(401, 'revoked_token', `The API token "${row.name}" was revoked on ${new Date(Number(row.revoked_at)).toISOString().slice(0, 10)}. Create a new one under Tokens.`);
  }
  await db('api_tokens').where({ id: row.id }).update({ last_used_at: now });
  return { tokenId: row.id, tokenName: row.name, teamId: row.team_id, teamName: row.team_name, user: { id: row.user_id, email: row.email, name: row.user_name } };
}
