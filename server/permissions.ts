import { match } from 'path-to-regexp';
import type { Express, RequestHandler } from 'express';
import type { Role } from '../schemas/roles';
import { rolesOf, type PermissionRow } from '../schemas/permissions';
import { HttpError, unauthenticated } from './errors';
import { ALL_ROLES } from './role-sets';
import type { RouteRule } from './routes/declare';

export type { RouteRule } from './routes/declare';

/**
 * The one permission table, built by createApp from the routes as they declare themselves. A route missing from it
 * cannot be reached (the guard answers 404), and the permission test fails.
 */
export class RouteTable {
  private compiled: { rule: RouteRule; matches: ReturnType<typeof match> }[] | null = null;

  constructor(readonly rules: readonly RouteRule[]) {
    const seen = new Map<string, RouteRule>();
    for (const rule of rules) {
      const key = `${rule.method} ${rule.path}`;
      if (seen.has(key)) throw new Error(`${key} is declared twice.`);
      seen.set(key, rule);
    }
    // One action, one wording and one set of roles, so the Team screen's row is the truth for every route it covers.
    const byAction = new Map<string, RouteRule>();
    for (const rule of rules) {
      const first = byAction.get(rule.action);
      if (!first) byAction.set(rule.action, rule);
      else if (first.label !== rule.label || JSON.stringify(first.access) !== JSON.stringify(rule.access)) {
        throw new Error(`Action ${rule.action} is declared with different labels or roles (${first.method} ${first.path}, ${rule.method} ${rule.path}).`);
      }
    }
  }

  find(method: string, path: string): RouteRule | undefined {
    this.compiled ??= this.rules.map((rule) => ({ rule, matches: match(rule.path, { decode: decodeURIComponent }) }));
    const m = method === 'HEAD' ? 'GET' : method;
    return this.compiled.find((c) => c.rule.method === m && c.matches(path) !== false)?.rule;
  }

  /** The table as the Team screen shows it: one row per action with the roles allowed. */
  rows(): PermissionRow[] {
    const rows = new Map<string, PermissionRow>();
    for (const rule of this.rules) {
      if (rule.access === 'public') continue;
      if (!rows.has(rule.action)) rows.set(rule.action, { action: rule.action, label: rule.label, roles: rolesOf(rule.access, ALL_ROLES) });
    }
    return [...rows.values()];
  }

  /** The actions a role may take, for GET /api/me. */
  actionsFor(role: Role): string[] {
    return this.rows()
      .filter((r) => r.roles.includes(role))
      .map((r) => r.action);
  }
}

/** Enforces the table before any router runs: unknown route 404, signed out 401, wrong role 403. */
export function enforceRouteTable(table: RouteTable): RequestHandler {
  return (req, _res, next) => {
    const rule = table.find(req.method, req.path);
    if (!rule) return next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
    if (rule.access === 'public') return next();
    if (!req.viewer) return next(unauthenticated());
    if (rule.access !== 'member' && !rule.access.includes(req.viewer.role)) {
      return next(new HttpError(403, 'forbidden', `Your role (${req.viewer.role.replace('_', ' ')}) cannot ${rule.label.toLowerCase()}.`));
    }
    next();
  };
}

/** The app's table (createApp keeps it in app.locals): `routeTableOf(req.app)` in a handler, `routeTableOf(app)` in a test. */
export function routeTableOf(app: Pick<Express, 'locals'>): RouteTable {
  const table = app.locals.routeTable as RouteTable | undefined;
  if (!table) throw new Error('This app has no route table: build it with createApp.');
  return table;
}
