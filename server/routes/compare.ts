import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { compareQuerySchema } from '../../schemas/compare';
import { compare } from '../services/compare';
import { declareRoutes, permission } from './declare';

const RUN = permission('compare.run', 'Compare characters on a suite', 'member');

/** GET /api/compare?suite=…&pick=c1,c2: runs (or reuses) the suite trials in-process and answers side by side. */
export function compareRoutes(deps: AppDeps) {
  const routes = declareRoutes('/compare');
  routes.get('/', RUN, async (req, res) => {
    const q = parseWith(compareQuerySchema, req.query);
    res.json(await compare(deps.db, viewerOf(req).team.id, q));
  });
  return routes;
}
