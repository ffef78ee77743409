import { changeRoleSchema, createInviteSchema, type AuditEntry, type TeamOverview } from '../../schemas/team';
import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import { parseWith } from '../errors';
import { changeRole, listMembers, removeMember } from '../services/members';
import { createInvite, pendingInvites, resendInvite, revokeInvite } from '../services/invites';
import { auditEntries } from '../services/audit';
import { routeTableOf } from '../permissions';
import { OWNER } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

const READ = permission('team.read', 'See the members', 'member');
const CHANGE_ROLE = permission('team.change-role', "Change a member's role", OWNER);
const REMOVE_MEMBER = permission('team.remove-member', 'Remove a member', OWNER);
const INVITE = permission('team.invite', 'Invite people', OWNER);
const AUDIT = permission('team.audit', 'Read the team log', OWNER);
const PERMISSIONS = permission('permissions.read', 'See who may do what', 'member');

export function teamRoutes(deps: AppDeps) {
  const routes = declareRoutes('/team');
  routes.id('userId', 'That member');
  routes.id('id', 'That invite');

  routes.get('/', READ, async (req, res) => {
    const { team, role } = viewerOf(req);
    const overview: TeamOverview = { members: await listMembers(deps.db, team.id) };
    if (role === 'owner') overview.invites = await pendingInvites(deps.db, team.id, deps.clock.now());
    res.json(overview);
  });

  routes.patch('/members/:userId', CHANGE_ROLE, async (req, res) => {
    const { team, user } = viewerOf(req);
    const { role } = parseWith(changeRoleSchema, req.body);
    await changeRole(deps.db, team.id, user.id, idOf(req, 'userId'), role, deps.clock.now());
    res.json({ ok: true });
  });

  routes.delete('/members/:userId', REMOVE_MEMBER, async (req, res) => {
    const { team, user } = viewerOf(req);
    await removeMember(deps.db, team.id, user.id, idOf(req, 'userId'), deps.clock.now());
    res.json({ ok: true });
  });

  routes.post('/invites', INVITE, async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(createInviteSchema, req.body);
    await createInvite(deps, team.id, user, team.name, input);
    res.status(201).json({ ok: true });
  });

  routes.post('/invites/:id/resend', INVITE, async (req, res) => {
    const { team, user } = viewerOf(req);
    await resendInvite(deps, team.id, user, team.name, idOf(req));
    res.json({ ok: true });
  });

  routes.delete('/invites/:id', INVITE, async (req, res) => {
    const { team, user } = viewerOf(req);
    await revokeInvite(deps, team.id, user.id, idOf(req));
    res.json({ ok: true });
  });

  routes.get('/audit', AUDIT, async (req, res) => {
    const { team } = viewerOf(req);
    const entries: AuditEntry[] = await auditEntries(deps.db, team.id);
    res.json({ entries });
  });

  return routes;
}

/** GET /api/permissions: the app's permission table as roles × actions. */
export function permissionsRoutes() {
  const routes = declareRoutes('/permissions');
  routes.get('/', PERMISSIONS, (req, res) => {
    res.json({ actions: routeTableOf(req.app).rows() });
  });
  return routes;
}
