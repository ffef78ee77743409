import request from 'supertest';
import type { Express } from 'express';
import { routeTableOf, type RouteRule } from '../../server/permissions';
import { roleSchema, type Role } from '../../schemas/roles';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';

let t: TestApp;
let agents: Record<Role | 'outsider', ReturnType<typeof request.agent>>;

beforeAll(async () => {
  t = await testApp();
  const home = await createStudio(t.db, 'home');
  const away = await createStudio(t.db, 'away');
  agents = {
    owner: await signedIn(t.app, home.members.owner.email),
    designer: await signedIn(t.app, home.members.designer.email),
    programmer: await signedIn(t.app, home.members.programmer.email),
    art_lead: await signedIn(t.app, home.members.art_lead.email),
    outsider: await signedIn(t.app, away.members.owner.email),
  };
});
afterAll(() => t.cleanup());

/** Fills path parameters with ids that exist nowhere, so allowed calls stop at "not found" and change nothing. */
const concrete = (rule: RouteRule) => `/api${rule.path.replace(/:(\w+)/g, (_m, name: string) => (name === 'token' ? 'no-such-token' : '999999'))}`;

function send(agent: ReturnType<typeof request.agent> | typeof request, rule: RouteRule) {
  const path = concrete(rule);
  const target = typeof agent === 'function' ? agent(t.app) : agent;
  const method = rule.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  const req = target[method](path);
  return rule.method === 'GET' || rule.method === 'DELETE' ? req : req.send({});
}

// Routes whose allowed call ends the caller's session; they get a fresh session afterwards.
const endsSession = (rule: RouteRule) => rule.path.startsWith('/auth/sign-out');
const roles = roleSchema.options;
/** The app's table, built from the routes' own declarations when the app is made. */
const guarded = () => routeTableOf(t.app).rules.filter((r) => r.access !== 'public');

describe('the permission table', () => {
  // Every route of the table in one walk each (the table exists once the app does); a failure lists each route that broke it.
  it('answers 401 to a signed-out caller on every guarded route', async () => {
    expect(guarded().length).toBeGreaterThan(40);
    const wrong: string[] = [];
    for (const rule of guarded()) {
      const res = await send(request, rule);
      if (res.status !== 401) wrong.push(`${rule.method} ${rule.path}: ${res.status}`);
    }
    expect(wrong).toEqual([]);
  }, 120_000);

  it('lets every role through exactly the routes the table gives it', async () => {
    const wrong: string[] = [];
    for (const rule of guarded()) {
      for (const role of roles) {
        const res = await send(agents[role], rule);
        const allowed = rule.access === 'member' || (Array.isArray(rule.access) && rule.access.includes(role));
        if (allowed && [401, 403].includes(res.status)) wrong.push(`${rule.method} ${rule.path} as ${role}: ${res.status}, allowed by the table`);
        if (!allowed && (res.status !== 403 || res.body.error?.code !== 'forbidden')) wrong.push(`${rule.method} ${rule.path} as ${role}: ${res.status}, refused by the table`);
        if (allowed && endsSession(rule)) agents[role] = await signedIn(t.app, `${role.replace('_', '')}@home.test`);
      }
    }
    expect(wrong).toEqual([]);
  }, 300_000);

  it('has a route of every kind the roles differ on', () => {
    // The walk above can only fail on a route whose roles it knows: the owner-only, editor and token routes must be in it.
    const access = (method: string, path: string) => routeTableOf(t.app).find(method, path)?.access;
    expect(access('POST', '/team/invites')).toEqual(['owner']);
    expect(access('POST', '/courses')).toEqual(['owner', 'designer']);
    expect(access('POST', '/tokens')).toEqual(['owner', 'programmer']);
    expect(access('GET', '/health')).toBe('public');
  });

  it('answers 404, never 403, for another team’s resources', async () => {
    const home = await t.db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', 'designer@home.test').first('m.user_id');
    const res = await agents.outsider.patch(`/api/team/members/${home.user_id}`).send({ role: 'owner' });
    expect(res.status).toBe(404);
    const stillDesigner = await t.db('memberships').where({ user_id: home.user_id }).first('role');
    expect(stillDesigner.role).toBe('designer');
  });

  it('lists every route the app serves, and only those', () => {
    const served = routesOf(t.app);
    const table = routeTableOf(t.app);
    const missingFromTable = served.filter((r) => !table.find(r.method, r.path.slice('/api'.length).replace(/:(\w+)/g, 'x')));
    expect(missingFromTable).toEqual([]);
    const servedKeys = new Set(served.map((r) => `${r.method} ${r.path}`));
    const notServed = table.rules.filter((rule) => !servedKeys.has(`${rule.method} /api${rule.path}`));
    expect(notServed).toEqual([]);
  });

  it('serves the table as roles × actions, and /me carries the viewer’s actions', async () => {
    const table = await agents.designer.get('/api/permissions');
    expect(table.status).toBe(200);
    const invite = table.body.actions.find((a: { action: string }) => a.action === 'team.invite');
    expect(invite.roles).toEqual(['owner']);
    const me = await agents.programmer.get('/api/me');
    expect(me.body.permissions).toContain('team.read');
    expect(me.body.permissions).not.toContain('team.invite');
  });
});

type Layer = { rawPath?: string; route?: { path: string; methods: Record<string, boolean> }; handle: { stack?: Layer[] } };

/** Every method + full path registered on the Express app, read from its router stack. */
function routesOf(app: Express): { method: string; path: string }[] {
  const out: { method: string; path: string }[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [method, on] of Object.entries(layer.route.methods)) if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: join(prefix, layer.route.path) });
      } else if (layer.handle.stack) {
        walk(layer.handle.stack, typeof layer.rawPath === 'string' ? join(prefix, layer.rawPath) : prefix);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out.filter((r) => r.path.startsWith('/api/'));
}

const join = (a: string, b: string) => (a + (b === '/' ? '' : b)).replace(/\/+/g, '/') || '/';
