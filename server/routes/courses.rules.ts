import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the course routes (server/routes/courses.ts): editors shape the ground, everyone reads it. */
export const courseRules: RouteRule[] = [
  { method: 'GET', path: '/courses', action: 'courses.read', label: 'See courses and suites', access: 'member' },
  { method: 'GET', path: '/courses/:id', action: 'courses.read', label: 'See courses and suites', access: 'member' },
  { method: 'POST', path: '/courses', action: 'courses.edit', label: 'Make and edit courses', access: EDITORS },
  { method: 'POST', path: '/courses/starter', action: 'courses.edit', label: 'Make and edit courses', access: EDITORS },
  { method: 'PUT', path: '/courses/:id', action: 'courses.edit', label: 'Make and edit courses', access: EDITORS },
  { method: 'DELETE', path: '/courses/:id', action: 'courses.edit', label: 'Make and edit courses', access: EDITORS },
];
