import { footingTrends } from '../../components/home/footing-trend';
import type { TrialSummary } from '../../schemas/trials';

const trial = (id: number, characterId: number, footingScore: number) => ({ id, characterId, footingScore }) as TrialSummary;

describe('footing trends on Home', () => {
  it('takes each character’s newest trial and the change since the one before', () => {
    // Newest first, as GET /api/trials lists them.
    const trends = footingTrends([trial(5, 1, 82.5), trial(4, 2, 60), trial(3, 1, 80), trial(1, 1, 70)]);
    expect(trends.get(1)).toMatchObject({ latest: { id: 5 }, scores: [70, 80, 82.5], change: 2.5 });
    expect(trends.get(2)).toMatchObject({ latest: { id: 4 }, scores: [60], change: null });
  });

  it('keeps only the most recent scores', () => {
    const many = Array.from({ length: 12 }, (_, i) => trial(100 - i, 1, i));
    expect(footingTrends(many, 8).get(1)!.scores).toEqual([7, 6, 5, 4, 3, 2, 1, 0]);
  });
});
