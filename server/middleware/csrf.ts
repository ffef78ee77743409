import type { RequestHandler } from 'express';
import { HttpError } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * CSRF defence for cookie-authenticated writes, by the browser's own headers rather than a token
 * (OWASP CSRF Prevention Cheat Sheet: "Fetch Metadata headers" and "Verifying origin with standard headers").
 * Every browser we support sends Sec-Fetch-Site, and Origin on a cross-site POST; a request a page on another
 * site makes with our cookie therefore shows itself. Clients that are not browsers cannot ride anyone's cookie,
 * and bearer-token calls carry no cookie at all, so neither needs the check.
 */
export const rejectCrossSiteWrites: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  if (req.path === '/billing/webhook') return next();
  const site = req.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') return next(crossSite());
  const origin = req.get('origin');
  if (origin && origin !== 'null') {
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return next(crossSite());
    }
    if (host !== req.get('host')) return next(crossSite());
  } else if (origin === 'null') {
    return next(crossSite());
  }
  next();
};

function crossSite() {
  return new HttpError(403, 'cross_site', 'This change was sent from another site, so Treadle refused it. Make it from Treadle itself.');
}
