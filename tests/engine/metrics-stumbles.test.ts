import {
  DEFAULT_STUMBLE_THRESHOLDS,
  FOOTING_SCORE_FORMULA,
  FOOTING_SCORE_TERMS,
  STUMBLE_KINDS,
  STUMBLE_THRESHOLD_NOTES,
  StumbleDetector,
  StumbleThresholdsSchema,
  footingScore,
} from '../../engine/metrics';

/**
 * Constructed single-leg walks: a foot planted at the origin on flat ground
 * (ground height 0), with one disturbance. Thresholds are the defaults
 * (common practice, no source; snap 720 °/s from memory), each hit just over
 * and just under.
 */
interface Frame {
  contact: boolean;
  foot: [number, number, number];
  target?: [number, number, number];
  jointSpeed?: number;
}

function detect(frames: Frame[]) {
  const d = new StumbleDetector(1, DEFAULT_STUMBLE_THRESHOLDS);
  frames.forEach((f, k) => {
    const t = f.target ?? f.foot;
    d.observe(k / 60, [f.contact ? 1 : 0], f.foot, t, [0], [f.jointSpeed ?? 100]);
  });
  return d;
}

/** Swing for 10 frames, then stance for 20, with `edit` applied to frame k. */
function walk(edit: (k: number, f: Frame) => void): Frame[] {
  const frames: Frame[] = [];
  for (let k = 0; k < 40; k++) {
    const f: Frame = k < 10 || k >= 30 ? { contact: false, foot: [0, 0.05, 0] } : { contact: true, foot: [0, 0, 0] };
    edit(k, f);
    frames.push(f);
  }
  return frames;
}

const count = (frames: Frame[], kind: (typeof STUMBLE_KINDS)[number]) => detect(frames).countOf(kind);

describe('stumble kinds: constructed cases and their near misses', () => {
  it('a clean step has no stumbles and counts one step', () => {
    const d = detect(walk(() => {}));
    expect(d.eventCount).toBe(0);
    expect(d.steps).toBe(1);
  });
  it('sink: 1.1 cm below the ground for 2 frames (> 1 cm for 2+ frames)', () => {
    const sink = (depth: number, n: number) =>
      walk((k, f) => {
        if (k >= 15 && k < 15 + n) f.foot[1] = -depth;
      });
    expect(count(sink(0.011, 2), 'sink')).toBe(1);
    expect(count(sink(0.009, 10), 'sink')).toBe(0);
    expect(count(sink(0.011, 1), 'sink')).toBe(0);
    const e = detect(sink(0.011, 3)).events()[0];
    expect(e.time).toBeCloseTo(15 / 60, 12);
    expect(e.size).toBeCloseTo(0.011, 12);
  });
  it('skid: a planted foot sliding 2.1 cm within one stance (> 2 cm)', () => {
    const slide = (d: number) =>
      walk((k, f) => {
        if (k >= 10 && k < 30) f.foot[2] = (d * (k - 10)) / 19;
      });
    expect(count(slide(0.021), 'skid')).toBe(1);
    expect(count(slide(0.019), 'skid')).toBe(0);
    expect(detect(slide(0.03)).events()[0].size).toBeCloseTo(0.03, 12);
  });
  it('reach-miss: 1.1 cm from the target at touchdown (> 1 cm)', () => {
    const miss = (r: number) =>
      walk((k, f) => {
        if (k >= 10 && k < 30) f.target = [0, -r, 0];
      });
    expect(count(miss(0.011), 'reach-miss')).toBe(1);
    expect(count(miss(0.009), 'reach-miss')).toBe(0);
  });
  it('scuff: the swinging sole 3 mm below the ground (> 2 mm)', () => {
    const clip = (depth: number) =>
      walk((k, f) => {
        if (k >= 3 && k < 6) f.foot[1] = -depth;
      });
    expect(count(clip(0.003), 'scuff')).toBe(1);
    expect(count(clip(0.0019), 'scuff')).toBe(0);
  });
  it('snap: a joint at 730 °/s (> 720 °/s, from memory)', () => {
    const pop = (speed: number) =>
      walk((k, f) => {
        if (k === 20 || k === 21) f.jointSpeed = speed;
      });
    expect(count(pop(730), 'snap')).toBe(1);
    expect(count(pop(710), 'snap')).toBe(0);
    expect(detect(pop(900)).events()[0]).toEqual({ kind: 'snap', time: 20 / 60, leg: 0, size: 900 });
  });
});

describe('thresholds', () => {
  it('every default threshold states its reason and whether it has a source', () => {
    for (const key of Object.keys(DEFAULT_STUMBLE_THRESHOLDS) as (keyof typeof DEFAULT_STUMBLE_THRESHOLDS)[]) {
      expect(['common practice, no source', 'from memory']).toContain(STUMBLE_THRESHOLD_NOTES[key].basis);
    }
    expect(StumbleThresholdsSchema.parse(DEFAULT_STUMBLE_THRESHOLDS)).toEqual(DEFAULT_STUMBLE_THRESHOLDS);
    expect(StumbleThresholdsSchema.safeParse({ ...DEFAULT_STUMBLE_THRESHOLDS, sinkDepth: -1 }).success).toBe(false);
  });
});

describe('footing score (formula of our own, common practice, no source)', () => {
  const clean = { per100Steps: { sink: 0, skid: 0, 'reach-miss': 0, scuff: 0, snap: 0 }, trackingRms: 0, touchdownOvershootPercent: 0 };
  it('a clean trial scores 100 and every penalty lowers it', () => {
    expect(footingScore(clean)).toBe(100);
    for (const kind of STUMBLE_KINDS) {
      expect(footingScore({ ...clean, per100Steps: { ...clean.per100Steps, [kind]: 1 } })).toBeLessThan(100);
    }
    expect(footingScore({ ...clean, trackingRms: 0.01 })).toBeCloseTo(100 * Math.exp(-0.1), 1);
    expect(footingScore({ ...clean, per100Steps: { ...clean.per100Steps, snap: 1e6 } })).toBe(0);
  });
  it('exports its formula as text naming every term with its weight', () => {
    for (const t of FOOTING_SCORE_TERMS) expect(FOOTING_SCORE_FORMULA.text).toContain(`${t.weight}·${t.symbol}`);
    expect(FOOTING_SCORE_FORMULA.terms).toHaveLength(FOOTING_SCORE_TERMS.length);
    expect(JSON.parse(JSON.stringify(FOOTING_SCORE_FORMULA))).toEqual(FOOTING_SCORE_FORMULA);
  });
});
