/**
 * The trial job: one character with one leg setup over one or more courses. Each course is a worker task
 * (they run side by side on the pool or the queue's workers); the trials are stored together once all have finished.
 */
import { z } from 'zod';
import type { Clock } from '../clock';
import type { Db } from '../db';
import { encodeCourse } from '../../engine/course/encoding';
import { LegSetupSchema } from '../../engine/gait/leg-setup';
import { loadCourses } from '../services/courses';
import { loadCharacterRig } from '../services/characters';
import { TRIAL_SECONDS, type TrialJobResult } from '../../schemas/trials';
import type { TrialTaskResult } from '../workers/trial-worker';
import { JobCommit, type JobHandler } from './job-runner';
import { CancelledError } from './in-process-runner';

/** What a trial job stores as its input (resolved by the route, so the job runs exactly what was asked). */
export const trialJobInputSchema = z.object({
  characterId: z.number().int(),
  courseIds: z.array(z.number().int()).min(1),
  setup: LegSetupSchema,
  legSetupId: z.number().int().nullable(),
  /** Simulated seconds per course. */
  duration: z.number().positive().max(600).default(TRIAL_SECONDS),
});
export type TrialJobInput = z.input<typeof trialJobInputSchema>;

/** Share of the progress bar the simulation takes; the rest is storing. */
const SIMULATION_SHARE = 95;

export function trialJobHandler(db: Db, clock: Clock): JobHandler {
  return async (ctx) => {
    const input = trialJobInputSchema.parse(ctx.input);
    const character = await loadCharacterRig(db, ctx.teamId, input.characterId);
    const courses = await loadCourses(db, ctx.teamId, input.courseIds);
    const fractions = courses.map(() => 0);
    const results = await Promise.all(
      courses.map((c, i) =>
        ctx.runTask<TrialTaskResult>('trial', { rig: character.rig, setup: input.setup, course: encodeCourse(c.heightfield), options: { duration: input.duration } }, (m) => {
          fractions[i] = Math.max(fractions[i], (m as { fraction: number }).fraction);
          ctx.report((SIMULATION_SHARE * fractions.reduce((a, b) => a + b, 0)) / fractions.length);
        }),
      ),
    );
    if (ctx.signal.aborted) throw new CancelledError();
    // The trials are written in the runner's transaction that marks the job done, once however often it is told.
    return new JobCommit(async (trx) => {
      const now = clock.now();
      const trialIds: number[] = [];
      for (const [i, r] of results.entries()) {
        const [id] = await trx('trials').insert({
          team_id: ctx.teamId,
          character_id: character.id,
          leg_setup_id: input.legSetupId,
          setup: JSON.stringify(input.setup),
          course_id: courses[i].id,
          course_name: courses[i].name,
          course_version: courses[i].version,
          job_id: ctx.jobId,
          metrics: JSON.stringify(r.metrics),
          leg_names: JSON.stringify(r.legNames),
          series: JSON.stringify(r.series),
          footing_score: r.metrics.footingScore,
          created_by: ctx.userId,
          created_at: now,
        });
        trialIds.push(id);
      }
      const result: TrialJobResult = { trialIds, footingScore: results.reduce((s, r) => s + r.metrics.footingScore, 0) / results.length };
      return result;
    });
  };
}
