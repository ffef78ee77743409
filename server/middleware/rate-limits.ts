import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import { HttpError } from '../errors';

function limiter(options: { windowMs: number; limit: number; key: (req: Request) => string; message: string }): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: options.key,
    handler: (_req, _res, next) => next(new HttpError(429, 'too_many_attempts', options.message)),
  });
}

const ipOf = (req: Request) => ipKeyGenerator(req.ip ?? 'unknown');
const emailOf = (req: Request) => String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase();

/**
 * Sign-in attempts per address and network: 10 in 15 minutes, in line with OWASP's Authentication
 * Cheat Sheet advice to throttle guessing per account without locking the owner out for long.
 */
export const signInLimit = () =>
  limiter({
    windowMs: 15 * 60 * 1000,
    limit: 10,
    key: (req) => `${ipOf(req)}|${emailOf(req)}`,
    message: 'Too many sign-in attempts. Wait 15 minutes, or reset your password.',
  });

/** Reset mails per network: 5 in 15 minutes, so the form cannot be used to flood someone's inbox. */
export const resetLimit = () =>
  limiter({
    windowMs: 15 * 60 * 1000,
    limit: 5,
    key: ipOf,
    message: 'Too many reset requests from here. Wait 15 minutes and try again.',
  });
