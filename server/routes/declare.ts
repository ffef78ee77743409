/**
 * Routes that declare themselves: each route is written with its permission beside its handler, and the router
 * keeps those declarations so the app builds its one permission table from them (server/permissions.ts).
 *
 *   const routes = declareRoutes('/characters');
 *   routes.id('id', 'That character');
 *   routes.put('/:id/legs', EDIT_LEGS, async (req, res) => { … idOf(req) … });
 */
import { Router, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import type { Access } from '../../schemas/permissions';
import { notFound } from '../errors';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** What a route lets its caller do, in the words the Team screen shows, and who may. */
export interface Permission {
  action: string;
  label: string;
  access: Access;
}

/** One row of the permission table: a route's method and full path under /api, and its permission. */
export interface RouteRule extends Permission {
  method: Method;
  /** Express path under /api, e.g. "/characters/:id". */
  path: string;
}

export const permission = (action: string, label: string, access: Access): Permission => ({ action, label, access });

type Declare = (path: string, permission: Permission, ...handlers: RequestHandler[]) => void;

export interface DeclaredRoutes {
  /** Where the router is mounted under /api. */
  base: string;
  router: Router;
  /** Every route declared so far, with its full path. */
  rules: RouteRule[];
  get: Declare;
  post: Declare;
  put: Declare;
  patch: Declare;
  delete: Declare;
  /** Loads `:name` of every route here as a positive integer id (idParam); read it with idOf(req, name). */
  id(name: string, what: string): void;
}

const joinPath = (base: string, path: string) => (path === '/' ? base : `${base}${path}`);

export function declareRoutes(base: string): DeclaredRoutes {
  const router = Router();
  const rules: RouteRule[] = [];
  const declare =
    (method: Method): Declare =>
    (path, allowed, ...handlers) => {
      rules.push({ method, path: joinPath(base, path), ...allowed });
      router[method.toLowerCase() as Lowercase<Method>](path, ...handlers);
    };
  return {
    base,
    router,
    rules,
    get: declare('GET'),
    post: declare('POST'),
    put: declare('PUT'),
    patch: declare('PATCH'),
    delete: declare('DELETE'),
    id: (name, what) => router.param(name, idParam(what)),
  };
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Path ids loaded by idParam, by parameter name. */
      ids?: Record<string, number>;
    }
  }
}

/**
 * The id loader, for `router.param(name, idParam(what))`: the parameter must be a positive integer written in
 * digits. Anything else names nothing there is, so it is the same 404 as an id of another team's or none at all.
 */
export function idParam(what: string) {
  return (req: Request, _res: Response, next: NextFunction, value: unknown, name: string): void => {
    const n = typeof value === 'string' && /^[0-9]{1,15}$/.test(value) ? Number(value) : 0;
    if (n <= 0) return next(notFound(what));
    (req.ids ??= {})[name] = n;
    next();
  };
}

/** The id idParam loaded for `:name`. */
export function idOf(req: Request, name = 'id'): number {
  const id = req.ids?.[name];
  if (id === undefined) throw new Error(`No idParam loader for :${name} on this router.`);
  return id;
}
