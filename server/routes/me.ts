import { Router } from 'express';
import { viewerOf } from '../middleware/auth';
import { switchTeamSchema, type Me } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import { actionsFor } from '../permissions';
import { notFound, parseWith } from '../errors';
import { teamsOf } from '../services/members';

export function meRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const { user, team, role } = viewerOf(req);
    const me: Me = { user, team, role, permissions: actionsFor(role), teams: await teamsOf(deps.db, user.id) };
    res.json(me);
  });
  router.post('/team', async (req, res) => {
    const { user } = viewerOf(req);
    const { teamId } = parseWith(switchTeamSchema, req.body);
    const member = await deps.db('memberships').where({ team_id: teamId, user_id: user.id }).first();
    if (!member) throw notFound('That studio');
    req.session.teamId = teamId;
    res.json({ ok: true });
  });
  return router;
}
