import { Router } from 'express';
import { viewerOf, type Viewer } from '../middleware/auth';
import { switchTeamSchema, type Me, type SessionState } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import { actionsFor } from '../permissions';
import { notFound, parseWith } from '../errors';
import { teamsOf } from '../services/members';

export function meRouter(deps: AppDeps): Router {
  const router = Router();
  const meOf = async (viewer: Viewer): Promise<Me> => {
    const { user, team, role } = viewer;
    return { user, team, role, permissions: actionsFor(role), teams: await teamsOf(deps.db, user.id) };
  };
  router.get('/', async (req, res) => {
    res.json(await meOf(viewerOf(req)));
  });
  // The app's probe on every load: public, so a signed-out visitor gets an answer rather than a 401.
  router.get('/session', async (req, res) => {
    const state: SessionState = req.viewer ? { signedIn: true, me: await meOf(req.viewer) } : { signedIn: false };
    res.json(state);
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
