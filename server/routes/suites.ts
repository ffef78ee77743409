import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { suiteCreateSchema, suiteUpdateSchema, type SuiteList, type SuiteResponse } from '../../schemas/courses';
import { createSuite, deleteSuite, findSuite, listSuites, updateSuite } from '../services/suites';
import { EDITORS } from '../role-sets';
import { READ_COURSES } from './courses';
import { declareRoutes, idOf, permission } from './declare';

const EDIT = permission('suites.edit', 'Make and edit suites', EDITORS);

/** Suites: named, ordered sets of courses that trials and dial-ins run together. */
export function suitesRoutes(deps: AppDeps) {
  const routes = declareRoutes('/suites');
  routes.id('id', 'That suite');

  routes.get('/', READ_COURSES, async (req, res) => {
    const body: SuiteList = { suites: await listSuites(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  routes.get('/:id', READ_COURSES, async (req, res) => {
    const body: SuiteResponse = { suite: await findSuite(deps.db, viewerOf(req).team.id, idOf(req)) };
    res.json(body);
  });

  routes.post('/', EDIT, async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(suiteCreateSchema, req.body);
    const id = await createSuite(deps.db, { teamId: team.id, userId: user.id, ...input, now: deps.clock.now() });
    res.status(201).json({ suite: await findSuite(deps.db, team.id, id) });
  });

  routes.put('/:id', EDIT, async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req);
    // 404 before 400: another team's suite is not there at all.
    await findSuite(deps.db, team.id, id);
    const input = parseWith(suiteUpdateSchema, req.body);
    await updateSuite(deps.db, { teamId: team.id, suiteId: id, ...input, now: deps.clock.now() });
    res.json({ suite: await findSuite(deps.db, team.id, id) });
  });

  routes.delete('/:id', EDIT, async (req, res) => {
    await deleteSuite(deps.db, viewerOf(req).team.id, idOf(req));
    res.status(204).end();
  });

  return routes;
}
