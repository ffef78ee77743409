import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db';
import { testApp } from '../support/test-app';

let app: Express;
let db: Db;
let cleanup: () => Promise<void>;

beforeEach(async () => {
  ({ app, db, cleanup } = await testApp());
});
afterEach(() => cleanup());

const newStudio = { name: 'Mara Quill', email: 'mara@example.test', password: 'long enough phrase', teamName: 'Quill Works' };

async function counts() {
  const n = async (t: string) => Number((await db(t).count({ n: '*' }).first())?.n);
  return { users: await n('users'), teams: await n('teams'), memberships: await n('memberships') };
}

describe('sign up', () => {
  it('creates the user, a team they own, and signs them in', async () => {
    const agent = request.agent(app);
    const res = await agent.post('/api/auth/sign-up').send(newStudio);
    expect(res.status).toBe(201);
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

  it('sets an httpOnly, SameSite=Lax session cookie', async () => {
    const res = await request(app).post('/api/auth/sign-up').send(newStudio);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/treadle\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('stores a bcrypt hash with cost at least 10, never the password', async () => {
    await request(app).post('/api/auth/sign-up').send(newStudio);
    const user = await db('users').first();
    // bcrypt's modular crypt format: $2a$/$2b$, two-digit cost, 53 characters of salt and hash.
    expect(user.password_hash).toMatch(/^\$2[ab]\$(\d\d)\$.{53}$/);
    expect(Number(user.password_hash.slice(4, 6))).toBeGreaterThanOrEqual(10);
    expect(user.password_hash).not.toContain(newStudio.password);
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
  });

  it('refuses a duplicate e-mail (any case) with a field message and writes nothing more', async () => {
    await request(app).post('/api/auth/sign-up').send(newStudio);
    const res = await request(app)
      .post('/api/auth/sign-up')
      .send({ ...newStudio, email: 'MARA@example.test', teamName: 'Second' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toMatch(/already exists/);
    expect(await counts()).toEqual({ users: 1, teams: 1, memberships: 1 });
  });

  it('accepts a 64-character password (NIST SP 800-63B §5.1.1 asks that at least 64 be allowed)', async () => {
    const res = await request(app).post('/api/auth/sign-up').send({ ...newStudio, password: 'x'.repeat(64) });
    expect(res.status).toBe(201);
  });
});

describe('sign in and out', () => {
  beforeEach(async () => {
    await request(app).post('/api/auth/sign-up').send(newStudio);
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
