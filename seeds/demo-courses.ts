import type { Db } from '../server/db';
import { CODE_STAIRS, CourseSpecSchema, generateCourse, type CourseSpecInput } from '../engine/course/generators';
import { insertCourse } from '../server/services/courses';
import { createSuite } from '../server/services/suites';

/** The scrapyard the demo courier robot crosses (invented scenario), as generator recipes. */
export const DEMO_COURSES: readonly { name: string; recipe: CourseSpecInput }[] = [
  {
    // Up onto a loading dock and down again, at the IBC 2021 §1011.5.2 stair limits (178 mm riser, 279 mm tread).
    name: 'Loading dock steps',
    recipe: {
      width: 1.6,
      cellSize: 0.02,
      segments: [
        { kind: 'flat', length: 2 },
        { kind: 'stairs', steps: 5, ...CODE_STAIRS, direction: 'up' },
        { kind: 'flat', length: 2 },
        { kind: 'stairs', steps: 5, ...CODE_STAIRS, direction: 'down' },
        { kind: 'flat', length: 1.5 },
      ],
    },
  },
  {
    name: 'Scrap rubble',
    recipe: {
      width: 2,
      cellSize: 0.04,
      segments: [
        { kind: 'flat', length: 1.5 },
        { kind: 'rubble', length: 8, amplitude: 0.07, featureSize: 0.35, seed: 4711, octaves: 3 },
        { kind: 'flat', length: 1.5 },
      ],
    },
  },
  {
    name: 'Drainage trench',
    recipe: {
      width: 2,
      cellSize: 0.025,
      segments: [
        { kind: 'flat', length: 2 },
        { kind: 'trench', length: 1.6, width: 0.45, depth: 0.3 },
        { kind: 'flat', length: 1 },
        { kind: 'curb', length: 1, height: 0.12 },
        { kind: 'flat', length: 1.5 },
      ],
    },
  },
  {
    name: 'Ramp to the gantry',
    recipe: {
      width: 2,
      cellSize: 0.05,
      segments: [
        { kind: 'flat', length: 2 },
        { kind: 'ramp', length: 4, angleDeg: 12 },
        { kind: 'flat', length: 2 },
      ],
    },
  },
];

export const DEMO_SUITE = 'Scrapyard crossing';

/** Adds the demo courses and the suite holding all four; a course or suite already there (by name) is left as it is. */
export async function seedDemoCourses(db: Db, teamId: number, userId: number, now: number): Promise<void> {
  const ids: number[] = [];
  for (const [i, demo] of DEMO_COURSES.entries()) {
    const existing = await db('courses').where({ team_id: teamId, name: demo.name }).first('id');
    if (existing) {
      ids.push(existing.id);
      continue;
    }
    const generator = CourseSpecSchema.parse(demo.recipe);
    // A minute apart, like the characters, so "last edited" reads in a stable order.
    ids.push(await insertCourse(db, { teamId, userId, name: demo.name, heightfield: generateCourse(generator), generator, now: now + 60_000 * i }));
  }
  const suite = await db('suites').where({ team_id: teamId, name: DEMO_SUITE }).first('id');
  if (!suite) await createSuite(db, { teamId, userId, name: DEMO_SUITE, courseIds: ids, now });
}
