/**
 * A trial or dial-in that cannot run is refused at submission with a field message naming the setting and the
 * fix, and no job reaches "failed" for a reason the submission could have checked; a job that fails anyway
 * stores sentences, never raw zod output. Real Express, the real SQLite file and the real worker pool.
 * The limits are LegSetupSchema's own (engine/gait/leg-setup.ts); the centimetre case is a character built
 * 100 times too large, as a glTF exported in centimetres reads in glTF's metres (glTF 2.0 §3.5.1: units are metres).
 */
import { LegSetupSchema, defaultLegSetup } from '../../engine/gait/leg-setup';
import { generateCourse } from '../../engine/course/generators';
import { bipedRig } from '../../engine/gait/rig-presets';
import { insertCourse } from '../../server/services/courses';
import { loadCharacterRig } from '../../server/services/characters';
import { readableJobFailure } from '../../server/services/submission-checks';
import { storeCharacterUpload } from '../../server/services/gltf-import-store';
import { buildCharacterGlb, type RigDesign, type V3 } from '../../seeds/characters/rig-builder';
import { burrow } from '../../seeds/characters';
import { testApp, type TestApp } from '../support/test-app';
import { signedIn } from '../support/studio';
import { pollJob, trialStudio, type TrialStudio } from './trials-helpers';

jest.setTimeout(180_000);

let t: TestApp;
let studio: TrialStudio;
let centimetreBurrow: number;
let shortCourse: number;

/** The design at `factor` times its size: bones and boxes alike. */
function scaled(design: RigDesign, factor: number, name: string): RigDesign {
  const s = (v: V3): V3 => [v[0] * factor, v[1] * factor, v[2] * factor];
  return {
    name,
    bones: design.bones.map((b) => ({ ...b, at: s(b.at) })),
    parts: design.parts.map((p) => ({ ...p, from: s(p.from), to: s(p.to), width: p.width * factor, depth: p.depth === undefined ? undefined : p.depth * factor })),
  };
}

beforeAll(async () => {
  t = await testApp();
  studio = await trialStudio(t.db, t.dataDir, 'culvert', t.clock.now());
  const glb = await buildCharacterGlb(scaled(burrow, 100, 'Burrow in centimetres'));
  const stored = await storeCharacterUpload(
    { db: t.db, dataDir: t.dataDir, now: () => t.clock.now() },
    { teamId: studio.teamId, userId: studio.members.owner.id, name: 'Burrow in centimetres', files: [{ originalname: 'burrow-cm.glb', buffer: Buffer.from(glb) }] },
  );
  centimetreBurrow = stored.id;
  shortCourse = await insertCourse(t.db, { teamId: studio.teamId, userId: studio.members.owner.id, name: 'Doormat', heightfield: generateCourse({ segments: [{ kind: 'flat', length: 1 }] }), generator: null, now: t.clock.now() });
}, 180_000);
afterAll(async () => t.cleanup());

const designer = () => signedIn(t.app, studio.members.designer.email);
const jobCount = async () => Number((await t.db('jobs').count({ n: '*' }).first())?.n);

describe('refused at submission', () => {
  it('refuses the defaults of a character authored in centimetres, naming step height, its limit and the unit fix', async () => {
    const agent = await designer();
    const before = await jobCount();
    const res = await agent.post('/api/trials').send({ characterId: centimetreBurrow, courseId: studio.courses.curb });
    expect(res.status).toBe(400);
    const message = res.body.error.fields['setup.gait.stepHeight'];
    // The default step height is a tenth of hip height: about 5 m here, over the schema's 1 m.
    expect(message).toMatch(/^Step height \d+(\.\d+)? m is above the 1 m limit; is the character in centimetres/);
    expect(message).toMatch(/scale 0\.01/);
    expect(res.body.error.message).not.toMatch(/too_big|"code"|\[\{/);
    expect(await jobCount()).toBe(before);
  });

  it('refuses an unsaved setup over a limit with a sentence for the form field, not zod text', async () => {
    const agent = await designer();
    const character = await loadCharacterRig(t.db, studio.teamId, studio.characters.burrow);
    const setup = defaultLegSetup(character.rig);
    const res = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: studio.courses.curb, legSetup: { ...setup, gait: { ...setup.gait, stepHeight: 8.4 } } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['legSetup.gait.stepHeight']).toMatch(/^Step height 8\.4 m is above the 1 m limit; is the character in centimetres/);
  });

  it('refuses phase offsets that do not fit the legs, and a course too short to walk, naming each', async () => {
    const agent = await designer();
    const character = await loadCharacterRig(t.db, studio.teamId, studio.characters.burrow);
    const setup = defaultLegSetup(character.rig);
    const offsets = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: studio.courses.curb, legSetup: { ...setup, gait: { ...setup.gait, phaseOffsets: [0, 0.5] } } });
    expect(offsets.status).toBe(400);
    expect(offsets.body.error.fields['legSetup.gait.phaseOffsets']).toMatch(/^Phase offsets: rig .* has 4 legs, got 2 offsets; give one offset per leg, or none to use the pattern's\. Change it in the leg setup form\.$/);
    const short = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: shortCourse });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.courseId).toMatch(/“Doormat” is too short for this character.*Lengthen the course/);
  });

  it('refuses a dial-in that cannot run before holding any of the allowance', async () => {
    const agent = await designer();
    const before = await jobCount();
    const res = await agent.post('/api/dial-ins').send({ characterId: centimetreBurrow, suiteId: studio.suiteId, params: [{ key: 'solver.lambda', min: 0.01, max: 0.2 }], candidates: 5 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['setup.gait.stepHeight']).toMatch(/centimetres/);
    expect(await jobCount()).toBe(before);
    expect(await t.db('jobs').where({ team_id: studio.teamId, kind: 'dial-in' }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('no job fails for a reason the submission could have checked', () => {
  it('either refuses each of these requests or runs it to done', async () => {
    const agent = await designer();
    const character = await loadCharacterRig(t.db, studio.teamId, studio.characters.burrow);
    const setup = defaultLegSetup(character.rig);
    const asks: object[] = [
      { characterId: centimetreBurrow, courseId: studio.courses.curb },
      { characterId: studio.characters.burrow, courseId: shortCourse },
      { characterId: studio.characters.burrow, suiteId: studio.suiteId, legSetup: { ...setup, gait: { ...setup.gait, stepHeight: 2 } } },
      { characterId: studio.characters.burrow, courseId: studio.courses.rubble, legSetup: { ...setup, gait: { ...setup.gait, timing: { mode: 'speed', speed: 25 } } } },
      { characterId: studio.characters.burrow, courseId: studio.courses.trench, legSetup: { ...setup, gait: { ...setup.gait, pattern: 'hexapod-tripod', phaseOffsets: null } } },
      { characterId: studio.characters.burrow, courseId: studio.courses.trench, legSetup: { ...setup, legs: [{ leg: character.rig.legs[0].name, limits: [{ joint: 'no-such-joint', min: 0, max: 1 }] }] } },
      { characterId: studio.characters.burrow, courseId: studio.courses.curb },
    ];
    let refused = 0;
    let done = 0;
    for (const ask of asks) {
      const res = await agent.post('/api/trials').send(ask);
      if (res.status === 400) {
        refused++;
        const messages = Object.values(res.body.error.fields as Record<string, string>);
        expect(messages.length).toBeGreaterThan(0);
        for (const m of messages) expect(m).not.toMatch(/"code"|too_big|too_small|\[\{/);
        continue;
      }
      expect(res.status).toBe(202);
      const { job } = await pollJob(agent, res.body.job.id);
      expect(job.status).toBe('done');
      done++;
    }
    // The last request is the plain defaults of a character that fits: it must run.
    expect(done).toBeGreaterThanOrEqual(1);
    expect(refused).toBe(asks.length - done);
    expect(await t.db('jobs').where({ status: 'failed' }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('a job that fails anyway says why in words', () => {
  it('turns zod issues, thrown or serialised by a worker, into sentences naming the setting', () => {
    const setup = defaultLegSetup(bipedRig());
    const bad = LegSetupSchema.safeParse({ ...setup, gait: { ...setup.gait, stepHeight: 8.4 } });
    expect(bad.success).toBe(false);
    const error = !bad.success ? bad.error : null;
    const thrown = readableJobFailure(error, { ...setup, gait: { ...setup.gait, stepHeight: 8.4 } });
    expect(thrown).toMatch(/^Step height 8\.4 m is above the 1 m limit/);
    // As a worker's failure reaches the server: the issues' JSON inside a sentence.
    const serialised = readableJobFailure(
      new Error(`A worker failed one of its tasks 3 times: ${JSON.stringify(error!.issues.map((i) => ({ ...i, path: ['setup', ...i.path] })))}`),
      { setup: { ...setup, gait: { ...setup.gait, stepHeight: 8.4 } } },
    );
    expect(serialised).toMatch(/^A worker failed one of its tasks 3 times: Step height 8\.4 m is above the 1 m limit/);
    expect(serialised).not.toMatch(/too_big|\[\{/);
  });

  it('stores a readable reason when a job with an impossible input runs anyway', async () => {
    const character = await loadCharacterRig(t.db, studio.teamId, studio.characters.burrow);
    const setup = defaultLegSetup(character.rig);
    // Straight onto the runner, past the route's checks, as a job stored by an older server could be.
    const job = await t.jobs.enqueue({ teamId: studio.teamId, userId: studio.members.designer.id, kind: 'trial', input: { characterId: studio.characters.burrow, courseIds: [studio.courses.curb], setup: { ...setup, gait: { ...setup.gait, stepHeight: 3 } }, legSetupId: null } });
    const agent = await designer();
    const { job: finished } = await pollJob(agent, job.id);
    expect(finished.status).toBe('failed');
    expect(finished.error).toMatch(/^Step height 3 m is above the 1 m limit/);
    expect(finished.error).not.toMatch(/too_big|"code"|\[\{/);
    await t.db('jobs').where({ id: job.id }).delete();
  });
});
