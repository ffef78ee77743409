import request from 'supertest';
import type { Express } from 'express';
import { testApp } from '../support/test-app';

let app: Express;
let cleanup: () => Promise<void>;
beforeAll(async () => {
  ({ app, cleanup } = await testApp());
});
afterAll(() => cleanup());

describe('the API platform', () => {
  it('reports health with the database reachable', async () => {
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, version: 'test', db: 'ok' });
  });

  it('answers an unknown API path with the JSON error shape', async () => {
    const res = await request(app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: expect.stringContaining('/no-such-thing') } });
  });

  it('answers malformed JSON with a 400 that says so, and no stack trace', async () => {
    const res = await request(app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('sends security headers (helmet)', async () => {
    const res = await request(app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('keeps foreign keys on and the journal in WAL mode', async () => {
    const { db, cleanup: done } = await testApp();
    const [fk] = await db.raw('PRAGMA foreign_keys');
    const [journal] = await db.raw('PRAGMA journal_mode');
    expect(fk.foreign_keys).toBe(1);
    expect(journal.journal_mode).toBe('wal');
    await done();
  });
});
