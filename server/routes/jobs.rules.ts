import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the job routes (server/routes/jobs.ts). */
export const jobRules: RouteRule[] = [
  { method: 'GET', path: '/jobs/:id', action: 'jobs.read', label: 'See running trials and dial-ins', access: 'member' },
  { method: 'POST', path: '/jobs/:id/cancel', action: 'jobs.cancel', label: 'Cancel trials and dial-ins', access: EDITORS },
];
