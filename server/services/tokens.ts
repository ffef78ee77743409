import crypto from 'node:crypto';

/** A link token: 32 random bytes for the link, only its SHA-256 for the database. */
export function newLinkToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
