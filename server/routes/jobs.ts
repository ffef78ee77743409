import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { notFound } from '../errors';
import { viewerOf } from '../middleware/auth';
import { jobRunnerOf } from './job-runner-of';

const idSchema = z.coerce.number().int().positive();

function jobId(raw: unknown): number {
  const id = idSchema.safeParse(raw);
  if (!id.success) throw notFound('That job');
  return id.data;
}

/** Jobs: status (polled by the app) and cancel. */
export function jobsRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/:id', async (req, res) => {
    res.json(await jobRunnerOf(deps).status(viewerOf(req).team.id, jobId(req.params.id)));
  });
  router.post('/:id/cancel', async (req, res) => {
    res.json(await jobRunnerOf(deps).cancel(viewerOf(req).team.id, jobId(req.params.id)));
  });
  return router;
}
