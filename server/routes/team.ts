import { Router } from 'express';
import { changeRoleSchema, createInviteSchema, type AuditEntry, type TeamOverview } from '../../schemas/team';
import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import { HttpError, parseWith } from '../errors';
import { changeRole, listMembers, removeMember } from '../services/members';
import { createInvite, pendingInvites, resendInvite, revokeInvite } from '../services/invites';
import { permissionRows } from '../permissions';

const idParam = (raw: string | string[] | undefined, what: string): number => {
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0) throw new HttpError(404, 'not_found', `${what} was not found.`);
  return n;
};

export function teamRouter(deps: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const { team, role } = viewerOf(req);
    const overview: TeamOverview = { members: await listMembers(deps.db, team.id) };
    if (role === 'owner') overview.invites = await pendingInvites(deps.db, team.id, deps.clock.now());
    res.json(overview);
  });

  router.patch('/members/:userId', async (req, res) => {
    const { team, user } = viewerOf(req);
    const { role } = parseWith(changeRoleSchema, req.body);
    await changeRole(deps.db, team.id, user.id, idParam(req.params.userId, 'That member'), role, deps.clock.now());
    res.json({ ok: true });
  });

  router.delete('/members/:userId', async (req, res) => {
    const { team, user } = viewerOf(req);
    await removeMember(deps.db, team.id, user.id, idParam(req.params.userId, 'That member'), deps.clock.now());
    res.json({ ok: true });
  });

  router.post('/invites', async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(createInviteSchema, req.body);
    await createInvite(deps, team.id, user, team.name, input);
    res.status(201).json({ ok: true });
  });

  router.post('/invites/:id/resend', async (req, res) => {
    const { team, user } = viewerOf(req);
    await resendInvite(deps, team.id, user, team.name, idParam(req.params.id, 'That invite'));
    res.json({ ok: true });
  });

  router.delete('/invites/:id', async (req, res) => {
    const { team, user } = viewerOf(req);
    await revokeInvite(deps, team.id, user.id, idParam(req.params.id, 'That invite'));
    res.json({ ok: true });
  });

  router.get('/audit', async (req, res) => {
    const { team } = viewerOf(req);
    const rows = await deps.db('audit_log as a')
      .leftJoin('users as u', 'u.id', 'a.actor_user_id')
      .where('a.team_id', team.id)
      .orderBy('a.id', 'desc')
      .limit(200)
      .select('a.id', 'a.created_at as at', 'u.name as actor', 'a.action', 'a.subject', 'a.detail');
    const entries: AuditEntry[] = rows.map((r) => ({ ...r, at: Number(r.at), actor: r.actor ?? 'A former member' }));
    res.json({ entries });
  });

  return router;
}

export function permissionsRouter(): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ actions: permissionRows() });
  });
  return router;
}
