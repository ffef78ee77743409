import type { Request } from 'express';
import { viewerOf, type Viewer } from '../middleware/auth';
import { switchTeamSchema, type Me, type SessionState } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import { routeTableOf } from '../permissions';
import { declareRoutes, permission } from './declare';
import { notFound, parseWith } from '../errors';
import { isMemberOf, teamsOf } from '../services/members';

const READ = permission('me.read', 'See your own account', 'member');
/** The app's probe on every load: public, so a signed-out visitor gets an answer rather than a 401. */
const SESSION = permission('me.session', 'Check whether you are signed in', 'public');
const SWITCH_TEAM = permission('me.switch-team', 'Switch studio', 'member');

export function meRoutes(deps: AppDeps) {
  const routes = declareRoutes('/me');
  const meOf = async (req: Request, viewer: Viewer): Promise<Me> => {
    const { user, team, role } = viewer;
    return { user, team, role, permissions: routeTableOf(req.app).actionsFor(role), teams: await teamsOf(deps.db, user.id) };
  };
  routes.get('/', READ, async (req, res) => {
    res.json(await meOf(req, viewerOf(req)));
  });
  routes.get('/session', SESSION, async (req, res) => {
    const state: SessionState = req.viewer ? { signedIn: true, me: await meOf(req, req.viewer) } : { signedIn: false };
    res.json(state);
  });
  routes.post('/team', SWITCH_TEAM, async (req, res) => {
    const { user } = viewerOf(req);
    const { teamId } = parseWith(switchTeamSchema, req.body);
    if (!(await isMemberOf(deps.db, teamId, user.id))) throw notFound('That studio');
    req.session.teamId = teamId;
    res.json({ ok: true });
  });
  return routes;
}
