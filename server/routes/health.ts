import type { AppDeps } from '../deps';
import { declareRoutes, permission } from './declare';

const HEALTH = permission('health', 'Check the server is up', 'public');

export function healthRoutes(deps: AppDeps) {
  const routes = declareRoutes('/health');
  routes.get('/', HEALTH, async (_req, res) => {
    let db = 'ok';
    try {
      await deps.db.raw('select 1');
    } catch {
      db = 'unreachable';
    }
    res.status(db === 'ok' ? 200 : 503).json({ ok: db === 'ok', version: deps.version, db });
  });
  return routes;
}
