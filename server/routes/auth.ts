import { Router, type Request } from 'express';
import { signInSchema, signUpSchema } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import { HttpError, parseWith } from '../errors';
import { createUserWithTeam, defaultTeamOf, verifyCredentials } from '../services/accounts';
import { SESSION_COOKIE } from '../middleware/session';

const WRONG_CREDENTIALS = 'Wrong e-mail or password.';

/** A fresh session id at every sign-in, so a session id planted before sign-in is worthless after it. */
function startSession(req: Request, userId: number, teamId: number, now: number): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = userId;
      req.session.teamId = teamId;
      req.session.issuedAt = now;
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

export function authRouter(deps: AppDeps): Router {
  const router = Router();

  router.post('/sign-up', async (req, res) => {
    const input = parseWith(signUpSchema, req.body);
    const now = deps.clock.now();
    const { userId, teamId } = await createUserWithTeam(deps.db, input, now);
    await startSession(req, userId, teamId, now);
    res.status(201).json({ ok: true });
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseWith(signInSchema, req.body);
    const user = await verifyCredentials(deps.db, input.email, input.password);
    if (!user) throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
    const teamId = await defaultTeamOf(deps.db, user.id);
    if (!teamId) throw new HttpError(403, 'no_team', 'This account belongs to no studio any more. Ask an owner for a new invite.');
    await startSession(req, user.id, teamId, deps.clock.now());
    res.json({ ok: true });
  });

  router.post('/sign-out', (req, res, next) => {
    req.session.destroy((err) => {
      if (err) return next(err);
      res.clearCookie(SESSION_COOKIE);
      res.json({ ok: true });
    });
  });

  return router;
}
