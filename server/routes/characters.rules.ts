import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the character routes (server/routes/characters.ts). */
export const characterRules: RouteRule[] = [
  { method: 'GET', path: '/characters', action: 'characters.read', label: 'See characters and their legs', access: 'member' },
  { method: 'GET', path: '/characters/:id', action: 'characters.read', label: 'See characters and their legs', access: 'member' },
  { method: 'GET', path: '/characters/:id/file', action: 'characters.read', label: 'See characters and their legs', access: 'member' },
  { method: 'POST', path: '/characters', action: 'characters.upload', label: 'Upload characters', access: EDITORS },
  { method: 'PUT', path: '/characters/:id/legs', action: 'characters.legs.edit', label: 'Edit leg mappings', access: EDITORS },
  { method: 'PUT', path: '/characters/:id/unit-scale', action: 'characters.legs.edit', label: 'Edit leg mappings', access: EDITORS },
];
