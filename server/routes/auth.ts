import type { Request } from 'express';
import { resetPasswordSchema, resetRequestSchema, signInSchema, signUpConfirmSchema, signUpSchema, type SignUpAnswer } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import type { Db } from '../db';
import { HttpError, parseWith } from '../errors';
import { defaultTeamOf, endEverySession, sessionGenerationOf, verifyCredentials } from '../services/accounts';
import { confirmSignUp, requestSignUp, signUpAnswer } from '../services/sign-up';
import { requestReset, resetPassword } from '../services/password-reset';
import { SESSION_COOKIE } from '../middleware/session';
import { resetLimit, signInLimits, signUpLimit } from '../middleware/rate-limits';
import { viewerOf } from '../middleware/auth';
import { declareRoutes, permission } from './declare';

const WRONG_CREDENTIALS = 'Wrong e-mail or password.';

// Public: these are how a visitor becomes signed in (or out); each has its own rate limit where it matters.
const SIGN_UP = permission('auth.sign-up', 'Set up a studio', 'public');
const SIGN_IN = permission('auth.sign-in', 'Sign in', 'public');
const SIGN_OUT = permission('auth.sign-out', 'Sign out', 'public');
const SIGN_OUT_EVERYWHERE = permission('auth.sign-out-everywhere', 'Sign out everywhere', 'member');
const RESET_REQUEST = permission('auth.reset-request', 'Ask for a password reset', 'public');
const RESET = permission('auth.reset', 'Set a new password', 'public');

/** A fresh session id at every sign-in, so a session id planted before sign-in is worthless after it. */
export async function startSession(db: Db, req: Request, userId: number, teamId: number): Promise<void> {
  const generation = await sessionGenerationOf(db, userId);
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

export function authRoutes(deps: AppDeps) {
  const routes = declareRoutes('/auth');

  // The same answer for every address; the link (or the "you already have an account" notice) goes by mail.
  routes.post('/sign-up', SIGN_UP, signUpLimit(), async (req, res) => {
    const input = parseWith(signUpSchema, req.body);
    await requestSignUp(deps, input);
    const answer: SignUpAnswer = { ok: true, message: signUpAnswer(input.email) };
    res.status(202).json(answer);
  });

  routes.post('/sign-up/confirm', SIGN_UP, async (req, res) => {
    const { token } = parseWith(signUpConfirmSchema, req.body);
    const { userId, teamId } = await confirmSignUp(deps, token);
    await startSession(deps.db, req, userId, teamId);
    res.status(201).json({ ok: true });
  });

  routes.post('/sign-in', SIGN_IN, ...signInLimits(), async (req, res) => {
    const input = parseWith(signInSchema, req.body);
    const user = await verifyCredentials(deps.db, input.email, input.password);
    if (!user) throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
    const teamId = await defaultTeamOf(deps.db, user.id);
    if (!teamId) throw new HttpError(403, 'no_team', 'This account belongs to no studio any more. Ask an owner for a new invite.');
    await startSession(deps.db, req, user.id, teamId);
    res.json({ ok: true });
  });

  routes.post('/sign-out', SIGN_OUT, async (req, res) => {
    await endSession(req);
    res.clearCookie(SESSION_COOKIE);
    res.json({ ok: true });
  });

  routes.post('/sign-out-everywhere', SIGN_OUT_EVERYWHERE, async (req, res) => {
    const { user } = viewerOf(req);
    await endEverySession(deps.db, user.id);
    await endSession(req);
    res.clearCookie(SESSION_COOKIE);
    res.json({ ok: true });
  });

  routes.post('/reset-request', RESET_REQUEST, resetLimit(), async (req, res) => {
    const { email } = parseWith(resetRequestSchema, req.body);
    await requestReset(deps, email);
    res.status(202).json({ ok: true, message: 'If that address has a Treadle account, a reset link is on its way. It works for one hour.' });
  });

  routes.post('/reset', RESET, resetLimit(), async (req, res) => {
    const { token, password } = parseWith(resetPasswordSchema, req.body);
    await resetPassword(deps, token, password);
    res.json({ ok: true });
  });

  return routes;
}
