/** What a trial measures: feeding the detector and the response windows each frame, the series, and the final metrics. */
import * as sample from '../course/sample';
import { footingScore } from '../metrics/footing-score';
import { STUMBLE_KINDS, type StumbleKind } from '../metrics/stumble-thresholds';
import type { TrialMetrics } from '../metrics/trial-metrics';
import { recordJointAngles } from './joint-angles';
import { trimSeries } from './series';
import type { Trial, TrialResult } from './trial-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { heightsUnder } = sample;

/** Feed the detector and the windows, accumulate tracking, record the series. */
export function observe(t: Trial, time: number, counted: boolean): void {
  let frameIterations = 0;
  for (let i = 0; i < t.legs; i++) {
    const o = 3 * i;
    const foot = t.solvers[i].foot;
    const fx = foot[0];
    const fy = foot[1];
    const fz = foot[2];
    t.foot[o] = fx;
    t.foot[o + 1] = fy;
    t.foot[o + 2] = fz;
    if (counted) {
      const dx = t.target[o] - fx;
      const dy = t.target[o + 1] - fy;
      const dz = t.target[o + 2] - fz;
      const d2 = dx * dx + dy * dy + dz * dz;
      t.tracking[0] += d2;
      const d = Math.sqrt(d2);
      if (d > t.tracking[1]) t.tracking[1] = d;
      t.trackCount++;
      frameIterations += t.iterations[i];
    }
    const w = t.touchdownWindows[i];
    if (w.open && !w.add(time, fy)) t.touchdownSummary.fold(w);
  }
  heightsUnder(t.course, t.foot, t.legs, t.ground);
  t.detector.observe(time, t.stance, t.foot, t.target, t.ground, t.jointSpeed);
  if (counted && frameIterations > t.frameIterationsMax) t.frameIterationsMax = frameIterations;
  const bw = t.bodyWindow;
  if (bw.open && !bw.add(time, t.height.value)) t.bodySummary.fold(bw);
  record(t, time);
}

function record(t: Trial, time: number): void {
  const s = t.series;
  // Sample k is due at k / rate; the small slack keeps exact multiples from slipping a frame.
  if (s.length > Math.floor(time * s.rate + 1e-6) || s.length >= s.bodyHeight.length) return;
  const k = s.length;
  const L = t.legs;
  for (let i = 0; i < L; i++) {
    const a = (k * L + i) * 3;
    for (let c = 0; c < 3; c++) {
      s.target[a + c] = t.target[3 * i + c];
      s.foot[a + c] = t.foot[3 * i + c];
    }
    s.contact[k * L + i] = t.stance[i];
    s.jointSpeed[k * L + i] = t.jointSpeed[i];
    s.iterations[k * L + i] = Math.min(65535, t.iterations[i]);
    s.error[k * L + i] = t.error[i];
  }
  s.bodyHeight[k] = t.height.value;
  s.bodyPitch[k] = t.pitch.value;
  s.bodyRoll[k] = t.roll.value;
  s.bodyZ[k] = t.bodyPos[2];
  recordJointAngles(s, k, t.solvers, t.bodyPos, t.bodyRot);
  s.length = k + 1;
}

const emptyKinds = (): Record<StumbleKind, number> => ({ sink: 0, skid: 0, 'reach-miss': 0, scuff: 0, snap: 0 });

/** Close the open windows and compute the metrics. */
export function finishTrial(t: Trial): TrialResult {
  for (const w of t.touchdownWindows) if (w.open) t.touchdownSummary.fold(w);
  if (t.bodyWindow.open) t.bodySummary.fold(t.bodyWindow);
  const det = t.detector;
  const steps = det.steps;
  const per100 = emptyKinds();
  const stumbles = {} as TrialMetrics['stumbles'];
  STUMBLE_KINDS.forEach((kind, k) => {
    const count = det.counts[k];
    per100[kind] = (count * 100) / Math.max(steps, 1);
    stumbles[kind] = { count, per100Steps: per100[kind] };
  });
  const trackingRms = t.trackCount ? Math.sqrt(t.tracking[0] / t.trackCount) : 0;
  const touchdown = t.touchdownSummary.summary();
  const frames = t.frame;
  const metrics: TrialMetrics = {
    simSeconds: frames * t.options.timeStep,
    frames,
    steps,
    stumbles,
    events: det.events(),
    tracking: { rms: trackingRms, max: t.tracking[1] },
    touchdown,
    bodyStepUp: t.bodySummary.summary(),
    solver: {
      solves: t.solves,
      iterationsPerSolve: t.solves ? t.iterationSum / t.solves : 0,
      iterationsPerFrameMean: frames ? t.iterationSum / frames : 0,
      iterationsPerFrameMax: t.frameIterationsMax,
      errorMean: t.solves ? t.solverError[0] / t.solves : 0,
      errorMax: t.solverError[1],
      unconverged: t.unconverged,
    },
    footingScore: footingScore({ per100Steps: per100, trackingRms, touchdownOvershootPercent: touchdown.overshootMeanPercent }),
  };
  return { rig: t.rig.name, legNames: t.rig.legs.map((l) => l.name), gait: t.gait, metrics, series: trimSeries(t.series) };
}
