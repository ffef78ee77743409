/**
 * What the dial-in minimises for one candidate setup: the footing penalty P (the score is 100·exp(−P),
 * engine/metrics/footing-score.ts) averaged over the suite's courses. P keeps growing where the rounded
 * score is stuck at 0 (40 snaps is better than 400), so the search always has a slope to follow; its mean
 * is −ln of the geometric mean of score/100, so lowering it raises the scores a user sees.
 */
import type { Heightfield } from '../course/heightfield';
import type { Rig } from '../gait/rig';
import { runTrial, type TrialOptionsInput } from '../gait/trial';
import { footingPenalty, type FootingScoreInputs } from '../metrics/footing-score';
import type { TrialMetrics } from '../metrics/trial-metrics';

export interface CourseOutcome {
  footingScore: number;
  penalty: number;
  /** Set when the engine refused the setup on this course. */
  refused?: string;
}

export interface CandidateOutcome {
  perCourse: CourseOutcome[];
  /** Mean footing score over the courses (what the screens show). */
  footingScore: number;
  /** Mean penalty P over the courses: the objective. */
  objective: number;
}

/** Stands for a course the engine refuses the setup on: worse than any walk that runs (score 100·e⁻²⁰ ≈ 0). */
export const REFUSED_PENALTY = 20;

export function penaltyOf(m: TrialMetrics): number {
  const per100Steps = Object.fromEntries(Object.entries(m.stumbles).map(([k, v]) => [k, v.per100Steps])) as FootingScoreInputs['per100Steps'];
  return footingPenalty({ per100Steps, trackingRms: m.tracking.rms, touchdownOvershootPercent: m.touchdown.overshootMeanPercent });
}

export function summariseOutcome(perCourse: CourseOutcome[]): CandidateOutcome {
  const n = Math.max(1, perCourse.length);
  return {
    perCourse,
    footingScore: perCourse.reduce((s, c) => s + c.footingScore, 0) / n,
    objective: perCourse.reduce((s, c) => s + c.penalty, 0) / n,
  };
}

/** One course of a candidate: a setup the engine refuses there scores 0 with REFUSED_PENALTY. */
export function evaluateCourse(rig: Rig, setup: unknown, course: Heightfield, options: TrialOptionsInput): CourseOutcome {
  try {
    const m = runTrial(rig, setup, course, options).metrics;
    return { footingScore: m.footingScore, penalty: penaltyOf(m) };
  } catch (err) {
    return { footingScore: 0, penalty: REFUSED_PENALTY, refused: (err as Error).message };
  }
}

export function evaluateCandidate(rig: Rig, setup: unknown, courses: readonly Heightfield[], options: TrialOptionsInput): CandidateOutcome {
  return summariseOutcome(courses.map((c) => evaluateCourse(rig, setup, c, options)));
}
