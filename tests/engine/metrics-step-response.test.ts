import { stepResponse, uniformTimes } from '../../engine/metrics/step-response';

/**
 * Unit step response of 1/(s² + 2ζωn·s + ωn²)·ωn² for ζ < 1, closed form
 * (Ogata, Modern Control Engineering, §5-3; Nise, Control Systems Engineering, §4.6):
 * y = 1 − e^(−ζωn t)·(cos ωd t + ζ/√(1−ζ²)·sin ωd t), ωd = ωn√(1−ζ²).
 */
function secondOrderStep(zeta: number, wn: number, t: number): number {
  const wd = wn * Math.sqrt(1 - zeta * zeta);
  return 1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + (zeta / Math.sqrt(1 - zeta * zeta)) * Math.sin(wd * t));
}

function sampled(f: (t: number) => number, dt: number, duration: number) {
  const n = Math.round(duration / dt) + 1;
  const t = uniformTimes(n, dt);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) y[i] = f(t[i]);
  return { t, y };
}

const within = (actual: number | null, expected: number, rel: number) => {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected) / expected).toBeLessThan(rel);
};

describe('step response of 1/(s²+s+1) (ζ = 0.5, ωn = 1)', () => {
  // Check values of 1/(s²+s+1) from Ogata, Modern Control Engineering, and Nise, Control Systems Engineering:
  // 16.303 %, 3.628 s, 8.076 s (2 %), each within 0.5 %.
  const { t, y } = sampled((x) => secondOrderStep(0.5, 1, x), 0.01, 30);
  const r = stepResponse(t, y, { initial: 0, final: 1 });

  it('percent overshoot 16.303 % (Ogata; Nise: 100·exp(−ζπ/√(1−ζ²)))', () => {
    within(r.overshootPercent, 16.303, 0.005);
  });
  it('peak time 3.628 s (π/ωd; Ogata; Nise)', () => {
    within(r.peakTime, 3.628, 0.005);
  });
  it('settling time 8.076 s in the 2 % band (Ogata; Nise)', () => {
    within(r.settlingTime, 8.076, 0.005);
  });
  it('finds the same values on a coarse 20 Hz sampling (interpolated)', () => {
    const c = sampled((x) => secondOrderStep(0.5, 1, x), 0.05, 30);
    const rc = stepResponse(c.t, c.y, { initial: 0, final: 1 });
    within(rc.overshootPercent, 16.303, 0.005);
    within(rc.peakTime, 3.628, 0.005);
    within(rc.settlingTime, 8.076, 0.005);
  });
  it('rise time 10–90 % equals the crossings of the closed form (bisection on Ogata’s formula)', () => {
    const cross = (level: number) => {
      let lo = 0;
      let hi = 3.6;
      for (let k = 0; k < 80; k++) {
        const mid = (lo + hi) / 2;
        if (secondOrderStep(0.5, 1, mid) < level) lo = mid;
        else hi = mid;
      }
      return lo;
    };
    within(r.riseTime, cross(0.9) - cross(0.1), 0.005);
  });
  it('percent overshoot matches 100·exp(−ζπ/√(1−ζ²)) for other ζ (Ogata; Nise)', () => {
    for (const zeta of [0.2, 0.4, 0.7]) {
      const s = sampled((x) => secondOrderStep(zeta, 2, x), 0.005, 20);
      const expected = 100 * Math.exp((-zeta * Math.PI) / Math.sqrt(1 - zeta * zeta));
      within(stepResponse(s.t, s.y, { initial: 0, final: 1 }).overshootPercent, expected, 0.005);
    }
  });
});

describe('responses without overshoot', () => {
  it('a first-order response 1 − e^(−t) reports 0 % and no peak time; 2 % settling at ln 50 s (Ogata §5-2)', () => {
    const { t, y } = sampled((x) => 1 - Math.exp(-x), 0.01, 20);
    const r = stepResponse(t, y, { initial: 0, final: 1 });
    expect(r.overshootPercent).toBe(0);
    expect(r.peakTime).toBeNull();
    within(r.settlingTime, Math.log(50), 0.005);
    // 10–90 % rise of a first-order lag is ln 9·τ (Ogata §5-2).
    within(r.riseTime, Math.log(9), 0.005);
  });
  it('a step down measures the same as the mirrored step up', () => {
    const up = sampled((x) => secondOrderStep(0.5, 1, x), 0.01, 30);
    const down = new Float64Array(up.y.length);
    for (let i = 0; i < down.length; i++) down[i] = 2 - up.y[i];
    const a = stepResponse(up.t, up.y, { initial: 0, final: 1 });
    const b = stepResponse(up.t, down, { initial: 2, final: 1 });
    expect(b.overshootPercent).toBeCloseTo(a.overshootPercent, 10);
    expect(b.settlingTime).toBeCloseTo(a.settlingTime as number, 10);
  });
  it('a response that never enters the band reports no settling time', () => {
    const { t, y } = sampled((x) => secondOrderStep(0.1, 1, x), 0.01, 5);
    expect(stepResponse(t, y, { initial: 0, final: 1 }).settlingTime).toBeNull();
  });
  it('a constant signal has no step: 0 %', () => {
    const t = uniformTimes(10, 0.1);
    const r = stepResponse(t, new Float64Array(10).fill(0.3));
    expect(r.overshootPercent).toBe(0);
    expect(r.step).toBe(0);
  });
  it('rejects mismatched lengths with a clear error', () => {
    expect(() => stepResponse([0, 1, 2], [0, 1])).toThrow(/differ in length/);
  });
});
