import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db';
import { testApp, TEST_PUBLIC_URL } from '../support/test-app';
import type { MailCatcher } from '../../server/fakes/mail-catcher';
import { signUpThroughMail } from '../support/studio';

// A shared, busy machine: generous hook timeouts (no test checks how long anything takes).
jest.setTimeout(30_000);

let app: Express;
let db: Db;
let mail: MailCatcher;
let clock: Awaited<ReturnType<typeof testApp>>['clock'];
let cleanup: () => Promise<void>;

beforeEach(async () => {
  ({ app, db, mail, clock, cleanup } = await testApp());
});
afterEach(() => cleanup());

const newStudio = { name: 'Mara Quill', email: 'mara@example.test', password: 'long enough phrase', teamName: 'Quill Works' };

async function counts() {
  const n = async (t: string) => Number((await db(t).count({ n: '*' }).first())?.n);
  return { users: await n('users'), teams: await n('teams'), memberships: await n('memberships') };
}

const linkIn = (text: string) => {
  const m = text.match(new RegExp(`${TEST_PUBLIC_URL}/sign-up-confirm/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no sign-up link in: ${text}`);
  return m[1];
};

describe('sign up', () => {
  it('mails a link; following it creates the user and a team they own, and signs them in', async () => {
    const agent = await signUpThroughMail(app, mail, newStudio);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toEqual({
      user: { id: expect.any(Number), email: 'mara@example.test', name: 'Mara Quill' },
      team: { id: expect.any(Number), name: 'Quill Works' },
      role: 'owner',
      permissions: expect.arrayContaining(['team.invite', 'team.change-role']),
      teams: [{ id: expect.any(Number), name: 'Quill Works', role: 'owner' }],
    });
  });

  it('makes nothing and signs no one in until the link is followed; the link works once', async () => {
    const agent = request.agent(app);
    const res = await agent.post('/api/auth/sign-up').send(newStudio);
    expect(res.status).toBe(202);
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(await counts()).toEqual({ users: 0, teams: 0, memberships: 0 });
    expect((await agent.get('/api/me')).status).toBe(401);
    const token = linkIn((await mail.waitFor((m) => m.to === newStudio.email)).text);
    // Only the token's hash is kept.
    expect(JSON.stringify(await db('sign_up_requests').select())).not.toContain(token);
    const confirmed = await agent.post('/api/auth/sign-up/confirm').send({ token });
    expect(confirmed.status).toBe(201);
    const cookie = String(confirmed.headers['set-cookie']);
    expect(cookie).toMatch(/treadle\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(await counts()).toEqual({ users: 1, teams: 1, memberships: 1 });
    const again = await request(app).post('/api/auth/sign-up/confirm').send({ token });
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/used/);
    expect(await counts()).toEqual({ users: 1, teams: 1, memberships: 1 });
  });

  it('refuses an expired sign-up link', async () => {
    await request(app).post('/api/auth/sign-up').send(newStudio).expect(202);
    const token = linkIn((await mail.waitFor((m) => m.to === newStudio.email)).text);
    clock.advance(24 * 3600 * 1000 + 1);
    const res = await request(app).post('/api/auth/sign-up/confirm').send({ token });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('sign_up_expired');
    expect(await counts()).toEqual({ users: 0, teams: 0, memberships: 0 });
  });

  it('stores a bcrypt hash with cost at least 10, never the password', async () => {
    await signUpThroughMail(app, mail, newStudio);
    const user = await db('users').first();
    // bcrypt's modular crypt format: $2a$/$2b$, two-digit cost, 53 characters of salt and hash.
    expect(user.password_hash).toMatch(/^\$2[ab]\$(\d\d)\$.{53}$/);
    expect(Number(user.password_hash.slice(4, 6))).toBeGreaterThanOrEqual(10);
    expect(user.password_hash).not.toContain(newStudio.password);
    expect(JSON.stringify(await db('sign_up_requests').select())).not.toContain(newStudio.password);
  });

  it.each([
    ['missing fields', {}, ['name', 'email', 'password', 'teamName']],
    ['a malformed e-mail', { ...newStudio, email: 'mara-at-example' }, ['email']],
    ['a short password', { ...newStudio, password: 'short' }, ['password']],
    ['a blank name', { ...newStudio, name: '   ' }, ['name']],
  ])('refuses %s with field messages and writes nothing', async (_what, body, fields) => {
    const res = await request(app).post('/api/auth/sign-up').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    for (const f of fields) expect(typeof res.body.error.fields[f]).toBe('string');
    expect(await counts()).toEqual({ users: 0, teams: 0, memberships: 0 });
    expect(await db('sign_up_requests').count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('answers a registered address (any case) exactly like a new one, and mails it a notice instead', async () => {
    await signUpThroughMail(app, mail, newStudio);
    const taken = await request(app).post('/api/auth/sign-up').send({ ...newStudio, email: 'MARA@example.test', teamName: 'Second' });
    const fresh = await request(app).post('/api/auth/sign-up').send({ ...newStudio, email: 'nobody@example.test', teamName: 'Second' });
    expect(taken.status).toBe(202);
    expect(fresh.status).toBe(202);
    // The same words, but for the address each typed (OWASP Authentication Cheat Sheet, "Authentication and Error Messages").
    expect(taken.body).toEqual({ ...fresh.body, message: fresh.body.message.replace('nobody@example.test', 'mara@example.test') });
    expect(JSON.stringify(taken.body)).not.toMatch(/already|exists/i);
    const notice = await mail.waitFor((m) => m.to === 'mara@example.test' && /already has an account/.test(m.text));
    expect(notice.subject).toBe('You already have a Treadle account');
    expect(notice.text).not.toMatch(/sign-up-confirm/);
    await mail.waitFor((m) => m.to === 'nobody@example.test' && /sign-up-confirm/.test(m.text));
    expect(await counts()).toEqual({ users: 1, teams: 1, memberships: 1 });
  });

  it('answers without waiting for the mail, for known and unknown addresses alike', async () => {
    // A mailer that never finishes: an answer that waited for it would never come (and would differ in time).
    const stalled = await testApp({ mailer: { send: () => new Promise<void>(() => undefined) } });
    try {
      await stalled.db('users').insert({ email: 'known@example.test', name: 'Known', password_hash: 'x', created_at: 1 });
      for (const email of ['known@example.test', 'unknown@example.test']) {
        expect((await request(stalled.app).post('/api/auth/sign-up').send({ ...newStudio, email })).status).toBe(202);
        expect((await request(stalled.app).post('/api/auth/reset-request').send({ email })).status).toBe(202);
      }
    } finally {
      await stalled.cleanup();
    }
  });

  it('throttles sign-ups from one network with a clear 429', async () => {
    let last: request.Response | undefined;
    for (let i = 0; i < 11; i++) last = await request(app).post('/api/auth/sign-up').send({ ...newStudio, email: `probe${i}@example.test` });
    expect(last!.status).toBe(429);
    expect(last!.body.error.message).toMatch(/Too many sign-ups/);
  });

  it('accepts a 64-character password (NIST SP 800-63B §5.1.1 asks that at least 64 be allowed)', async () => {
    const res = await request(app).post('/api/auth/sign-up').send({ ...newStudio, password: 'x'.repeat(64) });
    expect(res.status).toBe(202);
  });

  it('refuses a password past bcrypt’s 72 bytes with a field message, rather than cutting it short', async () => {
    // bcrypt uses only the first 72 bytes of its key (Provos & Mazières 1999; bcryptjs documents the same limit).
    // 40 "é" are 40 characters but 80 bytes in UTF-8 (RFC 3629: U+00E9 takes two bytes).
    const res = await request(app).post('/api/auth/sign-up').send({ ...newStudio, password: 'é'.repeat(40) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/at most 72 bytes/);
    expect((await request(app).post('/api/auth/sign-up').send({ ...newStudio, password: 'y'.repeat(72) })).status).toBe(202);
    expect((await request(app).post('/api/auth/sign-up').send({ ...newStudio, password: 'y'.repeat(73) })).status).toBe(400);
  });
});

describe('sign in and out', () => {
  beforeEach(async () => {
    await signUpThroughMail(app, mail, newStudio);
  });

  it('signs in with the right password and out again', async () => {
    const agent = request.agent(app);
    expect((await agent.post('/api/auth/sign-in').send({ email: newStudio.email, password: newStudio.password })).status).toBe(200);
    expect((await agent.get('/api/me')).status).toBe(200);
    expect((await agent.post('/api/auth/sign-out')).status).toBe(200);
    const after = await agent.get('/api/me');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('unauthenticated');
  });

  it('gives the same 401 message for a wrong password and an unknown e-mail', async () => {
    const wrongPassword = await request(app).post('/api/auth/sign-in').send({ email: newStudio.email, password: 'not the password' });
    const unknownEmail = await request(app).post('/api/auth/sign-in').send({ email: 'nobody@example.test', password: 'whatever it is' });
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(wrongPassword.body).toEqual(unknownEmail.body);
    expect(wrongPassword.body.error.message).toBe('Wrong e-mail or password.');
  });

  it('gives field messages for missing sign-in fields', async () => {
    const res = await request(app).post('/api/auth/sign-in').send({ email: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ email: expect.any(String), password: expect.any(String) });
  });

  it('rotates the session id at sign-in', async () => {
    const agent = request.agent(app);
    const first = await agent.post('/api/auth/sign-in').send({ email: newStudio.email, password: newStudio.password });
    const second = await agent.post('/api/auth/sign-in').send({ email: newStudio.email, password: newStudio.password });
    const sid = (r: request.Response) => String(r.headers['set-cookie']).match(/treadle\.sid=([^;]+)/)?.[1];
    expect(sid(first)).toBeTruthy();
    expect(sid(second)).toBeTruthy();
    expect(sid(first)).not.toEqual(sid(second));
  });
});
