import type { RouteRule } from '../permissions';

/** Permission rules of the token API (server/routes/api-v1.ts); a session works on them too. */
export const apiV1Rules: RouteRule[] = [
  { method: 'GET', path: '/v1/characters', action: 'api.read', label: 'Read characters and leg profiles through the API', access: 'member' },
  { method: 'GET', path: '/v1/characters/:id/profiles', action: 'api.read', label: 'Read characters and leg profiles through the API', access: 'member' },
  { method: 'GET', path: '/v1/profiles/:id/versions/:version', action: 'api.read', label: 'Read characters and leg profiles through the API', access: 'member' },
  // A POST that changes nothing: it only re-runs trials and answers with a verdict.
  { method: 'POST', path: '/v1/profiles/:id/check', action: 'api.check', label: 'Check a character build against a leg profile', access: 'member' },
];
