/**
 * The dial-in job: Nelder–Mead searches over the chosen settings (server/workers/dial-in-search.ts), two
 * side by side on the pool from different seeded starts when the budget allows, each with half the
 * candidates. Progress and the best-so-far plot are reported as candidates finish; the final result
 * (before/after per course, the best setup) depends only on the inputs and the seed.
 */
import { z } from 'zod';
import type { Clock } from '../clock';
import type { Db } from '../db';
import { encodeCourse } from '../../engine/course/encoding';
import { LegSetupSchema } from '../../engine/gait/leg-setup';
import { mulberry32 } from '../../engine/math/random';
import { loadCourse, type LoadedCourse } from '../services/courses';
import { loadWalkingCharacter } from '../services/leg-setups';
import { consumeAllowance } from '../services/billing-limits';
import { dialInParamSchema, type DialInResult, type DialInScores } from '../../schemas/dial-ins';
import { TRIAL_SECONDS } from '../../schemas/trials';
import type { SearchResult } from '../workers/dial-in-search';
import { withValues } from '../workers/dial-in-search';
import type { CandidateMessage } from '../workers/dial-in-worker';
import type { JobHandler } from './job-runner';
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

/** Below this budget one search gets it all. */
const SPLIT_FROM = 10;
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

/** How the budget is split: one search from the base setup, and (from SPLIT_FROM on) a second from a seeded start. */
export function planSearches(candidates: number, seed: number, dimensions: number): { budgets: number[]; starts: (number[] | null)[] } {
  const searches = candidates >= SPLIT_FROM ? 2 : 1;
  const rng = mulberry32(seed);
  const budgets = Array.from({ length: searches }, (_, i) => Math.floor(candidates / searches) + (i < candidates % searches ? 1 : 0));
  const starts = budgets.map((_, i) => (i === 0 ? null : Array.from({ length: dimensions }, () => rng.next())));
  return { budgets, starts };
}

export function dialInJobHandler(db: Db, clock: Clock): JobHandler {
  return async (ctx) => {
    const input = dialInJobInputSchema.parse(ctx.input);
    const character = await loadWalkingCharacter(db, ctx.teamId, input.characterId);
    const courses: LoadedCourse[] = [];
    for (const id of input.courseIds) courses.push(await loadCourse(db, ctx.teamId, id));
    const encodings = courses.map((c) => encodeCourse(c.heightfield));
    const { budgets, starts } = planSearches(input.candidates, input.seed, input.params.length);
    const tried = budgets.map(() => 0);
    const history: DialInResult['history'] = [];
    let bestSoFar: number | null = null;
    const partial = (): DialInResult => ({
      baseLegSetupId: input.baseLegSetupId,
      characterId: input.characterId,
      suiteId: input.suiteId,
      params: input.params,
      history: thin(history),
      bestSoFar,
      candidatesTried: tried.reduce((a, b) => a + b, 0),
    });
    const results = await Promise.all(
      budgets.map((budget, i) =>
        ctx.runTask<SearchResult>(
          'dialIn',
          { rig: character.rig, base: input.base, params: input.params, courses: encodings, budget, seed: input.seed + i, start: starts[i], options: { duration: input.duration } },
          (m) => {
            const c = m as CandidateMessage;
            tried[i] = c.tried;
            bestSoFar = bestSoFar === null ? c.best : Math.max(bestSoFar, c.best);
            history.push({ candidate: history.length + 1, score: c.score, best: bestSoFar });
            ctx.report((98 * tried.reduce((a, b) => a + b, 0)) / input.candidates, partial());
          },
        ),
      ),
    );
    if (ctx.signal.aborted) throw new CancelledError();
    // The winner by score, ties to the earlier search, so the answer never depends on thread timing
    // (only the order of points in the running plot does). Search 0 starts at the base setup, so its
    // first candidate is "before" and the winner is never worse than it.
    let best = results[0].best;
    for (const r of results) if (r.best.score > best.score) best = r.best;
    const scores = (s: { score: number; perCourse: number[] }): DialInScores => ({
      footingScore: s.score,
      perCourse: courses.map((c, k) => ({ courseId: c.id, courseName: c.name, footingScore: s.perCourse[k] })),
    });
    const total = results.reduce((s, r) => s + r.tried, 0);
    // The plot of record: the searches' candidates interleaved in a fixed order, best so far along it.
    const plot: DialInResult['history'] = [];
    let running = -Infinity;
    for (let k = 0; k < Math.max(...results.map((r) => r.scores.length)); k++) {
      for (const r of results) {
        if (k >= r.scores.length) continue;
        running = Math.max(running, r.scores[k]);
        plot.push({ candidate: plot.length + 1, score: r.scores[k], best: running });
      }
    }
    await db.transaction(async (trx) => {
      await consumeAllowance(trx, ctx.teamId, 'dialInCandidates', total, clock.now());
    });
    const result: DialInResult = {
      ...partial(),
      history: thin(plot),
      candidatesTried: total,
      bestSoFar: best.score,
      before: scores(results[0].first),
      after: scores(best),
      bestValues: best.values,
      bestSetup: withValues(input.base, best.values),
      acceptedLegSetupId: null,
    };
    return result;
  };
}
