/**
 * GET /api/characters/:id/file, the stored glTF binary the 3D walk poses: the character's access rules
 * (declared beside the route in server/routes/characters.ts: every member of its team), an entity tag for caching (RFC 9110 §8.8.3
 * ETag, §13.1.2 If-None-Match: a matching tag answers 304 Not Modified without a body), and nothing for anyone
 * else: a member of another team gets 404 as if it did not exist, a signed-out visitor 401.
 */
import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';
import { seedDemoStudio } from '../../seeds/demo-studio';

jest.setTimeout(60_000);

let t: TestApp;
let wicket: { id: number; sha256: string };

beforeAll(async () => {
  t = await testApp();
  await seedDemoStudio(t.db, { now: t.clock.now(), dataDir: t.dataDir });
  const row = await t.db('characters').where({ name: 'Wicket' }).first('id', 'sha256');
  wicket = { id: row.id, sha256: row.sha256 };
});
afterAll(() => t.cleanup());


describe("a character's stored glTF", () => {
  it('is served to every role of its team, as GLB with an ETag naming its content', async () => {
    for (const who of ['owner', 'designer', 'programmer', 'artlead']) {
      const agent = await signedIn(t.app, `${who}@brassmoth.test`, 'treadle-demo');
      const res = await agent.get(`/api/characters/${wicket.id}/file`).buffer(true).parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
      expect(res.status).toBe(200);
      // glTF 2.0 §4.4.2: a GLB starts with the magic "glTF" and version 2.
      const body = res.body as Buffer;
      expect(body.subarray(0, 4).toString('latin1')).toBe('glTF');
      expect(body.readUInt32LE(4)).toBe(2);
      expect(res.headers.etag).toBe(`"${wicket.sha256}"`);
    }
  });

  it('answers 304 without a body when the browser already holds that version', async () => {
    const agent = await signedIn(t.app, 'artlead@brassmoth.test', 'treadle-demo');
    const res = await agent.get(`/api/characters/${wicket.id}/file`).set('If-None-Match', `"${wicket.sha256}"`);
    expect(res.status).toBe(304);
    expect(res.text ?? '').toBe('');
    // Another tag is not a match: the file comes again.
    const other = await agent.get(`/api/characters/${wicket.id}/file`).set('If-None-Match', '"0000"');
    expect(other.status).toBe(200);
  });

  it("is hidden from another team's member (404) and refused to a signed-out visitor (401)", async () => {
    const { members } = await createStudio(t.db, 'rivet');
    const outsider = await signedIn(t.app, members.owner.email);
    const theirs = await outsider.get(`/api/characters/${wicket.id}/file`);
    expect(theirs.status).toBe(404);
    expect(theirs.body.error.code).toBeTruthy();
    expect(theirs.headers.etag).not.toBe(`"${wicket.sha256}"`);
    const anonymous = await request(t.app).get(`/api/characters/${wicket.id}/file`);
    expect(anonymous.status).toBe(401);
    expect(anonymous.headers.etag).not.toBe(`"${wicket.sha256}"`);
  });
});
