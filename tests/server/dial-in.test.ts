/**
 * Dial-in on the demo quadruped (Burrow) over a held suite of our own courses, through the API and the real
 * worker pool: the tuned setup scores above the engine's defaults (scored here independently, by running the
 * engine's trial on each course), the same request and seed give the same answer, accepting saves a new
 * leg setup version, and the plan's monthly candidate allowance is checked and recorded.
 * The search is a Latin hypercube then Nelder–Mead (McKay, Beckman & Conover 1979; Nelder & Mead, Computer
 * Journal 7(4), 1965) minimising the mean footing penalty P, where the score is 100·exp(−P)
 * (engine/metrics/footing-score.ts); the penalties reported are checked against that formula here.
 */
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { runTrial } from '../../engine/gait/trial';
import { roundProfileNumbers } from '../../engine/profile/export';
import { loadCourse } from '../../server/services/courses';
import { loadCharacterRig } from '../../server/services/characters';
import { dialInResultSchema, type DialInRequest, type DialInResult } from '../../schemas/dial-ins';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { testApp, type TestApp } from '../support/test-app';
import { signedIn } from '../support/studio';
import { pollJob, trialStudio, type TrialStudio } from './trials-helpers';

let t: TestApp;
let studio: TrialStudio;

beforeAll(async () => {
  t = await testApp();
  studio = await trialStudio(t.db, t.dataDir, 'scrapyard', t.clock.now());
}, 120_000);
afterAll(async () => t.cleanup());

const request = (): DialInRequest => ({
  characterId: studio.characters.burrow,
  suiteId: studio.suiteId,
  params: [
    { key: 'body.heightOffset', min: -0.25, max: 0.05 },
    { key: 'gait.stepHeight', min: 0.03, max: 0.2 },
  ],
  candidates: 20,
  seed: 7,
});

async function runDialIn(): Promise<{ id: number; result: DialInResult }> {
  const agent = await signedIn(t.app, studio.members.designer.email);
  const res = await agent.post('/api/dial-ins').send(request());
  expect(res.status).toBe(202);
  expect(res.body.job.kind).toBe('dial-in');
  const { job, seen } = await pollJob(agent, res.body.job.id, 300_000);
  expect(job.status).toBe('done');
  for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
  return { id: job.id, result: dialInResultSchema.parse(job.result) };
}

let first: { id: number; result: DialInResult };

describe('dial-in on Burrow over a held suite', () => {
  it('raises the mean footing score above the engine defaults', async () => {
    first = await runDialIn();
    const { result } = first;
    // The defaults scored independently: the engine's own trial on each course of the suite.
    const character = await loadCharacterRig(t.db, studio.teamId, studio.characters.burrow);
    const defaults = defaultLegSetup(character.rig);
    const scores = [];
    for (const id of Object.values(studio.courses)) {
      const course = await loadCourse(t.db, studio.teamId, id);
      scores.push(runTrial(character.rig, defaults, course.heightfield, { duration: TRIAL_SECONDS }).metrics.footingScore);
    }
    const defaultMean = scores.reduce((a, b) => a + b, 0) / scores.length;
    expect(result.before!.footingScore).toBeCloseTo(defaultMean, 9);
    expect(result.after!.footingScore).toBeGreaterThan(defaultMean);
    // Start and best are reported per course, each score the rounded 100·exp(−P) of its penalty.
    for (const side of [result.before!, result.after!]) {
      expect(side.perCourse.map((c) => c.courseId)).toEqual(Object.values(studio.courses));
      for (const c of side.perCourse) expect(c.footingScore).toBeCloseTo(Math.round(1000 * Math.exp(-c.penalty!)) / 10, 9);
      expect(side.penalty).toBeCloseTo(side.perCourse.reduce((s, c) => s + c.penalty!, 0) / side.perCourse.length, 12);
    }
    expect(result.after!.penalty!).toBeLessThan(result.before!.penalty!);
    expect(result.beatsStart).toBe(true);
    expect(result.before!.perCourse.map((c) => c.footingScore)).toEqual(scores);
    expect(result.candidatesTried).toBe(20);
    expect(result.history.length).toBe(20);
    expect(result.bestSoFar).toBe(result.after!.footingScore);
    // The best setup differs from the defaults only in the tuned settings, within their bounds.
    const best = result.bestSetup!;
    expect(best.body.heightOffset).toBeGreaterThanOrEqual(-0.25);
    expect(best.body.heightOffset).toBeLessThanOrEqual(0.05);
    expect({ ...best, body: { ...best.body, heightOffset: 0 }, gait: { ...best.gait, stepHeight: defaults.gait.stepHeight } }).toEqual(defaults);
  }, 300_000);

  it('gives the same answer for the same request and seed', async () => {
    const again = await runDialIn();
    expect(again.result.bestValues).toEqual(first.result.bestValues);
    expect(again.result.after).toEqual(first.result.after);
    expect(again.result.before).toEqual(first.result.before);
  }, 300_000);

  it('records the candidates against the plan and refuses a dial-in beyond the monthly allowance', async () => {
    const used = await t.db('plan_usage').where({ team_id: studio.teamId, kind: 'dialInCandidates' }).first('used');
    expect(used.used).toBe(40);
    const agent = await signedIn(t.app, studio.members.owner.email);
    const res = await agent.post('/api/dial-ins').send({ ...request(), candidates: 2000 });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('plan_limit');
  });

  it('saves the result as a new leg setup version when accepted, once', async () => {
    const programmer = await signedIn(t.app, studio.members.programmer.email);
    expect((await programmer.post(`/api/dial-ins/${first.id}/accept`).send({})).status).toBe(403);
    const agent = await signedIn(t.app, studio.members.designer.email);
    const res = await agent.post(`/api/dial-ins/${first.id}/accept`).send({});
    expect(res.status).toBe(201);
    // Saved at the precision a published profile keeps (engine/profile/export.ts, PROFILE_DECIMALS).
    expect(res.body.legSetup).toMatchObject({ characterId: studio.characters.burrow, source: 'dial-in', setup: roundProfileNumbers(first.result.bestSetup) });
    expect(res.body.legSetup.note).toMatch(/footing score/);
    expect((await agent.post(`/api/dial-ins/${first.id}/accept`).send({})).status).toBe(409);
    const list = await agent.get(`/api/characters/${studio.characters.burrow}/leg-setups`);
    expect(list.body.versions[0].id).toBe(res.body.legSetup.id);
  });

  it('names the problem in a bad request', async () => {
    const agent = await signedIn(t.app, studio.members.designer.email);
    const res = await agent.post('/api/dial-ins').send({ ...request(), params: [{ key: 'gait.stepHeight', min: 0.3, max: 0.1 }], candidates: 2 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['params.0.max']).toMatch(/upper bound/);
    expect(res.body.error.fields.candidates).toMatch(/at least 5/);
  });
});
