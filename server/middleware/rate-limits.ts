import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import { HttpError } from '../errors';

const FIFTEEN_MINUTES = 15 * 60 * 1000;

function limiter(options: { windowMs: number; limit: number; key: (req: Request) => string; message: string; failuresOnly?: boolean }): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: options.key,
    // A successful answer (status < 400) takes its count back: only failures use up the allowance.
    skipSuccessfulRequests: options.failuresOnly ?? false,
    // X-Forwarded-For is ignored on purpose unless TRUST_PROXY names the proxy; no need to warn about it.
    validate: { xForwardedForHeader: false },
    handler: (_req, _res, next) => next(new HttpError(429, 'too_many_attempts', options.message)),
  });
}

/** The client's network: its address as express sees it (forwarded only through a trusted proxy), IPv6 by /56. */
const networkOf = (req: Request) => ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? 'unknown');
const emailOf = (req: Request) => String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase();

/**
 * Failed sign-ins, counted two ways (OWASP Authentication Cheat Sheet, "Protect Against Automated Attacks"):
 * per account, so guessing one person's password from many places stops after 10 failures in 15 minutes; and
 * per network, so trying many addresses from one place stops after 25. Signing in successfully costs nothing.
 */
export const signInLimits = (): RequestHandler[] => [
  limiter({
    windowMs: FIFTEEN_MINUTES,
    limit: 25,
    key: (req) => `net|${networkOf(req)}`,
    failuresOnly: true,
    message: 'Too many failed sign-ins from this network. Wait 15 minutes and try again.',
  }),
  limiter({
    windowMs: FIFTEEN_MINUTES,
    limit: 10,
    key: (req) => `account|${emailOf(req)}`,
    failuresOnly: true,
    message: 'Too many failed sign-ins for this account. Wait 15 minutes, or reset your password.',
  }),
];

/** Sign-ups per network: 10 an hour, so the form cannot be used to probe or flood addresses. */
export const signUpLimit = () =>
  limiter({
    windowMs: 60 * 60 * 1000,
    limit: 10,
    key: networkOf,
    message: 'Too many sign-ups from this network. Wait an hour and try again.',
  });

/** Reset mails per network: 5 in 15 minutes, so the form cannot be used to flood someone's inbox. */
export const resetLimit = () =>
  limiter({
    windowMs: FIFTEEN_MINUTES,
    limit: 5,
    key: networkOf,
    message: 'Too many reset requests from here. Wait 15 minutes and try again.',
  });
