import type { TrialSummary } from '../../schemas/trials';

export interface FootingTrend {
  latest: TrialSummary;
  /** Scores on the latest trial's course, oldest → newest, at most `keep`. */
  scores: number[];
  /** The trial before the latest on the same course; null when the latest is the first there. */
  previous: TrialSummary | null;
  /** Latest minus `previous`; null without one. A trial on another course is never the comparison. */
  change: number | null;
  /** The newest trial on each other course, newest first: shown beside, never compared with, the latest. */
  otherCourses: TrialSummary[];
}

/** One course across its edits: by id while it exists, by name once it was deleted. */
const sameCourse = (a: TrialSummary, b: TrialSummary) => (a.courseId !== null && b.courseId !== null ? a.courseId === b.courseId : a.courseName === b.courseName);

/**
 * Per character: its newest trial, and how the score moved since the trial before it on the same course, so a
 * trend never compares ground of different difficulty.
 */
export function footingTrends(trialsNewestFirst: readonly TrialSummary[], keep = 8): Map<number, FootingTrend> {
  const byCharacter = new Map<number, TrialSummary[]>();
  for (const t of trialsNewestFirst) {
    const list = byCharacter.get(t.characterId) ?? [];
    list.push(t);
    byCharacter.set(t.characterId, list);
  }
  const trends = new Map<number, FootingTrend>();
  for (const [id, list] of byCharacter) {
    const latest = list[0];
    const here = list.filter((t) => sameCourse(t, latest)).slice(0, keep);
    const previous = here[1] ?? null;
    const otherCourses: TrialSummary[] = [];
    for (const t of list) if (!sameCourse(t, latest) && !otherCourses.some((o) => sameCourse(o, t))) otherCourses.push(t);
    trends.set(id, {
      latest,
      scores: here.map((t) => t.footingScore).reverse(),
      previous,
      change: previous ? latest.footingScore - previous.footingScore : null,
      otherCourses,
    });
  }
  return trends;
}
