/**
 * The trial loop: walk a rig across a course at a fixed time step.
 *
 * Each frame: advance the gait clock; at liftoff plan the swing to the next
 * touchdown target, at touchdown lock the foot where it landed (its target);
 * move the body along +Z at the gait speed with its height, pitch and roll
 * following the planted feet through a critically damped filter; solve every
 * leg toward its target with the chosen solver, warm-started from the last
 * frame; feed the stumble detector and the response windows; record the
 * series at the chosen rate. Deterministic: no clocks, no randomness, and
 * nothing is allocated per frame.
 *
 * `createTrial` + `stepTrial` let a live preview advance frame by frame;
 * `runTrial` runs the whole walk and returns metrics and series.
 */
import { quat, vec3 } from 'gl-matrix';
import { z } from 'zod';
import type { Heightfield } from '../course/heightfield';
import { courseLength } from '../course/heightfield';
import { parseOrThrow } from '../course/parse';
import { heightAt, normalAt } from '../course/sample';
import { createWorkspace, setRootTransform, solve, type IKWorkspace } from '../ik';
import { DOF_SLIDE } from '../ik/workspace';
import type { LegChain } from '../rig/types';
import { footingScore } from '../metrics/footing-score';
import { ResponseSummary, ResponseWindow } from '../metrics/response-window';
import { StumbleDetector } from '../metrics/stumble-detector';
import { DEFAULT_STUMBLE_THRESHOLDS, STUMBLE_KINDS, StumbleThresholdsSchema, type StumbleKind } from '../metrics/stumble-thresholds';
import type { TrialMetrics } from '../metrics/trial-metrics';
import { createDampedState, omegaForSettleTime, stepCriticallyDamped, type DampedState } from './body-filter';
import { resolveGait, type GaitParams } from './gait-params';
import { checkLegSetupForRig, parseLegSetup, solverOptionsOf, type LegSetup } from './leg-setup';
import { checkRig, type Rig } from './rig';
import { createSeries, trimSeries, type TrialSeries } from './series';
import { createSwingPlan, minimumJerk, planSwing, swingPoint, type SwingPlan } from './swing-path';
import { legPhase } from './timing';

export const TrialOptionsSchema = z.object({
  /** Simulated seconds asked for; the trial stops earlier if the course runs out. */
  duration: z.number().positive().max(600).default(60),
  timeStep: z
    .number()
    .min(1 / 1000)
    .max(1 / 10)
    .default(1 / 60),
  /** Series samples per second (at most one per frame). */
  recordRate: z.number().positive().max(1000).default(30),
  /** Body start along the walk, m; null = far enough in for the rear feet. */
  startZ: z.number().min(0).nullable().default(null),
  thresholds: StumbleThresholdsSchema.default(DEFAULT_STUMBLE_THRESHOLDS),
});

export type TrialOptions = z.infer<typeof TrialOptionsSchema>;
export type TrialOptionsInput = z.input<typeof TrialOptionsSchema>;

export interface TrialResult {
  rig: string;
  legNames: string[];
  gait: GaitParams;
  metrics: TrialMetrics;
  series: TrialSeries;
}

/** A body target rise of at least this much starts a step-up response window, m. */
export const BODY_STEP_UP_MIN = 0.02;
/** Longest body step-up window, s. */
const BODY_WINDOW_SECONDS = 2;
/** Smallest swing descent measured as a touchdown response, m. */
export const TOUCHDOWN_MIN_DESCENT = 0.01;
/** Longest touchdown window after the touchdown, s. */
const TOUCHDOWN_WINDOW_SECONDS = 0.5;
/** Iterations for the first solve from the rest pose, before the clock starts. */
const SETTLE_ITERATIONS = 200;
/** Margin kept clear at the far end of the course, m. */
const END_MARGIN = 0.1;
const DEG = 180 / Math.PI;
// Local copies: imported bindings compile to property reads under CommonJS interop, too slow for the inner loop.
const SLIDER_DOF = DOF_SLIDE;
const X_AXIS = new Float64Array([1, 0, 0]);
const Z_AXIS = new Float64Array([0, 0, 1]);

export interface Trial {
  readonly rig: Rig;
  readonly setup: LegSetup;
  readonly course: Heightfield;
  readonly options: TrialOptions;
  readonly gait: GaitParams;
  readonly legs: number;
  readonly solvers: IKWorkspace[];
  readonly orient: boolean;
  /** Frames to run and frames run so far. */
  readonly totalFrames: number;
  frame: number;
  readonly startZ: number;

  // Per leg state (index = leg).
  readonly stance: Uint8Array;
  /** Planted foot (stance target) and the ground normal there: 3 per leg. */
  readonly plant: Float64Array;
  readonly plantNormal: Float64Array;
  /** Last planted height of each leg: what the body follows. */
  readonly support: Float64Array;
  readonly swings: SwingPlan[];
  /** Normals at liftoff and at the coming touchdown: 3 per leg. */
  readonly liftNormal: Float64Array;
  readonly landNormal: Float64Array;
  /** Current target and target normal, actual foot: 3 per leg. */
  readonly target: Float64Array;
  readonly targetNormal: Float64Array;
  /** Views of leg i's target and target normal (made once: subarray allocates). */
  readonly targetOf: Float64Array[];
  readonly targetNormalOf: Float64Array[];
  readonly foot: Float64Array;
  readonly prevPose: Float64Array[];
  readonly jointSpeed: Float64Array;
  readonly iterations: Int32Array;
  readonly error: Float64Array;

  // Body.
  readonly bodyPos: Float64Array;
  readonly bodyRot: Float64Array;
  readonly height: DampedState;
  readonly pitch: DampedState;
  readonly roll: DampedState;
  heightTarget: number;
  readonly omega: number;

  // Metrics.
  readonly detector: StumbleDetector;
  readonly touchdownWindows: ResponseWindow[];
  readonly touchdownSummary: ResponseSummary;
  readonly bodyWindow: ResponseWindow;
  readonly bodySummary: ResponseSummary;
  trackSq: number;
  trackMax: number;
  trackCount: number;
  solves: number;
  iterationSum: number;
  frameIterationsMax: number;
  errorSum: number;
  errorMax: number;
  unconverged: number;

  readonly series: TrialSeries;
}

// Scratch shared by every trial (the loop is single-threaded).
const hipLocal = new Float64Array(3);
const hipWorld = new Float64Array(3);
const hipRot = new Float64Array(4);
const legRot = new Float64Array(4);
const pitchRot = new Float64Array(4);
const normalScratch = new Float64Array(3);

function chainWithOverrides(chain: LegChain, setup: LegSetup, legName: string): LegChain {
  const o = setup.legs.find((l) => l.leg === legName);
  if (!o || o.limits.length === 0) return chain;
  const joints = chain.joints.map((j) => {
    const mine = o.limits.filter((l) => l.joint === j.name);
    if (mine.length === 0) return j;
    const n = j.kind === 'universal' ? 2 : 1;
    const limits = Array.from({ length: n }, (_, d) => j.limits?.[d] ?? { min: -Infinity, max: Infinity });
    for (const l of mine) limits[l.dof] = { min: l.min, max: l.max };
    return { ...j, limits };
  });
  return { ...chain, joints };
}

function bodyZAt(t: Trial, time: number): number {
  return t.startZ + t.gait.speed * time;
}

/** Where leg i touches down at `time`: ahead of its neutral spot by half the stance travel. */
function touchdownPoint(t: Trial, i: number, time: number, out: Float64Array, o: number): void {
  const leg = t.rig.legs[i];
  const x = leg.neutralFoot[0];
  const zz = bodyZAt(t, time) + leg.neutralFoot[1] + (t.gait.dutyFactor * t.gait.stride) / 2;
  out[o] = x;
  out[o + 1] = heightAt(t.course, x, zz);
  out[o + 2] = zz;
}

function plantAt(t: Trial, i: number, x: number, y: number, zz: number): void {
  t.plant[3 * i] = x;
  t.plant[3 * i + 1] = y;
  t.plant[3 * i + 2] = zz;
  normalAt(t.course, x, zz, t.plantNormal, 3 * i);
  t.support[i] = y;
}

/** Plan leg i's swing from its planted spot to the touchdown at `landTime`. */
function startSwing(t: Trial, i: number, landTime: number): void {
  touchdownPoint(t, i, landTime, normalScratch, 0);
  const p = t.plant;
  planSwing(
    t.course,
    t.swings[i],
    p[3 * i],
    p[3 * i + 1],
    p[3 * i + 2],
    normalScratch[0],
    normalScratch[1],
    normalScratch[2],
    t.gait.stepHeight,
  );
  for (let k = 0; k < 3; k++) t.liftNormal[3 * i + k] = t.plantNormal[3 * i + k];
  normalAt(t.course, normalScratch[0], normalScratch[2], t.landNormal, 3 * i);
}

/** Body targets from the planted feet: height (returned), pitch and roll (into the filters' targets). */
const bodyTargets = new Float64Array(3);
function computeBodyTargets(t: Trial): void {
  const L = t.legs;
  const b = t.setup.body;
  let mh = 0;
  let mx = 0;
  let mz = 0;
  for (let i = 0; i < L; i++) {
    mh += t.support[i];
    mx += t.plant[3 * i];
    mz += t.plant[3 * i + 2];
  }
  mh /= L;
  mx /= L;
  mz /= L;
  let sxx = 0;
  let szz = 0;
  let sxh = 0;
  let szh = 0;
  for (let i = 0; i < L; i++) {
    const dx = t.plant[3 * i] - mx;
    const dz = t.plant[3 * i + 2] - mz;
    const dh = t.support[i] - mh;
    sxx += dx * dx;
    szz += dz * dz;
    sxh += dx * dh;
    szh += dz * dh;
  }
  // Feet nearly in line across (or along) the walk say nothing about that slope.
  const minSpread = 0.01 * L;
  const slopeZ = szz > minSpread * minSpread ? szh / szz : 0;
  const slopeX = sxx > minSpread * minSpread ? sxh / sxx : 0;
  const pitchRaw = Math.atan(slopeZ);
  const rollRaw = Math.atan(slopeX);
  const bz = t.bodyPos[2];
  const under = heightAt(t.course, 0, bz);
  const ground = under + (mh - under) * b.followHeight;
  const crouch = b.slopeCrouch * t.rig.hipHeight * Math.sqrt(pitchRaw * pitchRaw + rollRaw * rollRaw);
  bodyTargets[0] = ground + t.rig.hipHeight + b.heightOffset - crouch;
  bodyTargets[1] = pitchRaw * b.followPitch;
  bodyTargets[2] = rollRaw * b.followRoll;
}

function updateBodyRotation(t: Trial): void {
  // Nose up is a negative turn about +X (+Z forward, +Y up); left side up is a positive turn about +Z.
  quat.setAxisAngle(pitchRot as unknown as quat, X_AXIS as unknown as vec3, -t.pitch.value);
  quat.setAxisAngle(t.bodyRot as unknown as quat, Z_AXIS as unknown as vec3, t.roll.value);
  quat.multiply(t.bodyRot as unknown as quat, t.bodyRot as unknown as quat, pitchRot as unknown as quat);
}

function placeHips(t: Trial): void {
  for (let i = 0; i < t.legs; i++) {
    const leg = t.rig.legs[i];
    hipLocal[0] = leg.hip[0];
    hipLocal[1] = leg.hip[1];
    hipLocal[2] = leg.hip[2];
    vec3.transformQuat(hipWorld as unknown as vec3, hipLocal as unknown as vec3, t.bodyRot as unknown as quat);
    hipWorld[0] += t.bodyPos[0];
    hipWorld[1] += t.bodyPos[1];
    hipWorld[2] += t.bodyPos[2];
    legRot[0] = leg.hipRotation[0];
    legRot[1] = leg.hipRotation[1];
    legRot[2] = leg.hipRotation[2];
    legRot[3] = leg.hipRotation[3];
    quat.multiply(hipRot as unknown as quat, t.bodyRot as unknown as quat, legRot as unknown as quat);
    setRootTransform(t.solvers[i], hipWorld, hipRot);
  }
}

/** Set up a trial; the setup and options are validated and bad input throws naming the problem. */
export function createTrial(rig: Rig, setupInput: unknown, course: Heightfield, optionsInput: TrialOptionsInput = {}): Trial {
  checkRig(rig);
  const setup = parseLegSetup(setupInput);
  checkLegSetupForRig(setup, rig);
  const options = parseOrThrow(TrialOptionsSchema, optionsInput, 'trial options');
  const gait = resolveGait(setup.gait, rig);
  const L = rig.legs.length;
  const solverOptions = solverOptionsOf(setup.solver);
  const solvers = rig.legs.map((l) => createWorkspace(chainWithOverrides(l.chain, setup, l.name), solverOptions));

  const dt = options.timeStep;
  let reachAhead = 0;
  let reachBehind = 0;
  for (const l of rig.legs) {
    reachAhead = Math.max(reachAhead, l.neutralFoot[1], l.hip[2]);
    reachBehind = Math.max(reachBehind, -l.neutralFoot[1], -l.hip[2]);
  }
  const startZ = options.startZ ?? reachBehind + gait.stride + 0.2;
  // The furthest touchdown target lies one cycle ahead of the body plus half a stance.
  const lastBodyZ = courseLength(course) - END_MARGIN - reachAhead - gait.stride * (1 + gait.dutyFactor / 2);
  const available = (lastBodyZ - startZ) / gait.speed;
  if (!(available > dt)) {
    throw new Error(
      `course too short: ${courseLength(course).toFixed(2)} m leaves no room to walk from z = ${startZ.toFixed(2)} m with a ${gait.stride.toFixed(2)} m stride`,
    );
  }
  const totalFrames = Math.floor(Math.min(options.duration, available) / dt + 1e-9);
  const recordRate = Math.min(options.recordRate, 1 / dt);
  const capacity = Math.floor(totalFrames * dt * recordRate + 1e-9) + 2;
  const cycleFrames = Math.ceil(gait.cycleTime / dt) + Math.ceil(TOUCHDOWN_WINDOW_SECONDS / dt) + 4;

  const target = new Float64Array(3 * L);
  const targetNormal = new Float64Array(3 * L);
  const t: Trial = {
    rig,
    setup,
    course,
    options,
    gait,
    legs: L,
    solvers,
    orient: setup.solver.footOrientation,
    totalFrames,
    frame: 0,
    startZ,
    stance: new Uint8Array(L),
    plant: new Float64Array(3 * L),
    plantNormal: new Float64Array(3 * L),
    support: new Float64Array(L),
    swings: rig.legs.map(() => createSwingPlan()),
    liftNormal: new Float64Array(3 * L),
    landNormal: new Float64Array(3 * L),
    target,
    targetNormal,
    targetOf: rig.legs.map((_, i) => target.subarray(3 * i, 3 * i + 3)),
    targetNormalOf: rig.legs.map((_, i) => targetNormal.subarray(3 * i, 3 * i + 3)),
    foot: new Float64Array(3 * L),
    prevPose: solvers.map((s) => new Float64Array(s.nDof)),
    jointSpeed: new Float64Array(L),
    iterations: new Int32Array(L),
    error: new Float64Array(L),
    bodyPos: new Float64Array(3),
    bodyRot: new Float64Array([0, 0, 0, 1]),
    height: createDampedState(),
    pitch: createDampedState(),
    roll: createDampedState(),
    heightTarget: 0,
    omega: omegaForSettleTime(setup.body.settleTime),
    detector: new StumbleDetector(L, options.thresholds),
    touchdownWindows: rig.legs.map(() => new ResponseWindow(cycleFrames)),
    touchdownSummary: new ResponseSummary(TOUCHDOWN_MIN_DESCENT),
    bodyWindow: new ResponseWindow(Math.ceil(BODY_WINDOW_SECONDS / dt) + 1),
    bodySummary: new ResponseSummary(BODY_STEP_UP_MIN),
    trackSq: 0,
    trackMax: 0,
    trackCount: 0,
    solves: 0,
    iterationSum: 0,
    frameIterationsMax: 0,
    errorSum: 0,
    errorMax: 0,
    unconverged: 0,
    series: createSeries(L, capacity, recordRate),
  };

  // Feet as if the walk had been going on: each leg planted where its last touchdown put it.
  const { cycleTime: T, dutyFactor: beta } = gait;
  t.bodyPos[2] = startZ;
  for (let i = 0; i < L; i++) {
    const phase = legPhase(0, T, gait.phaseOffsets[i]);
    const inStance = phase < beta;
    t.stance[i] = inStance ? 1 : 0;
    // The last touchdown happened `phase` cycles ago.
    touchdownPoint(t, i, -phase * T, normalScratch, 0);
    plantAt(t, i, normalScratch[0], normalScratch[1], normalScratch[2]);
    if (!inStance) startSwing(t, i, (1 - phase) * T);
  }
  computeBodyTargets(t);
  t.height.value = bodyTargets[0];
  t.pitch.value = bodyTargets[1];
  t.roll.value = bodyTargets[2];
  t.heightTarget = bodyTargets[0];
  t.bodyPos[1] = t.height.value;
  updateBodyRotation(t);
  placeHips(t);
  updateTargets(t, 0);
  for (let i = 0; i < L; i++) {
    const r = solve(solvers[i], t.targetOf[i], t.orient ? t.targetNormalOf[i] : null, {
      maxIterations: SETTLE_ITERATIONS,
      warmStart: 'rest',
    });
    t.prevPose[i].set(r.pose);
  }
  observe(t, 0, false);
  return t;
}

/** Targets for the current phase of every leg at `time`. */
function updateTargets(t: Trial, time: number): void {
  const { cycleTime: T, dutyFactor: beta } = t.gait;
  for (let i = 0; i < t.legs; i++) {
    const phase = legPhase(time, T, t.gait.phaseOffsets[i]);
    const o = 3 * i;
    if (phase < beta) {
      for (let k = 0; k < 3; k++) {
        t.target[o + k] = t.plant[o + k];
        t.targetNormal[o + k] = t.plantNormal[o + k];
      }
    } else {
      const tau = (phase - beta) / (1 - beta);
      swingPoint(t.swings[i], tau, t.target, o);
      const s = minimumJerk(tau);
      let nx = t.liftNormal[o] + (t.landNormal[o] - t.liftNormal[o]) * s;
      let ny = t.liftNormal[o + 1] + (t.landNormal[o + 1] - t.liftNormal[o + 1]) * s;
      let nz = t.liftNormal[o + 2] + (t.landNormal[o + 2] - t.liftNormal[o + 2]) * s;
      const n = 1 / Math.sqrt(nx * nx + ny * ny + nz * nz);
      nx *= n;
      ny *= n;
      nz *= n;
      t.targetNormal[o] = nx;
      t.targetNormal[o + 1] = ny;
      t.targetNormal[o + 2] = nz;
    }
  }
}

/** Feed the detector and the windows, accumulate tracking, record the series. */
function observe(t: Trial, time: number, counted: boolean): void {
  const det = t.detector;
  det.frame(time);
  let frameIterations = 0;
  for (let i = 0; i < t.legs; i++) {
    const o = 3 * i;
    const ws = t.solvers[i];
    const fx = ws.foot[0];
    const fy = ws.foot[1];
    const fz = ws.foot[2];
    t.foot[o] = fx;
    t.foot[o + 1] = fy;
    t.foot[o + 2] = fz;
    const groundY = heightAt(t.course, fx, fz);
    det.leg(i, t.stance[i] === 1, fx, fy, fz, t.target[o], t.target[o + 1], t.target[o + 2], groundY, t.jointSpeed[i]);
    if (counted) {
      const dx = t.target[o] - fx;
      const dy = t.target[o + 1] - fy;
      const dz = t.target[o + 2] - fz;
      const d2 = dx * dx + dy * dy + dz * dz;
      t.trackSq += d2;
      t.trackCount++;
      const d = Math.sqrt(d2);
      if (d > t.trackMax) t.trackMax = d;
      frameIterations += t.iterations[i];
    }
    const w = t.touchdownWindows[i];
    if (w.open && !w.add(time, fy)) t.touchdownSummary.fold(w);
  }
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
  s.length = k + 1;
}

/** Advance one frame; returns false once the trial is over. */
export function stepTrial(t: Trial): boolean {
  if (t.frame >= t.totalFrames) return false;
  t.frame++;
  const dt = t.options.timeStep;
  const time = t.frame * dt;
  const { cycleTime: T, dutyFactor: beta } = t.gait;

  // Gait clock: touchdowns lock the feet, liftoffs plan the swings.
  let supportChanged = false;
  for (let i = 0; i < t.legs; i++) {
    const phase = legPhase(time, T, t.gait.phaseOffsets[i]);
    const nowStance = phase < beta ? 1 : 0;
    if (nowStance === t.stance[i]) continue;
    t.stance[i] = nowStance;
    const sw = t.swings[i];
    if (nowStance) {
      plantAt(t, i, sw.x1, sw.y1, sw.z1);
      supportChanged = true;
    } else {
      if (t.touchdownWindows[i].open) t.touchdownSummary.fold(t.touchdownWindows[i]);
      startSwing(t, i, time + (1 - phase) * T);
    }
  }

  // Body: forward at the gait speed, height and attitude through the filter.
  t.bodyPos[2] = bodyZAt(t, time);
  computeBodyTargets(t);
  const rise = bodyTargets[0] - t.heightTarget;
  if (supportChanged && Math.abs(rise) >= BODY_STEP_UP_MIN) {
    if (t.bodyWindow.open) t.bodySummary.fold(t.bodyWindow);
    if (rise > 0) t.bodyWindow.start(t.height.value, bodyTargets[0], time, time + BODY_WINDOW_SECONDS);
  }
  t.heightTarget = bodyTargets[0];
  // Smaller target changes inside a window move where the response should settle.
  if (t.bodyWindow.open) t.bodyWindow.final = bodyTargets[0];
  stepCriticallyDamped(t.height, bodyTargets[0], t.omega, dt);
  stepCriticallyDamped(t.pitch, bodyTargets[1], t.omega, dt);
  stepCriticallyDamped(t.roll, bodyTargets[2], t.omega, dt);
  t.bodyPos[1] = t.height.value;
  updateBodyRotation(t);
  placeHips(t);
  updateTargets(t, time);

  // Touchdown windows open where the swing starts its descent.
  for (let i = 0; i < t.legs; i++) {
    if (t.stance[i]) continue;
    const w = t.touchdownWindows[i];
    if (w.open) continue;
    const phase = legPhase(time, T, t.gait.phaseOffsets[i]);
    const tau = (phase - beta) / (1 - beta);
    const sw = t.swings[i];
    const descent = 1 - (0.5 - 0.25 * sw.boxiness);
    if (tau >= descent) {
      const landTime = time + (1 - phase) * T;
      w.start(t.solvers[i].foot[1], sw.y1, landTime, landTime + TOUCHDOWN_WINDOW_SECONDS);
    }
  }

  // Solve every leg, warm-started from its last pose.
  for (let i = 0; i < t.legs; i++) {
    const ws = t.solvers[i];
    const o = 3 * i;
    const r = solve(ws, t.targetOf[i], t.orient ? t.targetNormalOf[i] : null);
    t.iterations[i] = r.iterations;
    t.error[i] = r.positionError;
    t.solves++;
    t.iterationSum += r.iterations;
    t.errorSum += r.positionError;
    if (r.positionError > t.errorMax) t.errorMax = r.positionError;
    if (!r.converged) t.unconverged++;
    const prev = t.prevPose[i];
    let fastest = 0;
    for (let d = 0; d < ws.nDof; d++) {
      if (ws.dKind[d] === SLIDER_DOF) continue;
      const change = Math.abs(r.pose[d] - prev[d]);
      if (change > fastest) fastest = change;
    }
    prev.set(r.pose);
    t.jointSpeed[i] = (fastest / dt) * DEG;
  }
  observe(t, time, true);
  return t.frame < t.totalFrames;
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
  const trackingRms = t.trackCount ? Math.sqrt(t.trackSq / t.trackCount) : 0;
  const touchdown = t.touchdownSummary.summary();
  const frames = t.frame;
  const metrics: TrialMetrics = {
    simSeconds: frames * t.options.timeStep,
    frames,
    steps,
    stumbles,
    events: det.events(),
    tracking: { rms: trackingRms, max: t.trackMax },
    touchdown,
    bodyStepUp: t.bodySummary.summary(),
    solver: {
      solves: t.solves,
      iterationsPerSolve: t.solves ? t.iterationSum / t.solves : 0,
      iterationsPerFrameMean: frames ? t.iterationSum / frames : 0,
      iterationsPerFrameMax: t.frameIterationsMax,
      errorMean: t.solves ? t.errorSum / t.solves : 0,
      errorMax: t.errorMax,
      unconverged: t.unconverged,
    },
    footingScore: footingScore({ per100Steps: per100, trackingRms, touchdownOvershootPercent: touchdown.overshootMeanPercent }),
  };
  return { rig: t.rig.name, legNames: t.rig.legs.map((l) => l.name), gait: t.gait, metrics, series: trimSeries(t.series) };
}

/** Walk `rig` over `course` with `setup`; deterministic: the same inputs give bit-identical results. */
export function runTrial(rig: Rig, setup: unknown, course: Heightfield, options: TrialOptionsInput = {}): TrialResult {
  const t = createTrial(rig, setup, course, options);
  while (stepTrial(t));
  return finishTrial(t);
}
