/**
 * Leg setups through the API: the engine's defaults for a character's rig, saving versions validated by the
 * one LegSetupSchema with field messages, checks against the rig, roles and other teams. The rules are
 * Treadle's own (versions numbered per character, a setup must fit its rig, every role reads, owner and designer
 * save, another team's character is not there); no outside reference applies. The defaults are the engine's
 * (engine/gait/leg-setup.ts).
 */
import { defaultLegSetup, LegSetupSchema } from '../../engine/gait/leg-setup';
import { loadCharacterRig } from '../../server/services/characters';
import { testApp, type TestApp } from '../support/test-app';
import { signedIn } from '../support/studio';
import { trialStudio, type TrialStudio } from './trials-helpers';

// Worker threads start on the first job and the machine is shared: generous timeouts, no timing assertions.
jest.setTimeout(120_000);

let t: TestApp;
let studio: TrialStudio;
let other: TrialStudio;

beforeAll(async () => {
  t = await testApp();
  studio = await trialStudio(t.db, t.dataDir, 'loading-dock', t.clock.now());
  other = await trialStudio(t.db, t.dataDir, 'culvert', t.clock.now());
}, 120_000);
afterAll(async () => t.cleanup());

const path = (id: number) => `/api/characters/${id}/leg-setups`;
const count = async () => Number((await t.db('leg_setups').count({ n: '*' }).first())?.n);

describe('leg setups', () => {
  it('lists no versions at first, with the engine defaults for the rig and its leg names', async () => {
    const agent = await signedIn(t.app, studio.members.art_lead.email);
    const res = await agent.get(path(studio.characters.burrow));
    expect(res.status).toBe(200);
    expect(res.body.versions).toEqual([]);
    const { rig } = await loadCharacterRig(t.db, studio.teamId, studio.characters.burrow);
    expect(res.body.defaults).toEqual(defaultLegSetup(rig));
    expect(res.body.legNames).toEqual(['Left front', 'Right front', 'Left hind', 'Right hind']);
  });

  it('saves versions numbered 1, 2, … newest first', async () => {
    const agent = await signedIn(t.app, studio.members.designer.email);
    const defaults = (await agent.get(path(studio.characters.burrow))).body.defaults;
    const v1 = await agent.post(path(studio.characters.burrow)).send({ setup: defaults, note: 'engine defaults' });
    expect(v1.status).toBe(201);
    expect(v1.body.legSetup).toMatchObject({ version: 1, note: 'engine defaults', source: 'form' });
    const lowered = { ...defaults, body: { ...defaults.body, heightOffset: -0.15 } };
    const v2 = await agent.post(path(studio.characters.burrow)).send({ setup: lowered });
    expect(v2.body.legSetup.version).toBe(2);
    const list = await agent.get(path(studio.characters.burrow));
    expect(list.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(LegSetupSchema.parse(list.body.versions[0].setup).body.heightOffset).toBe(-0.15);
    const one = await agent.get(`/api/leg-setups/${v2.body.legSetup.id}`);
    expect(one.body.legSetup.version).toBe(2);
  });

  it('refuses a bad setup with a field message per problem and saves nothing', async () => {
    const agent = await signedIn(t.app, studio.members.owner.email);
    const defaults = (await agent.get(path(studio.characters.burrow))).body.defaults;
    const before = await count();
    const bad = await agent.post(path(studio.characters.burrow)).send({ setup: { ...defaults, gait: { ...defaults.gait, dutyFactor: 1.5 }, solver: { ...defaults.solver, maxIterations: 0 } } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['setup.gait.dutyFactor']).toBeDefined();
    expect(bad.body.error.fields['setup.solver.maxIterations']).toBeDefined();
    const wrongLeg = await agent.post(path(studio.characters.burrow)).send({ setup: { ...defaults, legs: [{ leg: 'Tail', limits: [] }] } });
    expect(wrongLeg.status).toBe(400);
    expect(wrongLeg.body.error.message).toMatch(/no leg named Tail/);
    const wrongPattern = await agent.post(path(studio.characters.wicket)).send({ setup: defaults });
    expect(wrongPattern.status).toBe(400);
    expect(wrongPattern.body.error.message).toMatch(/quadruped-walk is for 4 legs/);
    expect(await count()).toBe(before);
  });

  it('lets every role read and only owner and designer save; another team sees nothing', async () => {
    const programmer = await signedIn(t.app, studio.members.programmer.email);
    expect((await programmer.get(path(studio.characters.burrow))).status).toBe(200);
    const defaults = (await programmer.get(path(studio.characters.burrow))).body.defaults;
    expect((await programmer.post(path(studio.characters.burrow)).send({ setup: defaults })).status).toBe(403);
    const outsider = await signedIn(t.app, other.members.owner.email);
    expect((await outsider.get(path(studio.characters.burrow))).status).toBe(404);
    expect((await outsider.post(path(studio.characters.burrow)).send({ setup: defaults })).status).toBe(404);
    const [mine] = (await programmer.get(path(studio.characters.burrow))).body.versions;
    expect((await outsider.get(`/api/leg-setups/${mine.id}`)).status).toBe(404);
  });
});
