/**
 * Trial jobs through the API on the real piscina pool: the lifecycle, progress that never goes down, roles,
 * other teams, bad input. The states (queued, running, then done, failed or cancelled) and rules are
 * Treadle's own; no outside reference applies. The runner's own rules (cancel, restart recovery, per-team limit) are in jobs-runner.test.ts.
 */
import { decodeSeries } from '../../engine/gait/series-encoding';
import { TrialMetricsSchema } from '../../engine/metrics/trial-metrics';
import { jobSchema } from '../../schemas/jobs';
import { testApp, type TestApp } from '../support/test-app';
import { signedIn } from '../support/studio';
import { pollJob, trialStudio, type TrialStudio } from './trials-helpers';

// Worker threads start on the first job and the machine is shared: generous timeouts, no timing assertions.
jest.setTimeout(120_000);

let t: TestApp;
let studio: TrialStudio;
let other: TrialStudio;

beforeAll(async () => {
  t = await testApp();
  studio = await trialStudio(t.db, t.dataDir, 'gantry', t.clock.now());
  other = await trialStudio(t.db, t.dataDir, 'sluice', t.clock.now());
}, 120_000);
afterAll(async () => t.cleanup());

const designer = () => signedIn(t.app, studio.members.designer.email);

describe('a trial job through the API', () => {
  it('runs queued → running → done with progress that never goes down, and stores metrics and series', async () => {
    const agent = await designer();
    const res = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, suiteId: studio.suiteId });
    expect(res.status).toBe(202);
    const accepted = jobSchema.parse(res.body.job);
    expect(accepted.kind).toBe('trial');
    expect(['queued', 'running']).toContain(accepted.status);
    const { job, seen } = await pollJob(agent, accepted.id);
    expect(job.status).toBe('done');
    expect(job.progress).toBe(100);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    const result = job.result as { trialIds: number[]; footingScore: number };
    expect(result.trialIds).toHaveLength(3);
    const detail = await agent.get(`/api/trials/${result.trialIds[0]}`);
    expect(detail.status).toBe(200);
    const metrics = TrialMetricsSchema.parse(detail.body.trial.metrics);
    expect(metrics.steps).toBeGreaterThan(0);
    const series = decodeSeries(detail.body.series);
    expect(series.legs).toBe(4);
    expect(series.length).toBeGreaterThan(10);
    expect(detail.body.course).not.toBeNull();
    const list = await agent.get(`/api/trials?characterId=${studio.characters.burrow}`);
    expect(list.body.trials.map((x: { id: number }) => x.id)).toEqual(expect.arrayContaining(result.trialIds));
  });

  it('runs an unsaved setup and refuses bad requests with field messages, writing nothing', async () => {
    const agent = await designer();
    const before = Number((await t.db('jobs').count({ n: '*' }).first())?.n);
    const neither = await agent.post('/api/trials').send({ characterId: studio.characters.burrow });
    expect(neither.status).toBe(400);
    expect(neither.body.error.fields.courseId).toMatch(/course or a suite/);
    const bad = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: studio.courses.curb, legSetup: { version: 1 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).some((k) => k.startsWith('legSetup.'))).toBe(true);
    const foreign = await agent.post('/api/trials').send({ characterId: other.characters.burrow, courseId: studio.courses.curb });
    expect(foreign.status).toBe(404);
    const foreignCourse = await agent.post('/api/trials').send({ characterId: studio.characters.burrow, courseId: other.courses.curb });
    expect(foreignCourse.status).toBe(404);
    expect(Number((await t.db('jobs').count({ n: '*' }).first())?.n)).toBe(before);
  });

  it('lets every role read a job, only owner and designer start or cancel one, and hides it from other teams', async () => {
    const agent = await designer();
    const res = await agent.post('/api/trials').send({ characterId: studio.characters.wicket, courseId: studio.courses.curb });
    const id = res.body.job.id;
    const programmer = await signedIn(t.app, studio.members.programmer.email);
    expect((await programmer.get(`/api/jobs/${id}`)).status).toBe(200);
    expect((await programmer.post('/api/trials').send({ characterId: studio.characters.wicket, courseId: studio.courses.curb })).status).toBe(403);
    expect((await programmer.post(`/api/jobs/${id}/cancel`)).status).toBe(403);
    const outsider = await signedIn(t.app, other.members.owner.email);
    expect((await outsider.get(`/api/jobs/${id}`)).status).toBe(404);
    expect((await outsider.post(`/api/jobs/${id}/cancel`)).status).toBe(404);
    const { job } = await pollJob(agent, id);
    expect(job.status).toBe('done');
    const late = await agent.post(`/api/jobs/${id}/cancel`);
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/already finished/);
  });
});
