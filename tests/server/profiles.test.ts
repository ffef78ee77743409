/**
 * Publishing leg profiles: roles, plan limit, immutability (route and database), version diffs, and the served
 * JSON Schema (JSON Schema draft 2020-12, validated with ajv's 2020-12 build, the reference JS validator).
 */
import request from 'supertest';
import Ajv2020 from 'ajv/dist/2020';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';
import { demoStudio } from './profiles-helpers';
import { LEG_PROFILE_SCHEMA_ID } from '../../engine/profile/schema';
import { legProfileJsonSchemaText } from '../../engine/profile/export';

// The demo seed imports three characters and runs their suites.
jest.setTimeout(120_000);

let t: TestApp;
let s: Awaited<ReturnType<typeof demoStudio>>;
beforeAll(async () => {
  t = await testApp();
  s = await demoStudio(t);
});
afterAll(() => t.cleanup());

const latest = (profileId: number) => `/api/v1/profiles/${profileId}/versions/latest`;

describe('the demo seed', () => {
  it('publishes a first version for each demo character, and a second for Wicket', async () => {
    const res = await s.agents.art_lead.get('/api/profiles');
    expect(res.status).toBe(200);
    const byName = Object.fromEntries(res.body.profiles.map((p: { character: { name: string }; versionCount: number }) => [p.character.name, p.versionCount]));
    expect(byName).toEqual({ Burrow: 1, Skitter: 1, Wicket: 2 });
  });
});

describe('GET /api/schema/leg-profile.json', () => {
  it('is public, equals the generated schema, and every served profile validates against it', async () => {
    const res = await request(t.app).get('/api/schema/leg-profile.json');
    expect(res.status).toBe(200);
    expect(res.text).toBe(legProfileJsonSchemaText());
    const ajv = new Ajv2020({ strict: true, allErrors: true });
    // RFC 3339 §5.6 date-time.
    ajv.addFormat('date-time', /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/);
    const validate = ajv.compile(JSON.parse(res.text));
    for (const name of ['Wicket', 'Burrow', 'Skitter'] as const) {
      const file = await s.agents.programmer.get(latest(s.profiles[name].id));
      expect(file.status).toBe(200);
      expect(validate(JSON.parse(file.text))).toBe(true);
      expect(JSON.parse(file.text).schema).toBe(LEG_PROFILE_SCHEMA_ID);
    }
  });
});

describe('POST /api/profiles', () => {
  const body = () => ({ characterId: s.profiles.Skitter.characterId, suiteId: s.suiteId, notes: 'Re-measured after the crawler rework.' });

  it('lets the designer publish the next version, with the author, notes and metrics in the file', async () => {
    const res = await s.agents.designer.post('/api/profiles').send(body());
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ profileId: s.profiles.Skitter.id, version: 2 });
    const file = JSON.parse((await s.agents.designer.get(`/api/v1/profiles/${s.profiles.Skitter.id}/versions/2`)).text);
    expect(file.version).toBe(2);
    expect(file.author.name).toBe('Dario Moth');
    expect(file.notes).toBe('Re-measured after the crawler rework.');
    expect(file.publishedAt).toBe(new Date(t.clock.now()).toISOString());
    expect(file.metrics.courses.map((c: { course: string }) => c.course)).toEqual(file.suite.courses.map((c: { name: string }) => c.name));
  });

  it('refuses the programmer and the art lead', async () => {
    for (const role of ['programmer', 'art_lead'] as const) {
      const res = await s.agents[role].post('/api/profiles').send(body());
      expect(res.status).toBe(403);
    }
  });

  it('answers bad input with field messages and writes nothing', async () => {
    const before = await t.db('profile_versions').count({ n: '*' }).first();
    const missing = await s.agents.designer.post('/api/profiles').send({ characterId: s.profiles.Skitter.characterId });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.suiteId).toBe('Pick a suite.');
    const badSetup = await s.agents.designer.post('/api/profiles').send({ ...body(), legSetup: { version: 1, solver: {} } });
    expect(badSetup.status).toBe(400);
    expect(Object.keys(badSetup.body.error.fields).some((k) => k.startsWith('legSetup.'))).toBe(true);
    const elsewhere = await s.agents.designer.post('/api/profiles').send({ ...body(), characterId: 999999 });
    expect(elsewhere.status).toBe(404);
    expect((await t.db('profile_versions').count({ n: '*' }).first())?.n).toBe(before?.n);
  });

  it('counts against the plan’s monthly profile publishes and refuses past the limit', async () => {
    const month = new Date(t.clock.now()).toISOString().slice(0, 7);
    await t.db('plan_usage').where({ team_id: s.teamId, kind: 'profilePublishes', month }).update({ used: 10 });
    const before = await t.db('profile_versions').count({ n: '*' }).first();
    const res = await s.agents.designer.post('/api/profiles').send(body());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('plan_limit');
    expect((await t.db('profile_versions').count({ n: '*' }).first())?.n).toBe(before?.n);
    await t.db('plan_usage').where({ team_id: s.teamId, kind: 'profilePublishes', month }).update({ used: 4 });
  });
});

describe('immutability', () => {
  it('no route changes or deletes a published version', async () => {
    const path = `/api/profiles/${s.profiles.Wicket.id}/versions/1`;
    const before = (await s.agents.owner.get(`/api/v1/profiles/${s.profiles.Wicket.id}/versions/1`)).text;
    for (const method of ['put', 'patch', 'delete'] as const) {
      const res = await s.agents.owner[method](path).send({ notes: 'changed' });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('immutable');
    }
    expect((await s.agents.owner.get(`/api/v1/profiles/${s.profiles.Wicket.id}/versions/1`)).text).toBe(before);
  });

  it('the database refuses a raw UPDATE and a raw DELETE', async () => {
    const row = await t.db('profile_versions').where({ profile_id: s.profiles.Wicket.id, version: 1 }).first('id');
    expect(row).toBeDefined();
    const where = { id: row.id };
    // The refusal is read off the rejection itself: better-sqlite3's error does not always pass jest's Error check.
    const refusal = (query: PromiseLike<unknown>) => Promise.resolve(query).then(() => 'it went through', (err: unknown) => String((err as { message?: unknown })?.message ?? err));
    expect(await refusal(t.db('profile_versions').where(where).update({ notes: 'rewritten' }))).toMatch(/immutable/);
    expect(await refusal(t.db('profile_versions').where(where).delete())).toMatch(/immutable/);
    expect((await t.db('profile_versions').where(where).first('notes')).notes).not.toBe('rewritten');
  });
});

describe('GET /api/profiles/:id/diff', () => {
  it('shows the changed setting and the metric deltas of the two stored files', async () => {
    const id = s.profiles.Wicket.id;
    const res = await s.agents.art_lead.get(`/api/profiles/${id}/diff?from=1&to=2`);
    expect(res.status).toBe(200);
    const v1 = JSON.parse((await s.agents.art_lead.get(`/api/v1/profiles/${id}/versions/1`)).text);
    const v2 = JSON.parse((await s.agents.art_lead.get(`/api/v1/profiles/${id}/versions/2`)).text);
    expect(res.body.diff.settings).toEqual([{ path: 'solver.lambda', before: v1.legSetup.solver.lambda, after: v2.legSetup.solver.lambda }]);
    const score = res.body.diff.metrics.find((m: { key: string }) => m.key === 'footingScore');
    expect(score.before).toBe(v1.metrics.footingScore);
    expect(score.after).toBe(v2.metrics.footingScore);
  });

  it('404s for a version that does not exist', async () => {
    const res = await s.agents.art_lead.get(`/api/profiles/${s.profiles.Wicket.id}/diff?from=1&to=9`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('This leg profile has no version 9.');
  });
});

describe('another team', () => {
  it('sees none of these profiles', async () => {
    const away = await createStudio(t.db, 'away');
    const agent = await signedIn(t.app, away.members.owner.email);
    expect((await agent.get(`/api/profiles/${s.profiles.Wicket.id}`)).status).toBe(404);
    expect((await agent.get(latest(s.profiles.Wicket.id))).status).toBe(404);
    expect((await agent.get('/api/profiles')).body.profiles).toEqual([]);
  });
});
