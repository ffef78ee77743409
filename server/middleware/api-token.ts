/**
 * Bearer tokens: `Authorization: Bearer tdl_…` makes the request the token's team's, read-only, and only on the
 * /api/v1 routes. It runs right after loadViewer so the permission table guard sees a viewer, marked by
 * `req.apiToken`. A token request that would change something is refused here, before any router runs.
 */
import type { RequestHandler } from 'express';
import type { Db } from '../db';
import type { Clock } from '../clock';
import { HttpError } from '../errors';
import { authenticateToken } from '../services/api-tokens';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set when the request came with an API token instead of a session. */
      apiToken?: { id: number; name: string };
    }
  }
}

/** POST routes a token may call because they change nothing (the regression check only runs trials). */
const READ_ONLY_POSTS = [/^\/v1\/profiles\/[^/]+\/check$/];

export function loadApiToken(db: Db, clock: Clock): RequestHandler {
  return async (req, _res, next) => {
    try {
      const header = req.get('authorization');
      // The JSON Schema is public: a build script may send its token along without harm.
      if (!header || req.path.startsWith('/schema/')) return next();
      const m = /^Bearer\s+(\S+)\s*$/i.exec(header);
      if (!m) throw new HttpError(401, 'invalid_token', 'Send the API token as "Authorization: Bearer <token>".');
      if (!req.path.startsWith('/v1/')) {
        throw new HttpError(403, 'token_scope', 'API tokens only reach the /api/v1 routes. Sign in to Treadle for everything else.');
      }
      const readOnly = req.method === 'GET' || req.method === 'HEAD' || (req.method === 'POST' && READ_ONLY_POSTS.some((r) => r.test(req.path)));
      const holder = await authenticateToken(db, m[1], clock.now());
      if (!readOnly) {
        throw new HttpError(403, 'read_only_token', `API tokens are read-only: ${req.method} ${req.baseUrl}${req.path} changes data. Sign in to Treadle to do that.`);
      }
      req.viewer = { user: holder.user, team: { id: holder.teamId, name: holder.teamName }, role: 'programmer' };
      req.apiToken = { id: holder.tokenId, name: holder.tokenName };
      next();
    } catch (err) {
      next(err);
    }
  };
}
