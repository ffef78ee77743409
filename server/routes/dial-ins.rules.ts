import type { RouteRule } from '../permissions';

const EDITORS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the dial-in routes (server/routes/dial-ins.ts). */
export const dialInRules: RouteRule[] = [
  { method: 'POST', path: '/dial-ins', action: 'dial-ins.run', label: 'Start dial-ins', access: EDITORS },
  { method: 'POST', path: '/dial-ins/:id/accept', action: 'dial-ins.accept', label: 'Accept dial-in results', access: EDITORS },
];
