/**
 * The demo's seeded leg setups are the recorded result of a real dial-in (seeds/tune-demo-setups.ts):
 * re-running a recorded candidate on the same engine gives the recorded scores exactly (the engine is
 * deterministic), and the tuned setup does at least as well as the defaults it started from.
 */
import { generateCourse } from '../../engine/course';
import { evaluateCandidate } from '../../engine/dialin';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { demoCharacterRigs } from '../../seeds/demo-character-rigs';
import { DEMO_COURSES } from '../../seeds/demo-courses';
import { seededSetupFor, tunedRecordFor } from '../../seeds/demo-setups';

describe('seeded demo setups', () => {
  const courses = DEMO_COURSES.map((c) => generateCourse(c.recipe));
  it('are the recorded dial-in results: re-run, each scores as recorded, and no worse than the defaults', async () => {
    const rigs = await demoCharacterRigs();
    expect(rigs.length).toBe(3);
    for (const { name, rig } of rigs) {
      const record = tunedRecordFor(name);
      expect(record).not.toBeNull();
      const tuned = evaluateCandidate(rig, seededSetupFor(name, rig), courses, { duration: TRIAL_SECONDS });
      const start = evaluateCandidate(rig, defaultLegSetup(rig), courses, { duration: TRIAL_SECONDS });
      expect([name, tuned.perCourse.map((c) => c.footingScore)]).toEqual([name, record!.bestScores]);
      expect([name, start.perCourse.map((c) => c.footingScore)]).toEqual([name, record!.startScores]);
      expect(tuned.objective).toBeLessThanOrEqual(start.objective);
    }
  });
});
