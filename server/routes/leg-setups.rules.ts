import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the leg setup routes (server/routes/leg-setups.ts). */
export const legSetupRules: RouteRule[] = [
  { method: 'GET', path: '/characters/:id/leg-setups', action: 'leg-setups.read', label: 'See leg setups', access: 'member' },
  { method: 'POST', path: '/characters/:id/leg-setups', action: 'leg-setups.save', label: 'Save leg setups', access: EDITORS },
  { method: 'GET', path: '/leg-setups/:id', action: 'leg-setups.read', label: 'See leg setups', access: 'member' },
];
