/**
 * GET /api/queue, the owner's view of where trials and dial-ins run, on the embedded pool of the test app
 * (2 threads): the figures match what is running, other roles are refused. The rule (owners only) is the
 * permission table's; the counts are checked against the jobs the test itself starts.
 */
import { queueStatusSchema } from '../../schemas/queue';
import { testApp, type TestApp } from '../support/test-app';
import { createStudio, signedIn } from '../support/studio';

let t: TestApp;
let studio: Awaited<ReturnType<typeof createStudio>>;

beforeAll(async () => {
  t = await testApp();
  studio = await createStudio(t.db, 'weir');
});
afterAll(async () => t.cleanup());

describe('GET /api/queue', () => {
  it('shows the owner the embedded threads and the team’s own queued jobs', async () => {
    const owner = await signedIn(t.app, studio.members.owner.email);
    const idle = await owner.get('/api/queue');
    expect(idle.status).toBe(200);
    expect(queueStatusSchema.parse(idle.body)).toEqual({
      runner: 'embedded',
      workers: [{ name: 'thread 1 of the server' }, { name: 'thread 2 of the server' }],
      waiting: 0,
      running: 0,
      jobsQueued: 0,
      jobsRunning: 0,
    });
    // A queued job of this team counts; one of another team does not.
    const other = await createStudio(t.db, 'sluice-gate');
    const now = t.clock.now();
    const row = (teamId: number, userId: number) => ({ team_id: teamId, kind: 'trial', status: 'queued', progress: 0, input: '{}', created_by: userId, created_at: now, updated_at: now });
    await t.db('jobs').insert([row(studio.teamId, studio.members.owner.id), row(studio.teamId, studio.members.owner.id), row(other.teamId, other.members.owner.id)]);
    const busy = await owner.get('/api/queue');
    expect(busy.body).toMatchObject({ jobsQueued: 2, jobsRunning: 0 });
    await t.db('jobs').where({ status: 'queued' }).update({ status: 'cancelled' });
  });

  it('is refused to every other role', async () => {
    for (const role of ['designer', 'programmer', 'art_lead'] as const) {
      const agent = await signedIn(t.app, studio.members[role].email);
      const res = await agent.get('/api/queue');
      expect(res.status).toBe(403);
    }
  });
});
