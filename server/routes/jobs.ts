import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import { EDITORS } from '../role-sets';
import { jobRunnerOf } from './job-runner-of';
import { declareRoutes, idOf, permission } from './declare';

const READ = permission('jobs.read', 'See running trials and dial-ins', 'member');
const CANCEL = permission('jobs.cancel', 'Cancel trials and dial-ins', EDITORS);

/** Jobs: status (polled by the app) and cancel. */
export function jobsRoutes(deps: AppDeps) {
  const routes = declareRoutes('/jobs');
  routes.id('id', 'That job');
  routes.get('/:id', READ, async (req, res) => {
    res.json(await jobRunnerOf(deps).status(viewerOf(req).team.id, idOf(req)));
  });
  routes.post('/:id/cancel', CANCEL, async (req, res) => {
    res.json(await jobRunnerOf(deps).cancel(viewerOf(req).team.id, idOf(req)));
  });
  return routes;
}
