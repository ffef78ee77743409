import type { DialInResult } from '../../schemas/dial-ins';
import { foundNothing, isBetter, ratesOf, showValue, shownGain, startStumbles } from '../../components/dialin/outcome';

const result = (before: number, after: number, extra: Record<string, unknown> = {}): DialInResult => ({
  baseLegSetupId: 3,
  characterId: 1,
  suiteId: 1,
  params: [{ key: 'gait.stepHeight', min: 0.02, max: 0.3 }],
  history: [],
  bestSoFar: after,
  candidatesTried: 20,
  before: { footingScore: before, perCourse: [{ courseId: 7, courseName: 'Dock', footingScore: before, ...extra }] },
  after: { footingScore: after, perCourse: [{ courseId: 7, courseName: 'Dock', footingScore: after }] },
});

// Scores show to one decimal; the comparison is made on what the reader sees (common practice, no source).
describe('did the dial-in find anything?', () => {
  it('calls a gain that rounds to 0.0 nothing, and a start of 0 everywhere that stays 0 nothing', () => {
    expect(foundNothing(result(0, 0))).toBe(true);
    expect(foundNothing(result(0, 0.04))).toBe(true);
    expect(foundNothing(result(52.31, 52.33))).toBe(true);
    expect(foundNothing(result(52.3, 51.0))).toBe(true);
    expect(foundNothing(result(52.3, 52.4))).toBe(false);
    expect(shownGain(result(10.04, 12.26))).toBeCloseTo(2.3, 9);
  });
  it('gives the better colour only to a figure that rose as shown', () => {
    expect(isBetter(0, 0)).toBe(false);
    expect(isBetter(0, 0.04)).toBe(false);
    expect(isBetter(0, 0.06)).toBe(true);
  });
  it('reads the start’s stumbles from either shape a server may send, and nothing from a broken one', () => {
    const plain = { sink: 1, skid: 2, 'reach-miss': 30.5, scuff: 4, snap: 0 };
    expect(startStumbles(result(0, 0, { stumbles: plain }), 7)).toEqual(plain);
    const nested = Object.fromEntries(Object.entries(plain).map(([k, v]) => [k, { count: 3, per100Steps: v }]));
    expect(startStumbles(result(0, 0, { stumbles: nested }), 7)).toEqual(plain);
    expect(startStumbles(result(0, 0), 7)).toBeNull();
    expect(ratesOf({ sink: 'lots' })).toBeNull();
  });
  it('shows an angle setting in degrees (180° = π rad, ISO 80000-3)', () => {
    expect(showValue('solver.maxStepAngle', Math.PI / 4)).toBe('45°');
    expect(showValue('gait.stepHeight', 0.123456)).toBe('0.123 m');
    expect(showValue('solver.maxIterations', 40)).toBe('40');
  });
});
