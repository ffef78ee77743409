import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { notFound, parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { suiteCreateSchema, suiteUpdateSchema, type SuiteList, type SuiteResponse } from '../../schemas/courses';
import { createSuite, deleteSuite, findSuite, listSuites, updateSuite } from '../services/suites';

const idSchema = z.coerce.number().int().positive();

function suiteId(raw: unknown): number {
  const id = idSchema.safeParse(raw);
  if (!id.success) throw notFound('That suite');
  return id.data;
}

/** Suites: named, ordered sets of courses that trials and dial-ins run together. */
export function suitesRouter(deps: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const body: SuiteList = { suites: await listSuites(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  router.get('/:id', async (req, res) => {
    const body: SuiteResponse = { suite: await findSuite(deps.db, viewerOf(req).team.id, suiteId(req.params.id)) };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(suiteCreateSchema, req.body);
    const id = await createSuite(deps.db, { teamId: team.id, userId: user.id, ...input, now: deps.clock.now() });
    res.status(201).json({ suite: await findSuite(deps.db, team.id, id) });
  });

  router.put('/:id', async (req, res) => {
    const { team } = viewerOf(req);
    const id = suiteId(req.params.id);
    // 404 before 400: another team's suite is not there at all.
    await findSuite(deps.db, team.id, id);
    const input = parseWith(suiteUpdateSchema, req.body);
    await updateSuite(deps.db, { teamId: team.id, suiteId: id, ...input, now: deps.clock.now() });
    res.json({ suite: await findSuite(deps.db, team.id, id) });
  });

  router.delete('/:id', async (req, res) => {
    await deleteSuite(deps.db, viewerOf(req).team.id, suiteId(req.params.id));
    res.status(204).end();
  });

  return router;
}
