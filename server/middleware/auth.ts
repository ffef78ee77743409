import type { RequestHandler, Request } from 'express';
import type { Db } from '../db';
import type { Role } from '../../schemas/roles';
import { unauthenticated } from '../errors';

export interface Viewer {
  user: { id: number; email: string; name: string };
  team: { id: number; name: string };
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      viewer?: Viewer;
    }
  }
}

/** Resolves the signed-in user, their current team and role from the session, if the session is still valid. */
export function loadViewer(db: Db): RequestHandler {
  return async (req, _res, next) => {
    try {
      const { userId, teamId, generation } = req.session ?? {};
      if (userId && teamId) {
        const row = await db('memberships as m')
          .join('users as u', 'u.id', 'm.user_id')
          .join('teams as t', 't.id', 'm.team_id')
          .where({ 'm.user_id': userId, 'm.team_id': teamId })
          .first('u.id as userId', 'u.email', 'u.name as userName', 'u.session_generation', 't.id as teamId', 't.name as teamName', 'm.role');
        if (row && generation === row.session_generation) {
          req.viewer = {
            user: { id: row.userId, email: row.email, name: row.userName },
            team: { id: row.teamId, name: row.teamName },
            role: row.role,
          };
        }
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}

export const requireViewer: RequestHandler = (req, _res, next) => {
  next(req.viewer ? undefined : unauthenticated());
};

export function viewerOf(req: Request): Viewer {
  if (!req.viewer) throw unauthenticated();
  return req.viewer;
}
