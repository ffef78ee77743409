/**
 * The regression check a game's CI calls: the published suite re-run on the stored character or on a newer file.
 * Trials are deterministic (engine/gait), so the same file must reproduce the published figures exactly; a
 * file whose knees are built straight (a worse leg: no bend to absorb steps, common practice, no source) must fail.
 */
import request from 'supertest';
import { buildCharacterGlb, type BoneSpec } from '../../seeds/characters/rig-builder';
import { wicket } from '../../seeds/characters';
import { testApp, type TestApp } from '../support/test-app';
import { demoStudio } from './profiles-helpers';

jest.setTimeout(120_000);

let t: TestApp;
let s: Awaited<ReturnType<typeof demoStudio>>;
let secret: string;
beforeAll(async () => {
  t = await testApp();
  s = await demoStudio(t);
  secret = (await s.agents.programmer.post('/api/tokens').send({ name: 'CI build' })).body.secret;
});
afterAll(() => t.cleanup());

const check = () => request(t.app).post(`/api/v1/profiles/${s.profiles.Wicket.id}/check`).set('Authorization', `Bearer ${secret}`);
const wicketWith = async (bones: (b: BoneSpec) => BoneSpec, parts = wicket.parts) =>
  Buffer.from(await buildCharacterGlb({ ...wicket, bones: wicket.bones.map(bones), parts }));

describe('POST /api/v1/profiles/:id/check', () => {
  it('passes the stored character with zero deltas', async () => {
    const res = await check().send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ pass: true, version: 2, checked: 'stored', regressions: [] });
    for (const d of res.body.deltas) expect([0, null]).toContain(d.delta);
  });

  it('passes the same file uploaded again, without storing it', async () => {
    const characters = await t.db('characters').count({ n: '*' }).first();
    const res = await check().attach('file', await wicketWith((b) => b), 'wicket.glb');
    expect(res.status).toBe(200);
    expect(res.body.pass).toBe(true);
    expect(res.body.checked).toBe('uploaded');
    const stored = await t.db('characters').where({ id: s.profiles.Wicket.characterId }).first('sha256');
    expect(res.body.characterSha256).toBe(stored.sha256);
    expect(await t.db('characters').count({ n: '*' }).first()).toEqual(characters);
  });

  it('fails a deliberately worse file and names each regression', async () => {
    const straightKnees = await wicketWith((b) => (b.name.startsWith('shin_') ? { ...b, at: [b.at[0], b.at[1], 0] } : b));
    const res = await check().attach('file', straightKnees, 'wicket-straight-knees.glb').field('version', '2');
    expect(res.status).toBe(200);
    expect(res.body.pass).toBe(false);
    expect(res.body.regressions.length).toBeGreaterThan(0);
    expect(res.body.regressions[0]).toMatch(/stumbles rose from|footing score fell/);
    const worse = res.body.deltas.filter((d: { improved: boolean | null }) => d.improved === false);
    expect(worse.length).toBeGreaterThan(0);
  });

  it('names the joints a newer file lacks', async () => {
    const calf = (name: string) => (name === 'shin_L' ? 'calf_L' : name);
    const renamed = await wicketWith(
      (b) => ({ ...b, name: calf(b.name), parent: b.parent && calf(b.parent) }),
      wicket.parts.map((p) => ({ ...p, bone: calf(p.bone) })),
    );
    const res = await check().attach('file', renamed, 'wicket-renamed.glb');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('missing_joints');
    expect(res.body.error.message).toMatch(/"shin_L"/);
  });

  it('refuses a broken file with the import’s reason', async () => {
    const res = await check().attach('file', Buffer.from('glTF but not really'), 'broken.glb');
    // The import's own refusal (422 for a file it cannot read as glTF).
    expect(res.status).toBe(422);
    expect(res.body.error.message.length).toBeGreaterThan(10);
  });

  it('works with a signed-in session too', async () => {
    const res = await s.agents.art_lead.post(`/api/v1/profiles/${s.profiles.Skitter.id}/check`).send({});
    expect(res.status).toBe(200);
    expect(res.body.pass).toBe(true);
  });
});
