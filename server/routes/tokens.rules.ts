import type { RouteRule } from '../permissions';

/** Build scripts are the programmer's; the owner manages everything. */
const TOKEN_KEEPERS: RouteRule['access'] = ['owner', 'programmer'];

/** Permission rules of the API token routes (server/routes/tokens.ts). */
export const tokenRules: RouteRule[] = [
  { method: 'GET', path: '/tokens', action: 'tokens.manage', label: 'Create and revoke API tokens', access: TOKEN_KEEPERS },
  { method: 'POST', path: '/tokens', action: 'tokens.manage', label: 'Create and revoke API tokens', access: TOKEN_KEEPERS },
  { method: 'DELETE', path: '/tokens/:id', action: 'tokens.manage', label: 'Create and revoke API tokens', access: TOKEN_KEEPERS },
];
