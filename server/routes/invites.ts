import { Router } from 'express';
import { acceptInviteSchema } from '../../schemas/team';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { acceptInvite, previewInvite } from '../services/invites';
import { startSession } from './auth';

/** The invite link's two steps: see what it is for, then accept it (which signs you in to that studio). */
export function invitesRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/:token', async (req, res) => {
    res.json(await previewInvite(deps.db, req.params.token, deps.clock.now()));
  });
  router.post('/:token/accept', async (req, res) => {
    const input = parseWith(acceptInviteSchema, req.body);
    const { userId, teamId } = await acceptInvite(deps.db, req.params.token, input, deps.clock.now());
    await startSession(deps.db, req, userId, teamId);
    res.json({ ok: true });
  });
  return router;
}
