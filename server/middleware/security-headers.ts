import type { RequestHandler } from 'express';

/**
 * Browser features Treadle never uses, switched off for every page it serves (W3C Permissions Policy), so a
 * script that got in somehow still cannot reach the camera, microphone, location, sensors or payment sheet.
 */
const PERMISSIONS_POLICY = [
  'accelerometer=()',
  'autoplay=()',
  'camera=()',
  'display-capture=()',
  'geolocation=()',
  'gyroscope=()',
  'magnetometer=()',
  'microphone=()',
  'midi=()',
  'payment=()',
  'publickey-credentials-get=()',
  'usb=()',
  'fullscreen=(self)',
].join(', ');

/** HSTS: one year, sent only on a secure request, since RFC 6797 §7.2 says a host must not send it over plain http. */
const HSTS = 'max-age=31536000; includeSubDomains';

export const securityHeaders: RequestHandler = (req, res, next) => {
  res.setHeader('Permissions-Policy', PERMISSIONS_POLICY);
  if (req.secure) res.setHeader('Strict-Transport-Security', HSTS);
  next();
};

/**
 * API answers are never stored by a browser or a shared cache (OWASP ASVS 4.0 V8.2.1): a signed-in answer holds
 * the team's data, and the back button on a shared computer must not show it after sign-out. A route that means
 * to be cached (a character's immutable file) sets its own Cache-Control.
 */
export const noStoreApi: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
