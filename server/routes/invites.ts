import { acceptInviteSchema } from '../../schemas/team';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { acceptInvite, previewInvite } from '../services/invites';
import { startSession } from './auth';
import { declareRoutes, permission } from './declare';

/** Public: the invite's token is the proof; accepting signs you in. */
const PREVIEW = permission('invite.preview', 'Open an invite', 'public');
const ACCEPT = permission('invite.accept', 'Accept an invite', 'public');

/** The invite link's two steps: see what it is for, then accept it (which signs you in to that studio). */
export function invitesRoutes(deps: AppDeps) {
  const routes = declareRoutes('/invites');
  routes.get('/:token', PREVIEW, async (req, res) => {
    res.json(await previewInvite(deps.db, req.params.token as string, deps.clock.now()));
  });
  routes.post('/:token/accept', ACCEPT, async (req, res) => {
    const input = parseWith(acceptInviteSchema, req.body);
    const { userId, teamId } = await acceptInvite(deps.db, req.params.token as string, input, deps.clock.now());
    await startSession(deps.db, req, userId, teamId);
    res.json({ ok: true });
  });
  return routes;
}
