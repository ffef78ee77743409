import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the trial routes (server/routes/trials.ts). */
export const trialRules: RouteRule[] = [
  { method: 'POST', path: '/trials', action: 'trials.run', label: 'Run trials', access: EDITORS },
  { method: 'GET', path: '/trials', action: 'trials.read', label: 'See trials', access: 'member' },
  { method: 'GET', path: '/trials/:id', action: 'trials.read', label: 'See trials', access: 'member' },
];
