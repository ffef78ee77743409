/** GET /api/queue (owners): where the team's trials and dial-ins run — workers connected, tasks waiting and running. */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import type { QueueStatus } from '../../schemas/queue';
import { jobRunnerOf } from './job-runner-of';

export function queueRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const { team } = viewerOf(req);
    const body: QueueStatus = await jobRunnerOf(deps).queueStatus(team.id);
    res.json(body);
  });
  return router;
}
