/**
 * Platform hardening: which hosts are served (DNS rebinding), the headers every answer carries, the Origin check,
 * and how sign-in failures are counted and from which address.
 */
import request from 'supertest';
import { testApp, TEST_PUBLIC_URL, type TestApp } from '../support/test-app';
import { createStudio, signedIn, STUDIO_PASSWORD } from '../support/studio';
import { allowedHostsOf, parseTrustProxy } from '../../server/config';

// A shared, busy machine: generous hook timeouts (no test checks how long anything takes).
jest.setTimeout(60_000);

let t: TestApp;
let studio: Awaited<ReturnType<typeof createStudio>>;
let port: number;
beforeAll(async () => {
  t = await testApp({ allowedHosts: allowedHostsOf({ host: '127.0.0.1', publicUrl: TEST_PUBLIC_URL }) });
  studio = await createStudio(t.db, 'harden');
  port = Number(new URL(t.url).port);
});
afterAll(() => t.cleanup());

describe('hosts this server answers to (DNS rebinding)', () => {
  it('answers a Host it was not set up for with 421 and a message naming it, before any route runs', async () => {
    const res = await request(t.url).get('/api/health').set('Host', `rebind.example:${port}`);
    expect(res.status).toBe(421); // RFC 9110 §15.5.20, Misdirected Request
    expect(res.body.error.code).toBe('unknown_host');
    expect(res.body.error.message).toContain('rebind.example');
    const signIn = await request(t.url).post('/api/auth/sign-in').set('Host', `rebind.example:${port}`).send({ email: studio.members.owner.email, password: STUDIO_PASSWORD });
    expect(signIn.status).toBe(421);
    expect(signIn.headers['set-cookie']).toBeUndefined();
    // The web app's pages too, not only the API.
    expect((await request(t.url).get('/sign-in').set('Host', 'rebind.example')).status).toBe(421);
  });

  it.each([
    ['127.0.0.1 with the port', () => `127.0.0.1:${port}`],
    ['localhost with the port', () => `localhost:${port}`],
    ['[::1] with the port', () => `[::1]:${port}`],
    ['PUBLIC_URL’s host', () => 'treadle.test'],
    ['PUBLIC_URL’s host in capitals', () => 'TREADLE.test'],
  ])('serves %s', async (_what, host) => {
    expect((await request(t.url).get('/api/health').set('Host', host())).status).toBe(200);
  });

  it('refuses a known name on a port it does not listen on, and a Host that is not one', async () => {
    expect((await request(t.url).get('/api/health').set('Host', '127.0.0.1:1')).status).toBe(421);
    expect((await request(t.url).get('/api/health').set('Host', 'localhost.rebind.example')).status).toBe(421);
    expect((await request(t.url).get('/api/health').set('Host', 'user@localhost')).status).toBe(421);
  });

  it('builds the list from PUBLIC_URL, HOST and ALLOWED_HOSTS, always with the localhost forms', () => {
    expect(allowedHostsOf({ host: '192.168.1.20', publicUrl: 'https://feet.example.com/', extra: 'Studio-Box, ' }).sort()).toEqual(
      ['127.0.0.1', '192.168.1.20', '::1', '[::1]', 'feet.example.com', 'localhost', 'studio-box'].sort(),
    );
  });
});

describe('headers', () => {
  it('marks signed-in JSON as never to be stored (OWASP ASVS 4.0 V8.2.1)', async () => {
    const owner = await signedIn(t.app, studio.members.owner.email);
    for (const path of ['/api/me', '/api/team', '/api/characters']) {
      const res = await owner.get(path);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-store');
    }
  });

  it('sends a Permissions-Policy that switches off camera, microphone, location and payment', async () => {
    const res = await request(t.app).get('/api/health');
    const policy = String(res.headers['permissions-policy']);
    for (const feature of ['camera=()', 'microphone=()', 'geolocation=()', 'payment=()']) expect(policy).toContain(feature);
  });

  it('sends no HSTS over plain http (RFC 6797 §7.2)', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });

  it('sends HSTS when a trusted proxy says the request came over https', async () => {
    const proxied = await testApp({ trustProxy: ['loopback'] });
    try {
      const res = await request(proxied.app).get('/api/health').set('X-Forwarded-Proto', 'https');
      expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    } finally {
      await proxied.cleanup();
    }
  });
});

describe('the Origin check compares the whole origin', () => {
  it('refuses a write whose Origin has the same host but another scheme (RFC 6454 §4)', async () => {
    // An agent on the listening address, so the Origin below names the very host and port it talks to.
    const owner = request.agent(t.url);
    await owner.post('/api/auth/sign-in').send({ email: studio.members.owner.email, password: STUDIO_PASSWORD }).expect(200);
    const designer = studio.members.designer.id;
    const otherScheme = await owner.patch(`/api/team/members/${designer}`).set('Origin', `https://127.0.0.1:${port}`).send({ role: 'art_lead' });
    expect(otherScheme.status).toBe(403);
    expect(otherScheme.body.error.code).toBe('cross_site');
    expect((await t.db('memberships').where({ user_id: designer }).first('role')).role).toBe('designer');
    const same = await owner.patch(`/api/team/members/${designer}`).set('Origin', `http://127.0.0.1:${port}`).send({ role: 'art_lead' });
    expect(same.status).toBe(200);
    await owner.patch(`/api/team/members/${designer}`).send({ role: 'designer' }).expect(200);
  });
});

describe('sign-in throttling (OWASP Authentication Cheat Sheet: count failures per account and per source)', () => {
  const wrong = (app: TestApp['app'], email: string, forwardedFor?: string) => {
    const r = request(app).post('/api/auth/sign-in');
    if (forwardedFor) r.set('X-Forwarded-For', forwardedFor);
    return r.send({ email, password: 'a wrong guess' });
  };

  it('does not count successful sign-ins: twelve in a row all get in', async () => {
    for (let i = 0; i < 12; i++) {
      const res = await request(t.app).post('/api/auth/sign-in').send({ email: studio.members.programmer.email, password: STUDIO_PASSWORD });
      expect(res.status).toBe(200);
    }
  });

  it('stops one network trying many addresses: the 26th failure is 429', async () => {
    const fresh = await testApp();
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 26; i++) statuses.push((await wrong(fresh.app, `sprayed${i}@harden.test`)).status);
      expect(statuses.slice(0, 25)).toEqual(Array(25).fill(401));
      expect(statuses[25]).toBe(429);
    } finally {
      await fresh.cleanup();
    }
  });

  it('ignores X-Forwarded-For without TRUST_PROXY, even with SECURE_COOKIES=1: rotating it does not help', async () => {
    const direct = await testApp({ secureCookies: true });
    try {
      let last = 0;
      for (let i = 0; i < 26; i++) last = (await wrong(direct.app, `rotated${i}@harden.test`, `198.51.100.${i + 1}`)).status;
      expect(last).toBe(429);
    } finally {
      await direct.cleanup();
    }
  });

  it('believes X-Forwarded-For from the configured proxy: one client’s failures do not block another', async () => {
    const proxied = await testApp({ trustProxy: parseTrustProxy('loopback') || undefined });
    try {
      for (let i = 0; i < 25; i++) await wrong(proxied.app, `from-a${i}@harden.test`, '203.0.113.7');
      expect((await wrong(proxied.app, 'from-a-last@harden.test', '203.0.113.7')).status).toBe(429);
      expect((await wrong(proxied.app, 'from-b@harden.test', '203.0.113.8')).status).toBe(401);
      // Per account, wherever the guesses come from: the 11th failure for one address is refused.
      const victim = 'victim@harden.test';
      for (let i = 0; i < 10; i++) expect((await wrong(proxied.app, victim, `192.0.2.${i + 1}`)).status).toBe(401);
      const eleventh = await wrong(proxied.app, victim, '192.0.2.99');
      expect(eleventh.status).toBe(429);
      expect(eleventh.body.error.message).toMatch(/for this account/);
    } finally {
      await proxied.cleanup();
    }
  });

  it('refuses a TRUST_PROXY that would believe anyone', () => {
    expect(() => parseTrustProxy('1')).toThrow(/hop count/);
    expect(() => parseTrustProxy('true')).toThrow(/hop count/);
    expect(parseTrustProxy('10.0.0.1, loopback')).toEqual(['10.0.0.1', 'loopback']);
    expect(parseTrustProxy(undefined)).toBe(false);
  });
});
