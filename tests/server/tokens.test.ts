/**
 * API tokens: shown once and stored as SHA-256 only (FIPS 180-4 digest, via node:crypto), read-only, bound to
 * their team, revocable, last use recorded; files carry an ETag and If-None-Match answers 304 (RFC 9110 §13.1.2).
 */
import crypto from 'node:crypto';
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';
import { demoStudio } from './profiles-helpers';

jest.setTimeout(120_000);

let t: TestApp;
let s: Awaited<ReturnType<typeof demoStudio>>;
let secret: string;
let tokenId: number;
beforeAll(async () => {
  t = await testApp();
  s = await demoStudio(t);
  const res = await s.agents.programmer.post('/api/tokens').send({ name: 'CI build' });
  expect(res.status).toBe(201);
  secret = res.body.secret;
  tokenId = res.body.token.id;
});
afterAll(() => t.cleanup());

const bearer = (path: string, token = secret) => request(t.app).get(path).set('Authorization', `Bearer ${token}`);

describe('creating and listing tokens', () => {
  it('shows the secret once and stores only its SHA-256', async () => {
    expect(secret).toMatch(/^tdl_[A-Za-z0-9_-]{43}$/);
    const row = await t.db('api_tokens').where({ id: tokenId }).first();
    expect(row.hash).toBe(crypto.createHash('sha256').update(secret).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(secret.slice(4));
    const list = await s.agents.owner.get('/api/tokens');
    expect(list.status).toBe(200);
    expect(JSON.stringify(list.body)).not.toContain(secret.slice(4));
    expect(list.body.tokens[0]).toMatchObject({ id: tokenId, name: 'CI build', createdBy: { name: 'Priya Kettle' }, lastUsedAt: null, revokedAt: null });
  });

  it('is for the owner and the programmer only, and a name is required', async () => {
    expect((await s.agents.designer.post('/api/tokens').send({ name: 'x' })).status).toBe(403);
    expect((await s.agents.art_lead.get('/api/tokens')).status).toBe(403);
    const unnamed = await s.agents.owner.post('/api/tokens').send({ name: ' ' });
    expect(unnamed.status).toBe(400);
    expect(unnamed.body.error.fields.name).toMatch(/Name the token/);
  });
});

describe('reading with a token', () => {
  it('lists the team’s characters with their profiles and records the use', async () => {
    t.clock.advance(1000);
    const res = await bearer('/api/v1/characters');
    expect(res.status).toBe(200);
    expect(res.body.characters.map((c: { name: string }) => c.name)).toEqual(['Burrow', 'Skitter', 'Wicket']);
    expect(res.body.characters.find((c: { name: string }) => c.name === 'Wicket').profile).toEqual({ id: s.profiles.Wicket.id, latestVersion: 2 });
    expect(Number((await t.db('api_tokens').where({ id: tokenId }).first('last_used_at')).last_used_at)).toBe(t.clock.now());
  });

  it('lists a character’s profiles', async () => {
    const res = await bearer(`/api/v1/characters/${s.profiles.Burrow.characterId}/profiles`);
    expect(res.status).toBe(200);
    expect(res.body.profiles[0]).toMatchObject({ id: s.profiles.Burrow.id, versionCount: 1, latest: { version: 1 } });
  });

  it('downloads a version with a strong ETag, and answers 304 to If-None-Match', async () => {
    const path = `/api/v1/profiles/${s.profiles.Wicket.id}/versions/latest`;
    const res = await bearer(path);
    expect(res.status).toBe(200);
    expect(JSON.parse(res.text).version).toBe(2);
    expect(res.headers.etag).toBe(`"${crypto.createHash('sha256').update(res.text).digest('hex')}"`);
    const again = await bearer(path).set('If-None-Match', res.headers.etag);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
    // fetch() sends Cache-Control: no-cache with every conditional request; the check must still answer 304.
    const fromFetch = await bearer(path).set('If-None-Match', res.headers.etag).set('Cache-Control', 'no-cache');
    expect(fromFetch.status).toBe(304);
    const v1 = await bearer(`/api/v1/profiles/${s.profiles.Wicket.id}/versions/1`).set('If-None-Match', res.headers.etag);
    expect(v1.status).toBe(200);
    expect(JSON.parse(v1.text).version).toBe(1);
  });

  it('offers the file as a download when asked', async () => {
    const res = await bearer(`/api/v1/profiles/${s.profiles.Wicket.id}/versions/1?download`);
    // RFC 6266 §4.1: the name may be a token or a quoted string.
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?wicket-v1\.leg-profile\.json"?$/);
  });

  it('the same routes work with a signed-in session', async () => {
    expect((await s.agents.art_lead.get('/api/v1/characters')).status).toBe(200);
  });

  it('says what is wrong with a bad version', async () => {
    const res = await bearer(`/api/v1/profiles/${s.profiles.Wicket.id}/versions/newest`);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/latest/);
  });
});

describe('what a token may not do', () => {
  it('is read-only: a write is refused with a clear message and nothing changes', async () => {
    const del = await request(t.app).delete(`/api/v1/characters`).set('Authorization', `Bearer ${secret}`);
    expect(del.status).toBe(403);
    expect(del.body.error.code).toBe('read_only_token');
    expect(del.body.error.message).toMatch(/read-only/);
  });

  it('reaches only the /api/v1 routes', async () => {
    const publish = await request(t.app)
      .post('/api/profiles')
      .set('Authorization', `Bearer ${secret}`)
      .send({ characterId: s.profiles.Skitter.characterId, suiteId: s.suiteId });
    expect(publish.status).toBe(403);
    expect(publish.body.error.code).toBe('token_scope');
    const tokens = await request(t.app).post('/api/tokens').set('Authorization', `Bearer ${secret}`).send({ name: 'sneaky' });
    expect(tokens.status).toBe(403);
    expect(await t.db('api_tokens').count({ n: '*' }).first()).toEqual({ n: 1 });
    expect((await request(t.app).get('/api/team').set('Authorization', `Bearer ${secret}`)).status).toBe(403);
  });

  it('is bound to its team: another studio’s token sees none of this team’s profiles', async () => {
    const away = await createStudio(t.db, 'away');
    const owner = await signedIn(t.app, away.members.owner.email);
    const theirs = (await owner.post('/api/tokens').send({ name: 'away build' })).body.secret;
    expect((await bearer('/api/v1/characters', theirs)).body.characters).toEqual([]);
    expect((await bearer(`/api/v1/profiles/${s.profiles.Wicket.id}/versions/latest`, theirs)).status).toBe(404);
    expect((await bearer(`/api/v1/characters/${s.profiles.Wicket.characterId}/profiles`, theirs)).status).toBe(404);
  });

  it('an unknown token is a 401', async () => {
    const res = await bearer('/api/v1/characters', 'tdl_not-a-real-token');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('a revoked token is a 401 that says so', async () => {
    const made = await s.agents.owner.post('/api/tokens').send({ name: 'old laptop' });
    expect((await bearer('/api/v1/characters', made.body.secret)).status).toBe(200);
    const revoked = await s.agents.owner.delete(`/api/tokens/${made.body.token.id}`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.token.revokedAt).toBe(t.clock.now());
    const res = await bearer('/api/v1/characters', made.body.secret);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('revoked_token');
    expect(res.body.error.message).toMatch(/"old laptop" was revoked/);
  });
});
