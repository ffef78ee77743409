import { testApp, type TestApp } from '../support/test-app';
import { courseDetailSchema, courseListSchema, suiteListSchema, suiteResponseSchema, type Suite } from '../../schemas/courses';
import { DEMO_COURSES, DEMO_SUITE, seedDemoCourses } from '../../seeds/demo-courses';
import { CODE_STAIRS } from '../../engine/course/generators';
import { heightAt } from '../../engine/course/sample';
import { loadCourse, loadSuiteCourses } from '../../server/services/courses';
import { countRows, studioWithCourses, type Agent, type Who } from './courses-helpers';

// The machine is shared: give set-up room, never assert on time.
jest.setTimeout(60_000);

let t: TestApp;
let as: Record<Who, Agent>;
let teamId: number;
let demoIds: Record<string, number>;

beforeAll(async () => {
  t = await testApp();
  ({ as, teamId } = await studioWithCourses(t));
  const { courses } = courseListSchema.parse((await as.owner.get('/api/courses')).body);
  demoIds = Object.fromEntries(courses.map((c) => [c.name, c.id]));
});
afterAll(() => t.cleanup());

const recipe = { width: 1, segments: [{ kind: 'flat', length: 1 }] };

async function newCourse(name: string): Promise<number> {
  const res = await as.designer.post('/api/courses').send({ name, generator: recipe });
  expect(res.status).toBe(201);
  return res.body.course.id;
}

async function newSuite(name: string, courseIds: number[]): Promise<Suite> {
  const res = await as.designer.post('/api/suites').send({ name, courseIds });
  expect(res.status).toBe(201);
  return suiteResponseSchema.parse(res.body).suite;
}

describe('the demo courses', () => {
  it('seeds the four scrapyard courses and the suite holding them, in order', async () => {
    expect(Object.keys(demoIds).sort()).toEqual(['Drainage trench', 'Loading dock steps', 'Ramp to the gantry', 'Scrap rubble']);
    const { suites } = suiteListSchema.parse((await as.artlead.get('/api/suites')).body);
    expect(suites).toHaveLength(1);
    expect(suites[0].name).toBe(DEMO_SUITE);
    expect(suites[0].courses.map((c) => c.name)).toEqual(DEMO_COURSES.map((c) => c.name));
  });

  it('builds the loading dock at the code stair limits', async () => {
    const dock = await loadCourse(t.db, teamId, demoIds['Loading dock steps']);
    // IBC 2021 §1011.5.2: 178 mm risers, 279 mm treads; five steps up make a 0.89 m dock.
    expect(heightAt(dock.heightfield, 0, 2 + 5 * CODE_STAIRS.tread + 1)).toBeCloseTo(5 * CODE_STAIRS.riser, 9);
    expect(heightAt(dock.heightfield, 0, 2 + CODE_STAIRS.tread / 2)).toBeCloseTo(CODE_STAIRS.riser, 9);
    const ramp = await loadCourse(t.db, teamId, demoIds['Ramp to the gantry']);
    // A 4 m ramp at 12° rises 4·tan 12° (right-triangle trigonometry), to the 1 mm quantum of the encoding.
    expect(Math.abs(heightAt(ramp.heightfield, 0, 7) - 4 * Math.tan((12 * Math.PI) / 180))).toBeLessThanOrEqual(0.0005);
    const trench = await loadCourse(t.db, teamId, demoIds['Drainage trench']);
    expect(heightAt(trench.heightfield, 0, 2.8)).toBeCloseTo(-0.3, 9);
  });

  it('is idempotent', async () => {
    const before = [await countRows(t, 'courses'), await countRows(t, 'suites'), await countRows(t, 'suite_courses')];
    await seedDemoCourses(t.db, teamId, 1, t.clock.now());
    expect([await countRows(t, 'courses'), await countRows(t, 'suites'), await countRows(t, 'suite_courses')]).toEqual(before);
  });

  it('gives trials the suite courses through loadSuiteCourses, in running order and scoped by team', async () => {
    const { suites } = suiteListSchema.parse((await as.owner.get('/api/suites')).body);
    const loaded = await loadSuiteCourses(t.db, teamId, suites[0].id);
    expect(loaded.map((c) => c.name)).toEqual(DEMO_COURSES.map((c) => c.name));
    for (const c of loaded) expect(c.heightfield.heights.length).toBe(c.heightfield.cols * c.heightfield.rows);
    await expect(loadSuiteCourses(t.db, teamId + 1, suites[0].id)).rejects.toMatchObject({ status: 404 });
  });
});

describe('suites', () => {
  it('are made, reordered, renamed and deleted by editors', async () => {
    const a = await newCourse('Suite piece A');
    const b = await newCourse('Suite piece B');
    const made = await newSuite('Pair', [a, b]);
    expect(made.courses.map((c) => c.id)).toEqual([a, b]);
    const res = await as.owner.put(`/api/suites/${made.id}`).send({ name: 'Pair reversed', courseIds: [b, a] });
    expect(res.status).toBe(200);
    expect(suiteResponseSchema.parse(res.body).suite).toMatchObject({ name: 'Pair reversed', courses: [{ id: b }, { id: a }] });
    expect((await loadSuiteCourses(t.db, teamId, made.id)).map((c) => c.id)).toEqual([b, a]);
    expect((await as.designer.delete(`/api/suites/${made.id}`)).status).toBe(204);
    expect((await as.designer.get(`/api/suites/${made.id}`)).status).toBe(404);
    // The courses stay.
    expect((await as.designer.get(`/api/courses/${a}`)).status).toBe(200);
  });

  it('refuses writes from the programmer and the art lead', async () => {
    const a = await newCourse('Read-only piece');
    for (const who of ['programmer', 'artlead'] as const) {
      expect((await as[who].post('/api/suites').send({ name: 'Mine', courseIds: [a] })).status).toBe(403);
      const { suites } = suiteListSchema.parse((await as[who].get('/api/suites')).body);
      expect((await as[who].put(`/api/suites/${suites[0].id}`).send({ name: 'Mine' })).status).toBe(403);
      expect((await as[who].delete(`/api/suites/${suites[0].id}`)).status).toBe(403);
    }
  });

  it('names the field of a bad suite and writes nothing', async () => {
    const a = await newCourse('Lonely piece');
    const before = await countRows(t, 'suites');
    const cases: [object, string, RegExp][] = [
      [{ name: 'Empty', courseIds: [] }, 'courseIds', /at least one course/],
      [{ name: 'Twice', courseIds: [a, a] }, 'courseIds.1', /already in the suite/],
      [{ name: 'Ghost', courseIds: [a, 999999] }, 'courseIds.1', /Course 999999 is not one of this team's courses/],
      [{ name: '', courseIds: [a] }, 'name', /Name it/],
    ];
    for (const [body, field, pattern] of cases) {
      const res = await as.designer.post('/api/suites').send(body);
      expect(res.status).toBe(400);
      expect(res.body.error.fields[field]).toMatch(pattern);
    }
    expect(await countRows(t, 'suites')).toBe(before);
  });

  it("keeps teams apart: another team's suite is 404 and its courses cannot be borrowed", async () => {
    const { suites } = suiteListSchema.parse((await as.owner.get('/api/suites')).body);
    const demo = suites.find((s) => s.name === DEMO_SUITE)!;
    expect((await as.outsider.get(`/api/suites/${demo.id}`)).status).toBe(404);
    expect((await as.outsider.put(`/api/suites/${demo.id}`).send({ name: 'Taken' })).status).toBe(404);
    expect((await as.outsider.delete(`/api/suites/${demo.id}`)).status).toBe(404);
    expect(suiteListSchema.parse((await as.outsider.get('/api/suites')).body).suites).toEqual([]);
    const borrow = await as.outsider.post('/api/suites').send({ name: 'Borrowed', courseIds: [demoIds['Scrap rubble']] });
    expect(borrow.status).toBe(400);
    expect(borrow.body.error.fields['courseIds.0']).toMatch(/not one of this team's courses/);
  });
});

describe('deleting a course a suite holds', () => {
  it('is refused with the suites named, until the course is taken out', async () => {
    const a = await newCourse('Shared piece');
    const b = await newCourse('Other piece');
    const first = await newSuite('First set', [a, b]);
    await newSuite('Second set', [a]);
    const refused = await as.designer.delete(`/api/courses/${a}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('course_in_suite');
    expect(refused.body.error.message).toBe('"Shared piece" is part of the suites "First set", "Second set". Take it out of them first, then delete it.');
    expect((await as.designer.get(`/api/courses/${a}`)).status).toBe(200);
    const detail = courseDetailSchema.parse((await as.designer.get(`/api/courses/${a}`)).body);
    expect(detail.course.suites.map((s) => s.name)).toEqual(['First set', 'Second set']);

    await as.designer.put(`/api/suites/${first.id}`).send({ courseIds: [b] });
    const second = suiteListSchema.parse((await as.designer.get('/api/suites')).body).suites.find((s) => s.name === 'Second set')!;
    expect((await as.designer.delete(`/api/suites/${second.id}`)).status).toBe(204);
    expect((await as.designer.delete(`/api/courses/${a}`)).status).toBe(204);
  });
});
