import { footingTrends } from '../../components/home/footing-trend';
import type { TrialSummary } from '../../schemas/trials';

// Differences of the figures given below, worked by hand (common practice, no source).
const trial = (id: number, characterId: number, footingScore: number, courseId = 1) =>
  ({ id, characterId, footingScore, courseId, courseName: `course ${courseId}`, legSetupVersion: 1 }) as TrialSummary;

describe('footing trends on Home', () => {
  it('takes each character’s newest trial and the change since the one before on the same course', () => {
    // Newest first, as GET /api/trials lists them.
    const trends = footingTrends([trial(5, 1, 82.5), trial(4, 2, 60), trial(3, 1, 80), trial(1, 1, 70)]);
    expect(trends.get(1)).toMatchObject({ latest: { id: 5 }, previous: { id: 3 }, scores: [70, 80, 82.5], change: 2.5 });
    expect(trends.get(2)).toMatchObject({ latest: { id: 4 }, previous: null, scores: [60], change: null });
  });

  it('never compares trials on different courses', () => {
    // Burrow's seeded case: 0.0 on the dock steps, then 99.6 on the rubble. Not "+99.6 better".
    const trends = footingTrends([trial(4, 2, 99.6, 2), trial(3, 2, 0, 1)]);
    expect(trends.get(2)).toMatchObject({ latest: { id: 4 }, previous: null, change: null, scores: [99.6] });
    expect(trends.get(2)!.otherCourses.map((t) => t.id)).toEqual([3]);
    const later = footingTrends([trial(9, 2, 97.1, 2), trial(8, 2, 12, 1), trial(4, 2, 99.6, 2), trial(3, 2, 0, 1)]).get(2)!;
    expect(later.previous?.id).toBe(4);
    expect(later.change).toBeCloseTo(97.1 - 99.6, 10);
    expect(later.scores).toEqual([99.6, 97.1]);
  });

  it('follows a deleted course by its name', () => {
    const gone = (id: number, score: number) => ({ ...trial(id, 1, score), courseId: null, courseName: 'Old yard' }) as TrialSummary;
    const t = footingTrends([gone(7, 50), trial(6, 1, 10), gone(5, 40)]).get(1)!;
    expect(t.previous?.id).toBe(5);
    expect(t.change).toBe(10);
  });

  it('keeps only the most recent scores', () => {
    const many = Array.from({ length: 12 }, (_, i) => trial(100 - i, 1, i));
    expect(footingTrends(many, 8).get(1)!.scores).toEqual([7, 6, 5, 4, 3, 2, 1, 0]);
  });
});
