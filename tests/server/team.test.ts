import request from 'supertest';
import { testApp, TEST_PUBLIC_URL, type TestApp } from '../support/test-app';
import { createStudio, signedIn, STUDIO_PASSWORD } from '../support/studio';
import { INVITE_TTL_MS } from '../../server/services/invites';

let t: TestApp;
let studio: Awaited<ReturnType<typeof createStudio>>;
let owner: ReturnType<typeof request.agent>;

beforeEach(async () => {
  t = await testApp();
  studio = await createStudio(t.db, 'gantry');
  owner = await signedIn(t.app, studio.members.owner.email);
});
afterEach(() => t.cleanup());

const tokenIn = (text: string, kind: 'invite' | 'reset-password') => {
  const m = text.match(new RegExp(`${TEST_PUBLIC_URL}/${kind}/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${kind} link in: ${text}`);
  return m[1];
};

describe('invites through real SMTP on loopback', () => {
  it('owner invites, the mail arrives, the link is accepted, the new member signs in with the invited role', async () => {
    const sent = await owner.post('/api/team/invites').send({ email: 'Wren@Scrapyard.test', role: 'programmer' });
    expect(sent.status).toBe(201);

    const mail = await t.mail.waitFor((m) => m.to === 'wren@scrapyard.test');
    expect(mail.subject).toBe('owner of gantry invited you to Studio gantry on Treadle');
    expect(mail.from).toContain('no-reply@treadle.local');
    expect(mail.text).toContain('as Programmer');
    expect(mail.text).toMatch(/expires in 7 days/);
    const token = tokenIn(mail.text, 'invite');

    // Only the token's hash is stored.
    const row = await t.db('invites').first();
    expect(row.token_hash).not.toContain(token);
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);

    const preview = await request(t.app).get(`/api/invites/${token}`);
    expect(preview.body).toMatchObject({ teamName: 'Studio gantry', role: 'programmer', email: 'wren@scrapyard.test', hasAccount: false });

    const weak = await request(t.app).post(`/api/invites/${token}/accept`).send({ name: 'Wren', password: 'short' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toMatch(/at least 8/);

    const wren = request.agent(t.app);
    const accepted = await wren.post(`/api/invites/${token}/accept`).send({ name: 'Wren Tolley', password: 'bolts and washers' });
    expect(accepted.status).toBe(200);
    expect((await wren.get('/api/me')).body).toMatchObject({ role: 'programmer', team: { name: 'Studio gantry' } });

    const again = await signedIn(t.app, 'wren@scrapyard.test', 'bolts and washers');
    expect((await again.get('/api/me')).body.role).toBe('programmer');

    const reused = await request(t.app).post(`/api/invites/${token}/accept`).send({ name: 'Someone', password: 'bolts and washers' });
    expect(reused.status).toBe(410);
    expect(reused.body.error.message).toMatch(/used, revoked or replaced/);
  });

  it('refuses an expired link with its own message', async () => {
    await owner.post('/api/team/invites').send({ email: 'late@scrapyard.test', role: 'designer' });
    const token = tokenIn((await t.mail.waitFor((m) => m.to === 'late@scrapyard.test')).text, 'invite');
    t.clock.advance(INVITE_TTL_MS + 1);
    const res = await request(t.app).post(`/api/invites/${token}/accept`).send({ name: 'Late', password: 'bolts and washers' });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('invite_expired');
    expect(await t.db('users').where({ email: 'late@scrapyard.test' }).first()).toBeUndefined();
  });

  it('resend voids the old link; revoke voids the invite', async () => {
    await owner.post('/api/team/invites').send({ email: 'twice@scrapyard.test', role: 'art_lead' });
    const first = tokenIn((await t.mail.waitFor((m) => m.to === 'twice@scrapyard.test')).text, 'invite');
    const invites = (await owner.get('/api/team')).body.invites;
    expect(invites).toHaveLength(1);
    await owner.post(`/api/team/invites/${invites[0].id}/resend`);
    await t.mail.waitFor((m) => m.to === 'twice@scrapyard.test' && !m.text.includes(first));
    expect((await request(t.app).get(`/api/invites/${first}`)).status).toBe(410);

    const second = tokenIn(t.mail.messages().filter((m) => m.to === 'twice@scrapyard.test')[1].text, 'invite');
    expect((await request(t.app).get(`/api/invites/${second}`)).status).toBe(200);
    expect((await owner.delete(`/api/team/invites/${invites[0].id}`)).status).toBe(200);
    expect((await request(t.app).get(`/api/invites/${second}`)).status).toBe(410);
  });

  it('lets an existing account join a second studio with its own password, and switch between them', async () => {
    const other = await createStudio(t.db, 'dock');
    const otherOwner = await signedIn(t.app, other.members.owner.email);
    await otherOwner.post('/api/team/invites').send({ email: studio.members.designer.email, role: 'art_lead' });
    const token = tokenIn((await t.mail.waitFor((m) => m.to === studio.members.designer.email)).text, 'invite');
    expect((await request(t.app).get(`/api/invites/${token}`)).body.hasAccount).toBe(true);
    const wrong = await request(t.app).post(`/api/invites/${token}/accept`).send({ password: 'not it at all' });
    expect(wrong.status).toBe(401);
    const designer = request.agent(t.app);
    expect((await designer.post(`/api/invites/${token}/accept`).send({ password: STUDIO_PASSWORD })).status).toBe(200);
    const me = (await designer.get('/api/me')).body;
    expect(me.teams.map((x: { name: string }) => x.name)).toEqual(['Studio gantry', 'Studio dock']);
    await designer.post('/api/me/team').send({ teamId: studio.teamId });
    expect((await designer.get('/api/me')).body).toMatchObject({ team: { name: 'Studio gantry' }, role: 'designer' });
    const elsewhere = await createStudio(t.db, 'elsewhere');
    expect((await designer.post('/api/me/team').send({ teamId: elsewhere.teamId })).status).toBe(404);
  });

  it('refuses to invite someone already in the studio', async () => {
    const res = await owner.post('/api/team/invites').send({ email: studio.members.designer.email, role: 'owner' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toMatch(/already in this studio/);
  });
});

describe('members and roles', () => {
  it('protects the last owner from demotion and removal, with a clear message', async () => {
    const demote = await owner.patch(`/api/team/members/${studio.members.owner.id}`).send({ role: 'designer' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toMatch(/at least one owner/);
    const remove = await owner.delete(`/api/team/members/${studio.members.owner.id}`);
    expect(remove.status).toBe(409);
    // With a second owner, the first may step down.
    await owner.patch(`/api/team/members/${studio.members.designer.id}`).send({ role: 'owner' });
    expect((await owner.patch(`/api/team/members/${studio.members.owner.id}`).send({ role: 'designer' })).status).toBe(200);
  });

  it('refuses an unknown role with a field message', async () => {
    const res = await owner.patch(`/api/team/members/${studio.members.designer.id}`).send({ role: 'boss' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.role).toMatch(/Pick a role/);
  });

  it('records role, member and invite changes in the owner’s audit log', async () => {
    await owner.patch(`/api/team/members/${studio.members.programmer.id}`).send({ role: 'art_lead' });
    await owner.delete(`/api/team/members/${studio.members.art_lead.id}`);
    await owner.post('/api/team/invites').send({ email: 'new@scrapyard.test', role: 'designer' });
    const log = (await owner.get('/api/team/audit')).body.entries;
    expect(log.map((e: { action: string }) => e.action)).toEqual(['invite.sent', 'member.removed', 'member.role_changed']);
    expect(log[2]).toMatchObject({ subject: studio.members.programmer.email, detail: 'programmer → art_lead', actor: 'owner of gantry' });
  });

  it('a removed member loses access at once', async () => {
    const designer = await signedIn(t.app, studio.members.designer.email);
    await owner.delete(`/api/team/members/${studio.members.designer.id}`);
    expect((await designer.get('/api/me')).status).toBe(401);
  });
});

describe('password reset', () => {
  it('gives the same answer for known and unknown addresses, and mails only the known one', async () => {
    const known = await request(t.app).post('/api/auth/reset-request').send({ email: studio.members.designer.email });
    const unknown = await request(t.app).post('/api/auth/reset-request').send({ email: 'ghost@nowhere.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    await t.mail.waitFor((m) => m.to === studio.members.designer.email);
    expect(t.mail.messages().some((m) => m.to === 'ghost@nowhere.test')).toBe(false);
  });

  it('sets the new password with the token, ends every session of that user, and works once', async () => {
    const before = await signedIn(t.app, studio.members.designer.email);
    await request(t.app).post('/api/auth/reset-request').send({ email: studio.members.designer.email });
    const mail = await t.mail.waitFor((m) => m.to === studio.members.designer.email);
    expect(mail.text).toMatch(/expires in one hour/);
    const token = tokenIn(mail.text, 'reset-password');

    const common = await request(t.app).post('/api/auth/reset').send({ token, password: 'password123' });
    expect(common.status).toBe(400);
    expect(common.body.error.fields.password).toMatch(/most common/);

    expect((await request(t.app).post('/api/auth/reset').send({ token, password: 'a brand new phrase' })).status).toBe(200);
    expect((await before.get('/api/me')).status).toBe(401);
    const old = await request(t.app).post('/api/auth/sign-in').send({ email: studio.members.designer.email, password: STUDIO_PASSWORD });
    expect(old.status).toBe(401);
    await signedIn(t.app, studio.members.designer.email, 'a brand new phrase');
    const twice = await request(t.app).post('/api/auth/reset').send({ token, password: 'another new phrase' });
    expect(twice.status).toBe(410);
  });

  it('refuses an expired reset link', async () => {
    await request(t.app).post('/api/auth/reset-request').send({ email: studio.members.designer.email });
    const token = tokenIn((await t.mail.waitFor((m) => m.to === studio.members.designer.email)).text, 'reset-password');
    t.clock.advance(60 * 60 * 1000 + 1);
    const res = await request(t.app).post('/api/auth/reset').send({ token, password: 'a brand new phrase' });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('reset_expired');
  });
});

describe('hardening', () => {
  it('rate-limits sign-in attempts with a clear 429', async () => {
    let last: request.Response | undefined;
    for (let i = 0; i < 11; i++) last = await request(t.app).post('/api/auth/sign-in').send({ email: studio.members.designer.email, password: 'guess number ' + i });
    expect(last!.status).toBe(429);
    expect(last!.body.error.message).toMatch(/Too many failed sign-ins/);
  });

  it('rate-limits reset requests', async () => {
    let last: request.Response | undefined;
    for (let i = 0; i < 6; i++) last = await request(t.app).post('/api/auth/reset-request').send({ email: `n${i}@nowhere.test` });
    expect(last!.status).toBe(429);
  });

  it('refuses a cross-site write carrying the session cookie, and changes nothing (OWASP CSRF cheat sheet: Fetch Metadata)', async () => {
    const viaOtherSite = await owner
      .patch(`/api/team/members/${studio.members.designer.id}`)
      .set('Sec-Fetch-Site', 'cross-site')
      .set('Origin', 'http://evil.example')
      .send({ role: 'owner' });
    expect(viaOtherSite.status).toBe(403);
    expect(viaOtherSite.body.error.code).toBe('cross_site');
    const originOnly = await owner.post('/api/team/invites').set('Origin', 'http://evil.example').send({ email: 'x@evil.example', role: 'owner' });
    expect(originOnly.status).toBe(403);
    const row = await t.db('memberships').where({ user_id: studio.members.designer.id }).first('role');
    expect(row.role).toBe('designer');
    expect(await t.db('invites').count({ n: '*' }).first()).toEqual({ n: 0 });

    const sameSite = await owner.patch(`/api/team/members/${studio.members.designer.id}`).set('Sec-Fetch-Site', 'same-origin').send({ role: 'art_lead' });
    expect(sameSite.status).toBe(200);
  });

  it('signs out everywhere: every session of that user ends', async () => {
    const phone = await signedIn(t.app, studio.members.designer.email);
    const desk = await signedIn(t.app, studio.members.designer.email);
    expect((await phone.post('/api/auth/sign-out-everywhere')).status).toBe(200);
    expect((await desk.get('/api/me')).status).toBe(401);
    expect((await phone.get('/api/me')).status).toBe(401);
    await signedIn(t.app, studio.members.designer.email);
  });

  it('refuses the most common passwords at sign-up (NIST SP 800-63B §5.1.1.2)', async () => {
    const res = await request(t.app).post('/api/auth/sign-up').send({ name: 'A', email: 'a@b.test', password: 'Password1', teamName: 'T' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/most common/);
  });
});
