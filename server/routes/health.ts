import { Router } from 'express';
import type { AppDeps } from '../deps';

export function healthRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    let db = 'ok';
    try {
      await deps.db.raw('select 1');
    } catch {
      db = 'unreachable';
    }
    res.status(db === 'ok' ? 200 : 503).json({ ok: db === 'ok', version: deps.version, db });
  });
  return router;
}
