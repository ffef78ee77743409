import { testApp, type TestApp } from '../support/test-app';
import { courseListSchema, suiteListSchema } from '../../schemas/courses';
import { starterCoursesResponseSchema } from '../../schemas/starter-courses';
import { CODE_STAIRS } from '../../engine/course/generators';
import { heightAt } from '../../engine/course/sample';
import { loadCourse } from '../../server/services/courses';
import { STARTER_COURSES, STARTER_SUITE } from '../../server/services/starter-courses';
import { createStudio, signedIn } from '../support/studio';
import type { Agent } from './characters-helpers';

// The machine is shared: give set-up room, never assert on time.
jest.setTimeout(60_000);

let t: TestApp;
let owner: Agent;
let designer: Agent;
let programmer: Agent;
let outsider: Agent;
let teamId: number;

beforeAll(async () => {
  t = await testApp();
  // A brand-new studio: no courses, no suites (createStudio seeds nothing else).
  const home = await createStudio(t.db, 'fresh');
  const away = await createStudio(t.db, 'elsewhere');
  teamId = home.teamId;
  owner = await signedIn(t.app, home.members.owner.email);
  designer = await signedIn(t.app, home.members.designer.email);
  programmer = await signedIn(t.app, home.members.programmer.email);
  outsider = await signedIn(t.app, away.members.owner.email);
});
afterAll(() => t.cleanup());

describe('starter courses', () => {
  it('are refused to a role that cannot make courses, and nothing is written', async () => {
    const res = await programmer.post('/api/courses/starter').send({});
    expect(res.status).toBe(403);
    expect(courseListSchema.parse((await owner.get('/api/courses')).body).courses).toHaveLength(0);
  });

  it('adds four courses and a suite holding them, in one tap', async () => {
    expect(courseListSchema.parse((await designer.get('/api/courses')).body).courses).toHaveLength(0);
    const res = await designer.post('/api/courses/starter').send({});
    expect(res.status).toBe(201);
    const body = starterCoursesResponseSchema.parse(res.body);
    expect(body.added).toEqual(STARTER_COURSES.map((c) => c.name));
    expect(body.suiteAdded).toBe(true);
    const { courses } = courseListSchema.parse((await designer.get('/api/courses')).body);
    expect(courses.map((c) => c.name).sort()).toEqual(STARTER_COURSES.map((c) => c.name).sort());
    const { suites } = suiteListSchema.parse((await designer.get('/api/suites')).body);
    expect(suites).toHaveLength(1);
    expect(suites[0]).toMatchObject({ id: body.suiteId, name: STARTER_SUITE });
    expect(suites[0].courses.map((c) => c.name)).toEqual(STARTER_COURSES.map((c) => c.name));
  });

  it('builds the ground the names promise', async () => {
    const { courses } = courseListSchema.parse((await designer.get('/api/courses')).body);
    const id = (name: string) => courses.find((c) => c.name === name)!.id;
    const steps = await loadCourse(t.db, teamId, id('Starter: three steps'));
    // IBC 2021 §1011.5.2: 178 mm risers, 279 mm treads; three steps up stand 3 × 0.178 m high.
    expect(heightAt(steps.heightfield, 0, 1.5 + 3 * CODE_STAIRS.tread + 0.75)).toBeCloseTo(3 * CODE_STAIRS.riser, 9);
    expect(heightAt(steps.heightfield, 0, 1.5 + CODE_STAIRS.tread / 2)).toBeCloseTo(CODE_STAIRS.riser, 9);
    const slope = await loadCourse(t.db, teamId, id('Starter: gentle slope'));
    // A 3 m ramp at 6° rises 3·tan 6° (right-triangle trigonometry), to the 1 mm quantum of the encoding.
    expect(Math.abs(heightAt(slope.heightfield, 0, 5) - 3 * Math.tan((6 * Math.PI) / 180))).toBeLessThanOrEqual(0.0005);
    const level = await loadCourse(t.db, teamId, id('Starter: level ground'));
    expect(heightAt(level.heightfield, 0.3, 3)).toBe(0);
  });

  it('adds only what is missing the second time, leaving the team’s own edits alone', async () => {
    const { courses } = courseListSchema.parse((await designer.get('/api/courses')).body);
    const level = courses.find((c) => c.name === 'Starter: level ground')!;
    // The team renames one starter course and edits it to version 2.
    expect((await designer.put(`/api/courses/${level.id}`).send({ baseVersion: 1, name: 'Our level ground' })).status).toBe(200);
    const res = await owner.post('/api/courses/starter').send({});
    expect(res.status).toBe(201);
    expect(starterCoursesResponseSchema.parse(res.body)).toMatchObject({ added: ['Starter: level ground'], suiteAdded: false });
    const after = courseListSchema.parse((await owner.get('/api/courses')).body).courses;
    expect(after).toHaveLength(5);
    expect(after.find((c) => c.id === level.id)).toMatchObject({ name: 'Our level ground', version: 2 });
    // Nothing left to add: 200 and nothing written.
    const again = await owner.post('/api/courses/starter').send({});
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ added: [], suiteAdded: false });
    expect(courseListSchema.parse((await owner.get('/api/courses')).body).courses).toHaveLength(5);
  });

  it('stay inside the studio that added them', async () => {
    expect(courseListSchema.parse((await outsider.get('/api/courses')).body).courses).toHaveLength(0);
    expect(suiteListSchema.parse((await outsider.get('/api/suites')).body).suites).toHaveLength(0);
  });
});
