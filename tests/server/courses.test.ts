import { testApp, type TestApp } from '../support/test-app';
import { courseDetailSchema, courseListSchema, STORED_COURSE_LIMITS, type CourseDetail } from '../../schemas/courses';
import { decodeCourse, encodeCourse } from '../../engine/course/encoding';
import { generateCourse, type CourseSpecInput } from '../../engine/course/generators';
import { applyBrush } from '../../engine/course/brushes';
import { heightAt } from '../../engine/course/sample';
import { createHeightfieldGrid } from '../../engine/course/heightfield';
import { loadCourse } from '../../server/services/courses';
import { countRows, studioWithCourses, type Agent, type Who } from './courses-helpers';

// The machine is shared: give set-up room, never assert on time.
jest.setTimeout(60_000);

let t: TestApp;
let as: Record<Who, Agent>;
let teamId: number;

beforeAll(async () => {
  t = await testApp();
  ({ as, teamId } = await studioWithCourses(t));
});
afterAll(() => t.cleanup());

const curbRecipe: CourseSpecInput = {
  width: 1,
  cellSize: 0.05,
  segments: [
    { kind: 'flat', length: 1 },
    { kind: 'curb', length: 1, height: 0.15 },
  ],
};

async function create(agent: Agent, body: object): Promise<CourseDetail> {
  const res = await agent.post('/api/courses').send(body);
  expect(res.status).toBe(201);
  return courseDetailSchema.parse(res.body);
}

describe('creating and reading courses', () => {
  it('makes a course from a generator recipe and stores the heights the engine generates', async () => {
    const made = await create(as.designer, { name: 'Curb by the gate', generator: curbRecipe });
    expect(made.course).toMatchObject({ name: 'Curb by the gate', version: 1, cols: 21, rows: 41, generatorKinds: ['flat', 'curb'] });
    expect(made.course.createdBy.name).toBe('designer of yard');
    expect(made.generator?.segments).toHaveLength(2);
    // The stored encoding is the engine's own encoding of the generated field (1 mm quantum).
    expect(made.encoding).toEqual(encodeCourse(generateCourse(curbRecipe)));
    const hf = decodeCourse(made.encoding);
    expect(heightAt(hf, 0, 0.5)).toBe(0);
    expect(heightAt(hf, 0, 1.8)).toBeCloseTo(0.15, 9);
    expect(made.course.maxHeight).toBeCloseTo(0.15, 9);
  });

  it('makes a course from an encoding', async () => {
    const hf = createHeightfieldGrid(11, 21, 0.1, 0.02);
    applyBrush(hf, { kind: 'raise', radius: 0.3, strength: 1 }, 0, 1);
    const made = await create(as.owner, { name: 'Hand-made hump', encoding: encodeCourse(hf) });
    expect(made.generator).toBeNull();
    expect(made.course.generatorKinds).toEqual([]);
    expect(decodeCourse(made.encoding).heights).toEqual(decodeCourse(encodeCourse(hf)).heights);
  });

  it('lets every role read the list and a course', async () => {
    for (const who of ['owner', 'designer', 'programmer', 'artlead'] as const) {
      const list = courseListSchema.parse((await as[who].get('/api/courses')).body);
      expect(list.courses.map((c) => c.name)).toEqual(expect.arrayContaining(['Loading dock steps', 'Curb by the gate']));
      const one = await as[who].get(`/api/courses/${list.courses[0].id}`);
      expect(one.status).toBe(200);
      courseDetailSchema.parse(one.body);
    }
  });

  it('refuses writes from the programmer and the art lead, and writes nothing', async () => {
    const before = await countRows(t, 'courses');
    const [first] = courseListSchema.parse((await as.owner.get('/api/courses')).body).courses;
    for (const who of ['programmer', 'artlead'] as const) {
      const post = await as[who].post('/api/courses').send({ name: 'Not mine to make', generator: curbRecipe });
      expect(post.status).toBe(403);
      expect(post.body.error.code).toBe('forbidden');
      expect((await as[who].put(`/api/courses/${first.id}`).send({ baseVersion: first.version, name: 'Renamed' })).status).toBe(403);
      expect((await as[who].delete(`/api/courses/${first.id}`)).status).toBe(403);
    }
    expect(await countRows(t, 'courses')).toBe(before);
    expect(courseDetailSchema.parse((await as.owner.get(`/api/courses/${first.id}`)).body).course.name).toBe(first.name);
  });

  it("answers 404 for another team's course, for reading, saving and deleting", async () => {
    const mine = await create(as.designer, { name: 'Private ground', generator: curbRecipe });
    const id = mine.course.id;
    expect((await as.outsider.get(`/api/courses/${id}`)).status).toBe(404);
    expect((await as.outsider.put(`/api/courses/${id}`).send({ baseVersion: 1, name: 'Taken' })).status).toBe(404);
    expect((await as.outsider.delete(`/api/courses/${id}`)).status).toBe(404);
    expect(courseListSchema.parse((await as.outsider.get('/api/courses')).body).courses).toEqual([]);
    expect((await as.designer.get(`/api/courses/${id}`)).body.course.name).toBe('Private ground');
    expect((await as.designer.get('/api/courses/not-a-number')).status).toBe(404);
  });

  it('gives trials the decoded heightfield through loadCourse, scoped by team', async () => {
    const made = await create(as.designer, { name: 'For the trial worker', generator: curbRecipe });
    const loaded = await loadCourse(t.db, teamId, made.course.id);
    expect(loaded).toMatchObject({ id: made.course.id, name: 'For the trial worker', version: 1 });
    expect(loaded.heightfield.heights).toEqual(decodeCourse(made.encoding).heights);
    await expect(loadCourse(t.db, teamId + 1, made.course.id)).rejects.toMatchObject({ status: 404 });
  });
});

describe('saving with a version check', () => {
  it('saves an edit based on the current version and counts the version up', async () => {
    const made = await create(as.designer, { name: 'Sculpt me', generator: curbRecipe });
    const hf = decodeCourse(made.encoding);
    applyBrush(hf, { kind: 'raise', radius: 0.2, strength: 1 }, 0, 0.5);
    const res = await as.designer.put(`/api/courses/${made.course.id}`).send({ baseVersion: 1, encoding: encodeCourse(hf) });
    expect(res.status).toBe(200);
    const saved = courseDetailSchema.parse(res.body);
    expect(saved.course.version).toBe(2);
    // brushes.ts: raise moves the centre by BRUSH_STEP_AT_FULL_STRENGTH·strength = 0.05 m (one dab, smooth falloff is 1 at the centre).
    expect(heightAt(decodeCourse(saved.encoding), 0, 0.5)).toBeCloseTo(0.05, 9);
    const renamed = await as.owner.put(`/api/courses/${made.course.id}`).send({ baseVersion: 2, name: 'Sculpted' });
    expect(renamed.body.course).toMatchObject({ name: 'Sculpted', version: 3 });
    expect(renamed.body.course.updatedBy.name).toBe('owner of yard');
  });

  it('answers 409 to a save based on a stale version and keeps the newer save', async () => {
    // RFC 9110 §15.5.10: 409 Conflict, the request conflicts with the current state of the target resource.
    const made = await create(as.designer, { name: 'Two hands', generator: curbRecipe });
    const id = made.course.id;
    const mine = decodeCourse(made.encoding);
    const theirs = decodeCourse(made.encoding);
    applyBrush(theirs, { kind: 'lower', radius: 0.2, strength: 1 }, 0, 0.5);
    applyBrush(mine, { kind: 'raise', radius: 0.2, strength: 1 }, 0, 0.5);
    expect((await as.owner.put(`/api/courses/${id}`).send({ baseVersion: 1, encoding: encodeCourse(theirs) })).status).toBe(200);
    const stale = await as.designer.put(`/api/courses/${id}`).send({ baseVersion: 1, encoding: encodeCourse(mine) });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('version_conflict');
    expect(stale.body.error.message).toMatch(/owner of yard.*version 1.*version 2.*Reload it, or save your edit as a copy/);
    expect(stale.body.error.fields).toEqual({ baseVersion: 'The course is now at version 2.' });
    const now = courseDetailSchema.parse((await as.designer.get(`/api/courses/${id}`)).body);
    expect(now.course.version).toBe(2);
    expect(heightAt(decodeCourse(now.encoding), 0, 0.5)).toBeCloseTo(-0.05, 9);
    // The refused edit is not lost: saved as a copy it becomes a course of its own.
    const copy = await create(as.designer, { name: 'Two hands (copy)', encoding: encodeCourse(mine) });
    expect(heightAt(decodeCourse(copy.encoding), 0, 0.5)).toBeCloseTo(0.05, 9);
  });

  it('also refuses a version from the future', async () => {
    const made = await create(as.designer, { name: 'Ahead of time', generator: curbRecipe });
    const res = await as.designer.put(`/api/courses/${made.course.id}`).send({ baseVersion: 7, name: 'Nope' });
    expect(res.status).toBe(409);
  });
});

describe('refusing bad courses with field messages', () => {
  const good = encodeCourse(createHeightfieldGrid(4, 4, 0.1));

  async function refused(body: object, field: string, pattern: RegExp, status = 400) {
    const before = await countRows(t, 'courses');
    const res = await as.designer.post('/api/courses').send(body);
    expect(res.status).toBe(status);
    expect(res.body.error.fields?.[field]).toMatch(pattern);
    expect(await countRows(t, 'courses')).toBe(before);
    return res;
  }

  it('names heights that are not base64', () =>
    refused({ name: 'Broken', encoding: { ...good, heights: 'not base64!' } }, 'encoding.heights', /base64/));

  it('names heights of the wrong length', () =>
    refused({ name: 'Short', encoding: { ...good, heights: good.heights.slice(0, 8) } }, 'encoding.heights', /must hold rows × cols × 2 = 32 bytes, got 6 bytes/));

  it('names a sample above the height bound', () => {
    const bytes = Buffer.alloc(32, 0xff);
    return refused({ name: 'Too tall', encoding: { ...good, baseMm: 32000, heights: bytes.toString('base64') } }, 'encoding.heights', /sample 0 \(row 0, col 0\).*above the bound 32 m/);
  });

  it('names a wrong format and version', async () => {
    const res = await refused({ name: 'Alien', encoding: { ...good, format: 'other', version: 3 } }, 'encoding.format', /format must be "treadle-course"/);
    expect(res.body.error.fields['encoding.version']).toMatch(/unsupported version 3/);
  });

  it('refuses grids wider than the engine allows', () =>
    refused({ name: 'Wide', encoding: { ...good, cols: 600 } }, 'encoding.cols', /512/));

  it('refuses grids with more samples than a saved course may have', () => {
    const cols = 500;
    const rows = Math.ceil(STORED_COURSE_LIMITS.maxCells / cols) + 1;
    const heights = Buffer.alloc(cols * rows * 2).toString('base64');
    // 500 × 501 × 2 bytes is about 670 kB as base64: it fits the 2 MB body limit, so the refusal is ours.
    return refused({ name: 'Huge', encoding: { ...good, cols, rows, heights } }, 'encoding.rows', /at most 250,000 samples; 500 × 501 = 250,500/);
  });

  it('refuses a recipe that would make too many samples, before building it', () =>
    refused(
      { name: 'Endless', generator: { width: 10, cellSize: 0.01, segments: [{ kind: 'flat', length: 100 }] } },
      'generator.cellSize',
      /1001 × 10001 = 10,011,001 samples; a saved course has at most 250,000/,
    ));

  it('names the bad segment parameter of a recipe', () =>
    refused({ name: 'Odd stairs', generator: { segments: [{ kind: 'stairs', steps: 3, riser: 2, tread: 0.3 }] } }, 'generator.segments.0.riser', /0.5/));

  it('names a trench wider than its segment', () =>
    refused(
      { name: 'Wide trench', generator: { segments: [{ kind: 'trench', length: 1, width: 2, depth: 0.2 }] } },
      'generator.segments.0.width',
      /trench width 2 m is longer than its segment \(1 m\)/,
    ));

  it('needs a name, and exactly one of a recipe or an encoding', async () => {
    await refused({ name: '  ', generator: curbRecipe }, 'name', /Name it/);
    await refused({ name: 'Both', generator: curbRecipe, encoding: good }, 'generator', /either a generator recipe or an encoding/);
    await refused({ name: 'Neither' }, 'generator', /either a generator recipe or an encoding/);
  });

  it('refuses a broken save and keeps what was saved', async () => {
    const made = await create(as.designer, { name: 'Keep me', generator: curbRecipe });
    const res = await as.designer.put(`/api/courses/${made.course.id}`).send({ baseVersion: 1, encoding: { ...made.encoding, heights: 'AAAA' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['encoding.heights']).toMatch(/must hold/);
    expect((await as.designer.put(`/api/courses/${made.course.id}`).send({})).body.error.fields.baseVersion).toMatch(/version this edit started from/);
    expect((await as.designer.put(`/api/courses/${made.course.id}`).send({ baseVersion: 1 })).body.error.fields.encoding).toMatch(/new name or new heights/);
    const still = courseDetailSchema.parse((await as.designer.get(`/api/courses/${made.course.id}`)).body);
    expect(still.course.version).toBe(1);
    expect(still.encoding).toEqual(made.encoding);
  });
});

describe('deleting courses', () => {
  it('deletes a course no suite holds', async () => {
    const made = await create(as.designer, { name: 'Short-lived', generator: curbRecipe });
    // RFC 9110 §15.3.5: 204 No Content.
    expect((await as.designer.delete(`/api/courses/${made.course.id}`)).status).toBe(204);
    expect((await as.designer.get(`/api/courses/${made.course.id}`)).status).toBe(404);
    expect((await as.designer.delete(`/api/courses/${made.course.id}`)).status).toBe(404);
  });
});
