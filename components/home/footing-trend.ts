import type { TrialSummary } from '../../schemas/trials';

export interface FootingTrend {
  latest: TrialSummary;
  /** Scores oldest → newest, at most `keep`. */
  scores: number[];
  /** Latest minus the one before it; null with a single trial. */
  change: number | null;
}

/** Per character: its newest trial, its recent scores and how the score moved since the trial before. */
export function footingTrends(trialsNewestFirst: readonly TrialSummary[], keep = 8): Map<number, FootingTrend> {
  const byCharacter = new Map<number, TrialSummary[]>();
  for (const t of trialsNewestFirst) {
    const list = byCharacter.get(t.characterId) ?? [];
    if (list.length < keep) list.push(t);
    byCharacter.set(t.characterId, list);
  }
  const trends = new Map<number, FootingTrend>();
  for (const [id, list] of byCharacter) {
    const scores = list.map((t) => t.footingScore).reverse();
    trends.set(id, { latest: list[0], scores, change: scores.length > 1 ? scores[scores.length - 1] - scores[scores.length - 2] : null });
  }
  return trends;
}
