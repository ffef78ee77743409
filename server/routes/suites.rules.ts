import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the suite routes (server/routes/suites.ts). */
export const suiteRules: RouteRule[] = [
  { method: 'GET', path: '/suites', action: 'courses.read', label: 'See courses and suites', access: 'member' },
  { method: 'GET', path: '/suites/:id', action: 'courses.read', label: 'See courses and suites', access: 'member' },
  { method: 'POST', path: '/suites', action: 'suites.edit', label: 'Make and edit suites', access: EDITORS },
  { method: 'PUT', path: '/suites/:id', action: 'suites.edit', label: 'Make and edit suites', access: EDITORS },
  { method: 'DELETE', path: '/suites/:id', action: 'suites.edit', label: 'Make and edit suites', access: EDITORS },
];
