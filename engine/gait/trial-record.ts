/**
 * What a trial measures, observing its walk: the stumble detector, the touchdown and body step-up response
 * windows, tracking and solver figures, the recorded series, and the final metrics. The walk never reads any
 * of it; the game runtime runs the walk without a recorder.
 */
import { footingScore } from '../metrics/footing-score';
import { ResponseSummary, ResponseWindow } from '../metrics/response-window';
import { StumbleDetector } from '../metrics/stumble-detector';
import { STUMBLE_KINDS, type StumbleKind, type StumbleThresholds } from '../metrics/stumble-thresholds';
import type { TrialMetrics } from '../metrics/trial-metrics';
import { recordJointAngles } from './joint-angles';
import { createSeries, trimSeries, type TrialSeries } from './series';
import * as swingPath from './swing-path';
import * as trialOptions from './trial-options';
import type { TrialResult } from './trial-state';
import type { Walk } from './walk-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { descentStart } = swingPath;
const { BODY_STEP_UP_MIN, BODY_WINDOW_SECONDS, TOUCHDOWN_MIN_DESCENT, TOUCHDOWN_WINDOW_SECONDS } = trialOptions;

export interface TrialRecorder {
  readonly detector: StumbleDetector;
  readonly touchdownWindows: ResponseWindow[];
  readonly touchdownSummary: ResponseSummary;
  readonly bodyWindow: ResponseWindow;
  readonly bodySummary: ResponseSummary;
  /** Ground height under each sole this frame. */
  readonly ground: Float64Array;
  /** Sum of squared tracking errors and the largest error (a typed array: no boxed doubles per frame). */
  readonly tracking: Float64Array;
  trackCount: number;
  solves: number;
  iterationSum: number;
  frameIterationsMax: number;
  /** Sum and largest of the solvers' final position errors. */
  readonly solverError: Float64Array;
  unconverged: number;
  readonly series: TrialSeries;
  /** What the walk was at the last observation: stance per leg, sole heights, body height, the landed height target. */
  readonly lastStance: Uint8Array;
  readonly lastFootY: Float64Array;
  lastHeight: number;
  lastHeightTarget: number;
}

export function createRecorder(w: Walk, thresholds: StumbleThresholds, totalFrames: number, recordRate: number): TrialRecorder {
  const dt = w.timeStep;
  const L = w.legs;
  const rate = Math.min(recordRate, 1 / dt);
  const capacity = Math.floor(totalFrames * dt * rate + 1e-9) + 2;
  const cycleFrames = Math.ceil(w.gait.cycleTime / dt) + Math.ceil(TOUCHDOWN_WINDOW_SECONDS / dt) + 4;
  return {
    detector: new StumbleDetector(L, thresholds),
    touchdownWindows: Array.from({ length: L }, () => new ResponseWindow(cycleFrames)),
    touchdownSummary: new ResponseSummary(TOUCHDOWN_MIN_DESCENT),
    bodyWindow: new ResponseWindow(Math.ceil(BODY_WINDOW_SECONDS / dt) + 1),
    bodySummary: new ResponseSummary(BODY_STEP_UP_MIN),
    ground: new Float64Array(L),
    tracking: new Float64Array(2),
    trackCount: 0,
    solves: 0,
    iterationSum: 0,
    frameIterationsMax: 0,
    solverError: new Float64Array(2),
    unconverged: 0,
    series: createSeries(L, capacity, rate),
    lastStance: Uint8Array.from(w.stance),
    lastFootY: new Float64Array(L),
    lastHeight: w.height.value,
    lastHeightTarget: w.heightTarget,
  };
}

/**
 * After the walk's step and before its leg solves: close the touchdown windows of feet that lifted off, open
 * one where a swing starts its descent (from where the sole was), and follow the body's step-up window.
 */
export function observeStep(r: TrialRecorder, w: Walk, time: number): void {
  const beta = w.gait.dutyFactor;
  const T = w.cycleTime;
  for (let i = 0; i < w.legs; i++) {
    const win = r.touchdownWindows[i];
    if (!w.stance[i] && r.lastStance[i] && win.open) r.touchdownSummary.fold(win);
  }
  // A body step-up is measured from the footholds that ask for it: when a new one is chosen, the height the
  // body will settle at once every swinging foot has landed is the step the response is measured against.
  if (w.supportChanged) {
    const rise = w.heightTarget - r.lastHeightTarget;
    if (Math.abs(rise) >= BODY_STEP_UP_MIN) {
      if (r.bodyWindow.open) r.bodySummary.fold(r.bodyWindow);
      if (rise > 0) r.bodyWindow.start(r.lastHeight, w.heightTarget, time, time + BODY_WINDOW_SECONDS);
    }
    r.lastHeightTarget = w.heightTarget;
  }
  // Smaller target changes inside a window move where the response should settle.
  if (r.bodyWindow.open) r.bodyWindow.final = w.heightGoal;
  // Touchdown windows open where the swing starts its descent.
  for (let i = 0; i < w.legs; i++) {
    if (w.stance[i]) continue;
    const win = r.touchdownWindows[i];
    if (win.open) continue;
    const phase = w.phase[i];
    const tau = (phase - beta) / (1 - beta);
    const sw = w.swings[i];
    if (tau >= descentStart(sw)) {
      const landTime = time + (1 - phase) * T;
      win.start(r.lastFootY[i], sw.y1, landTime, landTime + TOUCHDOWN_WINDOW_SECONDS);
    }
  }
}

/** After the leg solves: feed the detector and the windows, accumulate tracking and solver figures, record the series. */
export function observeSolved(r: TrialRecorder, w: Walk, time: number, counted: boolean): void {
  let frameIterations = 0;
  for (let i = 0; i < w.legs; i++) {
    const o = 3 * i;
    const fy = w.foot[o + 1];
    if (counted) {
      const dx = w.target[o] - w.foot[o];
      const dy = w.target[o + 1] - fy;
      const dz = w.target[o + 2] - w.foot[o + 2];
      const d2 = dx * dx + dy * dy + dz * dz;
      r.tracking[0] += d2;
      const d = Math.sqrt(d2);
      if (d > r.tracking[1]) r.tracking[1] = d;
      r.trackCount++;
      frameIterations += w.iterations[i];
      r.solves++;
      r.iterationSum += w.iterations[i];
      r.solverError[0] += w.solveError[i];
      if (w.solveError[i] > r.solverError[1]) r.solverError[1] = w.solveError[i];
      if (!w.converged[i]) r.unconverged++;
    }
    const win = r.touchdownWindows[i];
    if (win.open && !win.add(time, fy)) r.touchdownSummary.fold(win);
    r.ground[i] = w.ground.height(w.foot[o], w.foot[o + 2]);
    r.lastFootY[i] = fy;
    r.lastStance[i] = w.stance[i];
  }
  r.detector.observe(time, w.stance, w.foot, w.target, r.ground, w.jointSpeed);
  if (counted && frameIterations > r.frameIterationsMax) r.frameIterationsMax = frameIterations;
  const bw = r.bodyWindow;
  if (bw.open && !bw.add(time, w.height.value)) r.bodySummary.fold(bw);
  r.lastHeight = w.height.value;
  record(r, w, time);
}

function record(r: TrialRecorder, w: Walk, time: number): void {
  const s = r.series;
  // Sample k is due at k / rate; the small slack keeps exact multiples from slipping a frame.
  if (s.length > Math.floor(time * s.rate + 1e-6) || s.length >= s.bodyHeight.length) return;
  const k = s.length;
  const L = w.legs;
  for (let i = 0; i < L; i++) {
    const a = (k * L + i) * 3;
    for (let c = 0; c < 3; c++) {
      s.target[a + c] = w.target[3 * i + c];
      s.foot[a + c] = w.foot[3 * i + c];
    }
    s.contact[k * L + i] = w.stance[i];
    s.jointSpeed[k * L + i] = w.jointSpeed[i];
    s.iterations[k * L + i] = Math.min(65535, w.iterations[i]);
    s.error[k * L + i] = w.error[i];
  }
  s.bodyHeight[k] = w.height.value;
  s.bodyPitch[k] = w.pitch.value;
  s.bodyRoll[k] = w.roll.value;
  s.bodyZ[k] = w.bodyPos[2];
  recordJointAngles(s, k, w.solvers, w.bodyPos, w.bodyRot);
  s.length = k + 1;
}

const emptyKinds = (): Record<StumbleKind, number> => ({ sink: 0, skid: 0, 'reach-miss': 0, scuff: 0, snap: 0 });

/** Close the open windows and compute the metrics. */
export function finishRecord(r: TrialRecorder, w: Walk): TrialResult {
  for (const win of r.touchdownWindows) if (win.open) r.touchdownSummary.fold(win);
  if (r.bodyWindow.open) r.bodySummary.fold(r.bodyWindow);
  const det = r.detector;
  const steps = det.steps;
  const per100 = emptyKinds();
  const stumbles = {} as TrialMetrics['stumbles'];
  STUMBLE_KINDS.forEach((kind, k) => {
    const count = det.counts[k];
    per100[kind] = (count * 100) / Math.max(steps, 1);
    stumbles[kind] = { count, per100Steps: per100[kind] };
  });
  const trackingRms = r.trackCount ? Math.sqrt(r.tracking[0] / r.trackCount) : 0;
  const touchdown = r.touchdownSummary.summary();
  const frames = w.frame;
  const metrics: TrialMetrics = {
    simSeconds: frames * w.timeStep,
    frames,
    steps,
    stumbles,
    events: det.events(),
    tracking: { rms: trackingRms, max: r.tracking[1] },
    touchdown,
    bodyStepUp: r.bodySummary.summary(),
    solver: {
      solves: r.solves,
      iterationsPerSolve: r.solves ? r.iterationSum / r.solves : 0,
      iterationsPerFrameMean: frames ? r.iterationSum / frames : 0,
      iterationsPerFrameMax: r.frameIterationsMax,
      errorMean: r.solves ? r.solverError[0] / r.solves : 0,
      errorMax: r.solverError[1],
      unconverged: r.unconverged,
    },
    footingScore: footingScore({ per100Steps: per100, trackingRms, touchdownOvershootPercent: touchdown.overshootMeanPercent }),
  };
  return { rig: w.rig.name, legNames: w.rig.legs.map((l) => l.name), gait: w.gait, metrics, series: trimSeries(r.series) };
}
