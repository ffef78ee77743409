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
export function rejectCrossSiteWrites(publicUrl: () => string): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    if (req.path === '/billing/webhook') return next();
    const site = req.get('sec-fetch-site');
    if (site && site !== 'same-origin' && site !== 'none') return next(crossSite());
    const origin = req.get('origin');
    if (origin === undefined) return next();
    // An origin is scheme, host and port (RFC 6454 §4): http://host is another origin than https://host.
    let sent: string;
    try {
      sent = origin === 'null' ? 'null' : new URL(origin).origin;
    } catch {
      return next(crossSite());
    }
    const own = `${req.protocol}://${req.get('host')}`.toLowerCase();
    if (sent === own || sent === publicOrigin(publicUrl)) return next();
    next(crossSite());
  };
}

/** Behind a TLS proxy that is not trusted for X-Forwarded-Proto, the request looks like http; PUBLIC_URL says what people use. */
function publicOrigin(publicUrl: () => string): string | null {
  try {
    return new URL(publicUrl()).origin;
  } catch {
    return null;
  }
}

function crossSite() {
  return new HttpError(403, 'cross_site', 'This change was sent from another site, so Treadle refused it. Make it from Treadle itself.');
}
