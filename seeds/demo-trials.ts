import type { Db } from '../server/db';
import { defaultLegSetup, type LegSetup } from '../engine/gait/leg-setup';
import { runTrial } from '../engine/gait/trial';
import { encodeSeries } from '../engine/gait/series-encoding';
import { loadCourse } from '../server/services/courses';
import { saveLegSetup } from '../server/services/leg-setups';
import { loadCharacterRig } from '../server/services/characters';
import { TRIAL_SECONDS } from '../schemas/trials';
import { DEMO_SUITE } from './demo-courses';
import { seededSetupFor, tunedRecordFor } from './demo-setups';
import { roundProfileNumbers } from '../engine/profile/export';
import { STUMBLE_KINDS } from '../engine/metrics/stumble-thresholds';
import type { TrialMetrics } from '../engine/metrics/trial-metrics';

/**
 * A first leg setup version for each demo character (the engine's defaults), a second with the settings a
 * real dial-in over the demo suite chose (seeds/tune-demo-setups.ts, recorded in demo-tuned-setups.json),
 * and a stored trial per character on the first demo courses, run here synchronously through the engine.
 * Characters that already have a setup are left as they are.
 */
/** Courses of the demo suite each character gets a stored trial on (the first ones; a few trials are enough to show). */
const SEEDED_COURSES = 2;

export async function seedDemoTrials(db: Db, teamId: number, userId: number, now: number): Promise<void> {
  const suite = await db('suites').where({ team_id: teamId, name: DEMO_SUITE }).first('id');
  const courseIds: number[] = suite ? (await db('suite_courses').where({ suite_id: suite.id }).orderBy('position').select('course_id')).map((r) => r.course_id) : [];
  const characters = await db('characters').where({ team_id: teamId }).orderBy('created_at').orderBy('id').select('id', 'name');
  let tick = 0;
  for (const c of characters) {
    if (await db('leg_setups').where({ character_id: c.id }).first('id')) continue;
    const character = await loadCharacterRig(db, teamId, c.id).catch(() => null);
    if (!character) continue;
    const at = now + 60_000 * tick++;
    const defaults = defaultLegSetup(character.rig);
    let setup: LegSetup = defaults;
    let legSetupId = await saveLegSetup(db, { teamId, characterId: c.id, userId, setup, note: 'Engine defaults.', source: 'seed', now: at });
    // A second version is made the day after the first, once its author has looked at the defaults walking.
    const nextDay = at + 86_400_000;
    const tuned = tunedRecordFor(c.name);
    if (tuned) {
      setup = seededSetupFor(c.name, character.rig);
      const mean = (xs: number[]) => (xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length)).toFixed(1);
      const note = `Dial-in of ${tuned.tried} candidates over ${DEMO_SUITE}: mean footing score ${mean(tuned.startScores)} → ${mean(tuned.bestScores)}.`;
      legSetupId = await saveLegSetup(db, { teamId, characterId: c.id, userId, setup, note, source: 'seed', now: nextDay });
    }
    const measured: { course: string; metrics: TrialMetrics }[] = [];
    for (const [k, courseId] of courseIds.slice(0, SEEDED_COURSES).entries()) {
      const course = await loadCourse(db, teamId, courseId);
      // The setup as it was saved (numbers rounded on save), so the trial is the saved version's own.
      const result = runTrial(character.rig, roundProfileNumbers(setup), course.heightfield, { duration: TRIAL_SECONDS });
      await db('trials').insert({
        team_id: teamId,
        character_id: c.id,
        leg_setup_id: legSetupId,
        setup: JSON.stringify(setup),
        course_id: course.id,
        course_name: course.name,
        course_version: course.version,
        job_id: null,
        metrics: JSON.stringify(result.metrics),
        leg_names: JSON.stringify(result.legNames),
        series: JSON.stringify(encodeSeries(result.series)),
        footing_score: result.metrics.footingScore,
        created_by: userId,
        created_at: nextDay + 60_000 * (k + 1),
      });
      measured.push({ course: course.name, metrics: result.metrics });
    }
    // The note ends with what the seeded trials measured, so it never claims more than the numbers show.
    const saved = await db('leg_setups').where({ id: legSetupId }).first('note');
    await db('leg_setups').where({ id: legSetupId }).update({ note: `${saved.note} ${measuredNote(measured)}`.trim() });
  }
}

/** "Measured: Loading dock steps 0.0 (mostly snap, 31.2 per 100 steps), Scrap rubble 99.6." */
export function measuredNote(trials: readonly { course: string; metrics: TrialMetrics }[]): string {
  if (trials.length === 0) return '';
  const parts = trials.map(({ course, metrics }) => {
    const worst = STUMBLE_KINDS.reduce((a, b) => (metrics.stumbles[b].per100Steps > metrics.stumbles[a].per100Steps ? b : a));
    const rate = metrics.stumbles[worst].per100Steps;
    const why = metrics.footingScore < 50 && rate > 0 ? ` (mostly ${worst}, ${rate.toFixed(1)} per 100 steps)` : '';
    return `${course} ${metrics.footingScore.toFixed(1)}${why}`;
  });
  return `Measured footing score: ${parts.join(', ')}.`;
}
