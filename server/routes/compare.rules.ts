import type { RouteRule } from '../permissions';

/** Permission rules of the compare route (server/routes/compare.ts). */
export const compareRules: RouteRule[] = [
  { method: 'GET', path: '/compare', action: 'compare.run', label: 'Compare characters on a suite', access: 'member' },
];
