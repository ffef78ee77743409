/**
 * Starter courses: the ground a new studio adds in one tap so its first trial and dial-in have something to
 * walk over. Our own recipes, from level ground up to steps a person climbs, and one suite holding them all.
 * Adding them again adds only what is missing (matched by name), so nothing the team made is touched.
 */
import type { Db } from '../db';
import { CODE_STAIRS, CourseSpecSchema, generateCourse, type CourseSpecInput } from '../../engine/course/generators';
import { insertCourse } from './courses';
import { createSuite } from './suites';

export const STARTER_COURSES: readonly { name: string; recipe: CourseSpecInput }[] = [
  { name: 'Starter: level ground', recipe: { width: 1.6, cellSize: 0.05, segments: [{ kind: 'flat', length: 6 }] } },
  {
    name: 'Starter: gentle slope',
    recipe: { width: 1.6, cellSize: 0.05, segments: [{ kind: 'flat', length: 1.5 }, { kind: 'ramp', length: 3, angleDeg: 6 }, { kind: 'flat', length: 1.5 }] },
  },
  {
    // Three steps at the IBC 2021 §1011.5.2 limits (178 mm riser, 279 mm tread): the ground a person climbs.
    name: 'Starter: three steps',
    recipe: { width: 1.6, cellSize: 0.02, segments: [{ kind: 'flat', length: 1.5 }, { kind: 'stairs', steps: 3, ...CODE_STAIRS, direction: 'up' }, { kind: 'flat', length: 1.5 }] },
  },
  {
    name: 'Starter: loose gravel',
    recipe: { width: 1.6, cellSize: 0.04, segments: [{ kind: 'flat', length: 1 }, { kind: 'rubble', length: 4, amplitude: 0.03, featureSize: 0.3, seed: 2207, octaves: 2 }, { kind: 'flat', length: 1 }] },
  },
];

export const STARTER_SUITE = 'Starter suite';

export interface StarterOutcome {
  /** Names of the courses this call added (empty when the studio had them all). */
  added: string[];
  suiteId: number;
  suiteAdded: boolean;
}

/** Adds the starter courses and suite that are missing, in one transaction. */
export async function addStarterCourses(db: Db, teamId: number, userId: number, now: number): Promise<StarterOutcome> {
  return db.transaction(async (trx) => {
    const ids: number[] = [];
    const added: string[] = [];
    for (const [i, starter] of STARTER_COURSES.entries()) {
      const existing = await trx('courses').where({ team_id: teamId, name: starter.name }).first('id');
      if (existing) {
        ids.push(existing.id);
        continue;
      }
      const generator = CourseSpecSchema.parse(starter.recipe);
      // A second apart so "last saved" lists them in the order above.
      ids.push(await insertCourse(trx, { teamId, userId, name: starter.name, heightfield: generateCourse(generator), generator, now: now + 1000 * i }));
      added.push(starter.name);
    }
    const suite = await trx('suites').where({ team_id: teamId, name: STARTER_SUITE }).first('id');
    if (suite) return { added, suiteId: suite.id as number, suiteAdded: false };
    const suiteId = await createSuite(trx, { teamId, userId, name: STARTER_SUITE, courseIds: ids, now });
    return { added, suiteId, suiteAdded: true };
  });
}
