/** GET /api/queue (owners): where the team's trials and dial-ins run — workers connected, tasks waiting and running. */
import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import type { QueueStatus } from '../../schemas/queue';
import { OWNER } from '../role-sets';
import { jobRunnerOf } from './job-runner-of';
import { declareRoutes, permission } from './declare';

const READ = permission('queue.read', 'See where trials and dial-ins run', OWNER);

export function queueRoutes(deps: AppDeps) {
  const routes = declareRoutes('/queue');
  routes.get('/', READ, async (req, res) => {
    const { team } = viewerOf(req);
    const body: QueueStatus = await jobRunnerOf(deps).queueStatus(team.id);
    res.json(body);
  });
  return routes;
}
