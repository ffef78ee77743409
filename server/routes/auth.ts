import { Router, type Request } from 'express';
import { resetPasswordSchema, resetRequestSchema, signInSchema, signUpConfirmSchema, signUpSchema, type SignUpAnswer } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import type { Db } from '../db';
import { HttpError, parseWith } from '../errors';
import { defaultTeamOf, verifyCredentials } from '../services/accounts';
import { confirmSignUp, requestSignUp, signUpAnswer } from '../services/sign-up';
import { requestReset, resetPassword } from '../services/password-reset';
import { SESSION_COOKIE } from '../middleware/session';
import { resetLimit, signInLimits, signUpLimit } from '../middleware/rate-limits';
import { viewerOf } from '../middleware/auth';

const WRONG_CREDENTIALS = 'Wrong e-mail or password.';

/** A fresh session id at every sign-in, so a session id planted before sign-in is worthless after it. */
export async function startSession(db: Db, req: Request, userId: number, teamId: number): Promise<void> {
  const { session_generation: generation } = await db('users').where({ id: userId }).first('session_generation');
  await new Promise<void>((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = userId;
      req.session.teamId = teamId;
      req.session.generation = generation;
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}

export function authRouter(deps: AppDeps): Router {
  const router = Router();

  // The same answer for every address; the link (or the "you already have an account" notice) goes by mail.
  router.post('/sign-up', signUpLimit(), async (req, res) => {
    const input = parseWith(signUpSchema, req.body);
    await requestSignUp(deps, input);
    const answer: SignUpAnswer = { ok: true, message: signUpAnswer(input.email) };
    res.status(202).json(answer);
  });

  router.post('/sign-up/confirm', async (req, res) => {
    const { token } = parseWith(signUpConfirmSchema, req.body);
    const { userId, teamId } = await confirmSignUp(deps, token);
    await startSession(deps.db, req, userId, teamId);
    res.status(201).json({ ok: true });
  });

  router.post('/sign-in', ...signInLimits(), async (req, res) => {
    const input = parseWith(signInSchema, req.body);
    const user = await verifyCredentials(deps.db, input.email, input.password);
    if (!user) throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
    const teamId = await defaultTeamOf(deps.db, user.id);
    if (!teamId) throw new HttpError(403, 'no_team', 'This account belongs to no studio any more. Ask an owner for a new invite.');
    await startSession(deps.db, req, user.id, teamId);
    res.json({ ok: true });
  });

  router.post('/sign-out', async (req, res) => {
    await endSession(req);
    res.clearCookie(SESSION_COOKIE);
    res.json({ ok: true });
  });

  router.post('/sign-out-everywhere', async (req, res) => {
    const { user } = viewerOf(req);
    await deps.db('users').where({ id: user.id }).increment('session_generation', 1);
    await endSession(req);
    res.clearCookie(SESSION_COOKIE);
    res.json({ ok: true });
  });

  router.post('/reset-request', resetLimit(), async (req, res) => {
    const { email } = parseWith(resetRequestSchema, req.body);
    await requestReset(deps, email);
    res.status(202).json({ ok: true, message: 'If that address has a Treadle account, a reset link is on its way. It works for one hour.' });
  });

  router.post('/reset', resetLimit(), async (req, res) => {
    const { token, password } = parseWith(resetPasswordSchema, req.body);
    await resetPassword(deps, token, password);
    res.json({ ok: true });
  });

  return router;
}
