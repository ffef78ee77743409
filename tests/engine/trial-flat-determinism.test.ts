import { flatCourse, rubbleCourse } from '../../engine/course';
import { PRESET_GAITS, PRESET_RIG_NAMES, decodeSeries, defaultLegSetup, encodeSeries, presetRig, runTrial, type Rig } from '../../engine/gait';
import { STUMBLE_KINDS, TrialMetricsSchema, detectStumbles } from '../../engine/metrics';

describe('flat course with default settings', () => {
  // A flat course is the null case: any stumble there is a bug in the planner or the loop (common practice, no source).
  it.each(PRESET_RIG_NAMES)('%s: zero stumbles of every kind', (name) => {
    const rig = presetRig(name);
    const r = runTrial(rig, defaultLegSetup(rig), flatCourse(40), { duration: 20 });
    for (const kind of STUMBLE_KINDS) expect([kind, r.metrics.stumbles[kind].count]).toEqual([kind, 0]);
    expect(r.metrics.steps).toBeGreaterThan(30);
    expect(r.metrics.tracking.max).toBeLessThan(0.01);
    // Touchdowns are measured as step responses and land without visible overshoot.
    expect(r.metrics.touchdown.count).toBeGreaterThan(0);
    expect(r.metrics.touchdown.overshootMaxPercent).toBeLessThan(5);
    expect(TrialMetricsSchema.safeParse(r.metrics).success).toBe(true);
  });
});

describe('other patterns and leg counts on flat ground (common practice, no source)', () => {
  const clean = (rig: Rig, setup: ReturnType<typeof defaultLegSetup>) => {
    const m = runTrial(rig, setup, flatCourse(40), { duration: 15 }).metrics;
    return STUMBLE_KINDS.map((k) => m.stumbles[k].count).reduce((a, b) => a + b, 0);
  };
  it('a quadruped trot', () => {
    const rig = presetRig('quadruped');
    const s = defaultLegSetup(rig);
    s.gait.pattern = 'quadruped-trot';
    s.gait.dutyFactor = PRESET_GAITS['quadruped-trot'].dutyFactor;
    expect(clean(rig, s)).toBe(0);
  });
  it('a five-legged rig on its default custom pattern', () => {
    const h = presetRig('hexapod');
    const rig: Rig = { ...h, name: 'pentapod', legs: h.legs.slice(0, 5) };
    const s = defaultLegSetup(rig);
    expect(s.gait.pattern).toBe('custom');
    expect(s.gait.phaseOffsets).toHaveLength(5);
    expect(clean(rig, s)).toBe(0);
  });
});

describe('determinism', () => {
  it('two runs of the same trial give identical metrics and series, bit for bit', () => {
    const rig = presetRig('quadruped');
    const course = rubbleCourse(30, 0.05, 0.5, 99, { leadIn: 2 });
    const a = runTrial(rig, defaultLegSetup(rig), course, { duration: 10 });
    const b = runTrial(rig, defaultLegSetup(rig), course, { duration: 10 });
    expect(b.metrics).toEqual(a.metrics);
    expect(Buffer.from(b.series.foot.buffer).equals(Buffer.from(a.series.foot.buffer))).toBe(true);
    expect(Buffer.from(b.series.bodyHeight.buffer).equals(Buffer.from(a.series.bodyHeight.buffer))).toBe(true);
  });
});

describe('series', () => {
  it('records at the chosen rate', () => {
    const rig = presetRig('hexapod');
    const r = runTrial(rig, defaultLegSetup(rig), flatCourse(20), { duration: 4, recordRate: 20 });
    expect(r.series.length).toBe(4 * 20 + 1);
    expect(r.series.rate).toBe(20);
    expect(r.series.target.length).toBe(r.series.length * 6 * 3);
  });
  it('stumble detection over a series recorded every frame finds exactly the trial’s own events', () => {
    const rig = presetRig('biped');
    const course = rubbleCourse(30, 0.06, 0.4, 5, { leadIn: 2 });
    const setup = defaultLegSetup(rig);
    // A sluggish solver (one heavily damped iteration a frame), so that the walk has stumbles to find.
    setup.solver.lambda = 0.4;
    setup.solver.maxIterations = 1;
    setup.solver.warmStart = 'previous';
    const r = runTrial(rig, setup, course, { duration: 10, recordRate: 60 });
    expect(r.metrics.events.length).toBeGreaterThan(0);
    const offline = detectStumbles(r.series, course);
    // The series is Float32: sizes agree to its precision, kinds, legs and frames exactly.
    const key = (e: { kind: string; time: number; leg: number }) => `${e.kind}/${e.leg}/${Math.round(e.time * 60)}`;
    const found = offline.events();
    expect(found.map(key)).toEqual(r.metrics.events.map(key));
    found.forEach((e, k) => expect(Math.abs(e.size - r.metrics.events[k].size)).toBeLessThan(1e-5 * Math.max(1, e.size)));
    expect(offline.steps).toBe(r.metrics.steps);
  });
});

describe('series encoding', () => {
  it('round-trips a recorded series exactly and rejects a truncated field with its name', () => {
    const rig = presetRig('quadruped');
    const s = runTrial(rig, defaultLegSetup(rig), flatCourse(20), { duration: 3 }).series;
    const enc = JSON.parse(JSON.stringify(encodeSeries(s)));
    const back = decodeSeries(enc);
    expect(back.length).toBe(s.length);
    expect(back.foot).toEqual(s.foot);
    expect(back.contact).toEqual(s.contact);
    expect(back.iterations).toEqual(s.iterations);
    expect(back.bodyZ).toEqual(s.bodyZ);
    expect(() => decodeSeries({ ...enc, fields: { ...enc.fields, foot: 'AAAA' } })).toThrow(/foot must hold \d+ bytes, got 3[\s\S]*fields\.foot/);
    expect(() => decodeSeries({ ...enc, version: 3 })).toThrow(/unsupported version 3/);
  });
});
