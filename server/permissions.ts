import { match } from 'path-to-regexp';
import type { RequestHandler } from 'express';
import { roleSchema, type Role } from '../schemas/roles';
import { rolesOf, type Access, type PermissionRow } from '../schemas/permissions';
import { HttpError, unauthenticated } from './errors';
import { characterRules } from './routes/characters.rules';
import { legSetupRules } from './routes/leg-setups.rules';
import { trialRules } from './routes/trials.rules';
import { jobRules } from './routes/jobs.rules';
import { dialInRules } from './routes/dial-ins.rules';
import { courseRules } from './routes/courses.rules';
import { suiteRules } from './routes/suites.rules';
import { billingRules } from './routes/billing.rules';
import { profileRules } from './routes/profiles.rules';
import { tokenRules } from './routes/tokens.rules';
import { compareRules } from './routes/compare.rules';
import { apiV1Rules } from './routes/api-v1.rules';

const ALL: readonly Role[] = roleSchema.options;
const OWNER: Role[] = ['owner'];
const EDITORS: Role[] = ['owner', 'designer'];

/** What a route does, in words the Team screen shows, and who may do it. */
export interface RouteRule {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Express path under /api, e.g. "/characters/:id". */
  path: string;
  action: string;
  label: string;
  access: Access;
}

/**
 * The one permission table: every API route is listed here with the roles allowed.
 * A route missing from it cannot be reached (the guard answers 404), and the permission test fails.
 */
export const ROUTE_TABLE: RouteRule[] = [
  { method: 'GET', path: '/health', action: 'health', label: 'Check the server is up', access: 'public' },
  { method: 'POST', path: '/auth/sign-up', action: 'auth.sign-up', label: 'Set up a studio', access: 'public' },
  { method: 'POST', path: '/auth/sign-up/confirm', action: 'auth.sign-up', label: 'Set up a studio', access: 'public' },
  { method: 'POST', path: '/auth/sign-in', action: 'auth.sign-in', label: 'Sign in', access: 'public' },
  { method: 'POST', path: '/auth/sign-out', action: 'auth.sign-out', label: 'Sign out', access: 'public' },
  { method: 'POST', path: '/auth/sign-out-everywhere', action: 'auth.sign-out-everywhere', label: 'Sign out everywhere', access: 'member' },
  { method: 'POST', path: '/auth/reset-request', action: 'auth.reset-request', label: 'Ask for a password reset', access: 'public' },
  { method: 'POST', path: '/auth/reset', action: 'auth.reset', label: 'Set a new password', access: 'public' },
  { method: 'GET', path: '/app-config', action: 'app-config', label: 'Read the app settings', access: 'public' },
  { method: 'GET', path: '/cli/treadle.mjs', action: 'cli.download', label: 'Download the treadle command', access: 'public' },
  { method: 'GET', path: '/me', action: 'me.read', label: 'See your own account', access: 'member' },
  { method: 'GET', path: '/me/session', action: 'me.session', label: 'Check whether you are signed in', access: 'public' },
  { method: 'POST', path: '/me/team', action: 'me.switch-team', label: 'Switch studio', access: 'member' },
  { method: 'GET', path: '/permissions', action: 'permissions.read', label: 'See who may do what', access: 'member' },
  { method: 'GET', path: '/team', action: 'team.read', label: 'See the members', access: 'member' },
  { method: 'PATCH', path: '/team/members/:userId', action: 'team.change-role', label: 'Change a member\'s role', access: OWNER },
  { method: 'DELETE', path: '/team/members/:userId', action: 'team.remove-member', label: 'Remove a member', access: OWNER },
  { method: 'POST', path: '/team/invites', action: 'team.invite', label: 'Invite people', access: OWNER },
  { method: 'POST', path: '/team/invites/:id/resend', action: 'team.invite', label: 'Invite people', access: OWNER },
  { method: 'DELETE', path: '/team/invites/:id', action: 'team.invite', label: 'Invite people', access: OWNER },
  { method: 'GET', path: '/team/audit', action: 'team.audit', label: 'Read the team log', access: OWNER },
  { method: 'GET', path: '/queue', action: 'queue.read', label: 'See where trials and dial-ins run', access: OWNER },
  { method: 'GET', path: '/invites/:token', action: 'invite.preview', label: 'Open an invite', access: 'public' },
  { method: 'POST', path: '/invites/:token/accept', action: 'invite.accept', label: 'Accept an invite', access: 'public' },
  ...characterRules,
  ...legSetupRules,
  ...trialRules,
  ...jobRules,
  ...dialInRules,
  ...courseRules,
  ...suiteRules,
  ...billingRules,
  ...profileRules,
  ...tokenRules,
  ...compareRules,
  ...apiV1Rules,
];

/** Named role sets, for routes added by other modules. */
export const roleSets = { ALL: [...ALL], OWNER, EDITORS };

const compiled = () =>
  ROUTE_TABLE.map((rule) => ({ rule, matches: match(rule.path, { decode: decodeURIComponent }) }));
let cache: ReturnType<typeof compiled> | null = null;

export function findRule(method: string, path: string): RouteRule | undefined {
  cache ??= compiled();
  const m = method === 'HEAD' ? 'GET' : method;
  return cache.find((c) => c.rule.method === m && c.matches(path) !== false)?.rule;
}

/** Enforces the table before any router runs: unknown route 404, signed out 401, wrong role 403. */
export const enforceRouteTable: RequestHandler = (req, _res, next) => {
  const rule = findRule(req.method, req.path);
  if (!rule) return next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
  if (rule.access === 'public') return next();
  if (!req.viewer) return next(unauthenticated());
  if (rule.access !== 'member' && !rule.access.includes(req.viewer.role)) {
    return next(new HttpError(403, 'forbidden', `Your role (${req.viewer.role.replace('_', ' ')}) cannot ${rule.label.toLowerCase()}.`));
  }
  next();
};

/** The table as the Team screen shows it: one row per action with the roles allowed. */
export function permissionRows(): PermissionRow[] {
  const rows = new Map<string, PermissionRow>();
  for (const rule of ROUTE_TABLE) {
    if (rule.access === 'public') continue;
    if (!rows.has(rule.action)) rows.set(rule.action, { action: rule.action, label: rule.label, roles: rolesOf(rule.access, ALL) });
  }
  return [...rows.values()];
}

/** The actions a role may take, for GET /api/me. */
export function actionsFor(role: Role): string[] {
  return permissionRows()
    .filter((r) => r.roles.includes(role))
    .map((r) => r.action);
}
