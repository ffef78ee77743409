import type { RequestHandler } from 'express';
import { LOCALHOST_FORMS } from '../config';

/**
 * DNS-rebinding defence: a page on an attacker's domain that re-points its name at this machine still sends its
 * own name in the Host header, so only the names this instance is configured to answer to are served
 * (OWASP ASVS 4.0 V14.5, "Validate HTTP Request Header"; RFC 9110 §15.5.20 for 421 Misdirected Request).
 * A port in the header must be the one the request arrived on, or PUBLIC_URL's.
 */
export function allowOnlyKnownHosts(allowed: readonly string[], publicUrl: () => string): RequestHandler {
  const names = new Set([...LOCALHOST_FORMS, ...allowed].map((h) => h.toLowerCase()));
  return (req, res, next) => {
    const header = req.headers.host;
    const parsed = header ? parseHost(header) : null;
    if (parsed && names.has(parsed.hostname) && (parsed.port === null || portAllowed(parsed.port, req.socket.localPort, publicUrl))) return next();
    const shown = (header ?? '').slice(0, 100);
    res
      .status(421)
      .set('Cache-Control', 'no-store')
      .json({
        error: {
          code: 'unknown_host',
          message: header
            ? `This Treadle server does not answer to the host "${shown}". Open it at the address it was set up with; an operator can add the name to ALLOWED_HOSTS or set PUBLIC_URL.`
            : 'The request names no host. Open Treadle at the address it was set up with.',
        },
      });
  };
}

function parseHost(header: string): { hostname: string; port: number | null } | null {
  if (header.length > 300) return null;
  try {
    const url = new URL(`http://${header}`);
    // Anything past host[:port] (user info, a path) is not a Host header.
    if (url.username || url.password || url.pathname !== '/' || url.search || url.hash) return null;
    const explicit = /:(\d+)$/.exec(header);
    return { hostname: url.hostname.toLowerCase(), port: explicit ? Number(explicit[1]) : null };
  } catch {
    return null;
  }
}

function portAllowed(port: number, localPort: number | undefined, publicUrl: () => string): boolean {
  if (port === localPort) return true;
  try {
    const pub = new URL(publicUrl());
    return port === Number(pub.port || (pub.protocol === 'https:' ? 443 : 80));
  } catch {
    return false;
  }
}
