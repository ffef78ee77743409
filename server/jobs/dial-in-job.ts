/**
 * The dial-in job: the batched search of server/workers/dial-in-search.ts, every course of every candidate a
 * worker task (one trial), so the pool's threads or the queue's workers share one dial-in.
 * Progress and the best-so-far plot are reported as candidates finish; the final result (start and best
 * per course, the best setup) depends only on the inputs and the seed.
 */
import { z } from 'zod';
import type { Clock } from '../clock';
import type { Db } from '../db';
import { encodeCourse } from '../../engine/course/encoding';
import { summariseOutcome, type CandidateOutcome, type CourseOutcome } from '../../engine/dialin/objective';
import { LegSetupSchema } from '../../engine/gait/leg-setup';
import { loadCourses } from '../services/courses';
import { loadCharacterRig } from '../services/characters';
import { settleReservation } from '../services/billing-limits';
import { dialInParamSchema, type DialInResult, type DialInScores } from '../../schemas/dial-ins';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { runSearch, SearchStopped, withValues, type CandidateTask, type DialInContext, type EvaluatedCandidate } from '../workers/dial-in-search';
import { JobCommit, type JobHandler } from './job-runner';
import { CancelledError } from './in-process-runner';

export const dialInJobInputSchema = z.object({
  characterId: z.number().int(),
  suiteId: z.number().int(),
  courseIds: z.array(z.number().int()).min(1),
  base: LegSetupSchema,
  baseLegSetupId: z.number().int().nullable(),
  params: z.array(dialInParamSchema).min(1),
  candidates: z.number().int().min(1),
  seed: z.number().int(),
  /** Simulated seconds per course and candidate. */
  duration: z.number().positive().max(600).default(TRIAL_SECONDS),
});
export type DialInJobInput = z.input<typeof dialInJobInputSchema>;

/** Most points the running best-so-far plot carries. */
const PLOT_POINTS = 400;

function thin<T>(points: T[]): T[] {
  if (points.length <= PLOT_POINTS) return points;
  const every = points.length / PLOT_POINTS;
  const out: T[] = [];
  for (let k = 0; k < PLOT_POINTS; k++) out.push(points[Math.floor(k * every)]);
  out.push(points[points.length - 1]);
  return out;
}

/** The best-so-far plot: each candidate's mean score, and the mean score of the best by penalty up to it. */
function plotOf(candidates: EvaluatedCandidate[]): DialInResult['history'] {
  let best: CandidateOutcome | null = null;
  return candidates.map((c, k) => {
    if (!best || c.outcome.objective < best.objective) best = c.outcome;
    return { candidate: k + 1, score: c.outcome.footingScore, best: best.footingScore };
  });
}

export function dialInJobHandler(db: Db, clock: Clock): JobHandler {
  return async (ctx) => {
    const input = dialInJobInputSchema.parse(ctx.input);
    const character = await loadCharacterRig(db, ctx.teamId, input.characterId);
    const courses = await loadCourses(db, ctx.teamId, input.courseIds);
    const context: DialInContext = { rig: character.rig, base: input.base, params: input.params, courses: courses.map((c) => encodeCourse(c.heightfield)), options: { duration: input.duration } };
    // While running, the plot follows candidates as they arrive (any order); the final one is in candidate order.
    const arrived: EvaluatedCandidate[] = [];
    const partial = (): DialInResult => ({
      baseLegSetupId: input.baseLegSetupId,
      characterId: input.characterId,
      suiteId: input.suiteId,
      params: input.params,
      history: thin(plotOf(arrived)),
      bestSoFar: arrived.length ? plotOf(arrived)[arrived.length - 1].best : null,
      candidatesTried: arrived.length,
    });
    let run;
    try {
      run = await runSearch(
        { base: input.base, params: input.params, budget: input.candidates, seed: input.seed },
        async (values) =>
          summariseOutcome(await Promise.all(context.courses.map((_, course) => ctx.runTask<CourseOutcome>('candidate', { context, values, course } satisfies CandidateTask)))),
        (c) => {
          arrived.push(c);
          ctx.report((98 * arrived.length) / input.candidates, partial());
        },
        () => ctx.signal.aborted,
      );
    } catch (err) {
      if (err instanceof SearchStopped || ctx.signal.aborted) throw new CancelledError();
      throw err;
    }
    const scores = (c: EvaluatedCandidate): DialInScores => ({
      footingScore: c.outcome.footingScore,
      penalty: c.outcome.objective,
      perCourse: courses.map((course, k) => ({ courseId: course.id, courseName: course.name, footingScore: c.outcome.perCourse[k].footingScore, penalty: c.outcome.perCourse[k].penalty })),
    });
    const plot = plotOf(run.candidates);
    const result: DialInResult = {
      ...partial(),
      history: thin(plot),
      candidatesTried: run.candidates.length,
      bestSoFar: run.best.outcome.footingScore,
      before: scores(run.start),
      after: scores(run.best),
      bestValues: run.best.values,
      bestSetup: withValues(input.base, run.best.values),
      beatsStart: run.best.outcome.objective < run.start.outcome.objective,
      stopReason: run.stopReason,
      acceptedLegSetupId: null,
    };
    // Written by the runner in the transaction that marks the job done, so the allowance is counted once.
    return new JobCommit(async (trx) => {
      await settleReservation(trx, ctx.jobId, run.candidates.length, clock.now());
      return result;
    });
  };
}
