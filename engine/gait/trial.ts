/**
 * The trial loop: walk a rig across a course at a fixed time step.
 *
 * Each frame: advance the gait clock; at liftoff plan the swing to the next
 * touchdown target, at touchdown lock the foot where it landed (its target);
 * move the body along +Z at the gait speed with its height, pitch and roll
 * following the planted feet through a critically damped filter; solve every
 * leg toward its target with its chosen solver, warm-started from the last
 * frame's pose (by default carried on at part of its last rate of change);
 * feed the stumble detector and the response windows; record the series at
 * the chosen rate. Deterministic: no clocks, no randomness; no arrays or
 * objects are allocated per frame.
 *
 * `createTrial` + `stepTrial` let a live preview advance frame by frame;
 * `runTrial` runs the whole walk and returns metrics and series.
 */
import type { Heightfield } from '../course/heightfield';
import { courseLength } from '../course/heightfield';
import { parseOrThrow } from '../course/parse';
import * as ikSolve from '../ik/solve';
import * as ikLayout from '../ik/layout';
import * as ikPose from '../ik/pose';
import * as ikWorkspace from '../ik/workspace';
import type { LegChain } from '../rig/types';
import { ResponseSummary, ResponseWindow } from '../metrics/response-window';
import { StumbleDetector } from '../metrics/stumble-detector';
import * as bodyFilter from './body-filter';
import { bodyTargets, computeBodyTargets, followBodyTargets, placeHips, updateBodyRotation } from './body-pose';
import { plantAt, startSwing, touchdownPoint, updateTargets } from './foot-planner';
import { PACE_SETTLE_SECONDS, terrainPace } from './pace';
import { resolveGait } from './gait-params';
import { checkLegSetupForRig, legSolverSettings, parseLegSetup, solverOptionsOf, type LegSetup } from './leg-setup';
import { aimLeg, findStraightKnee, limitLegMotion, preshapeKnee } from './leg-motion';
import { measureFoldLimit } from './reach';
import { checkRig, type Rig } from './rig';
import { neutralWalkHeight } from './walk-height';
import { createSeries } from './series';
import * as swingPath from './swing-path';
import * as timing from './timing';
import {
  BODY_STEP_UP_MIN,
  BODY_WINDOW_SECONDS,
  DEG,
  END_MARGIN,
  EXTRAPOLATION_GAIN,
  SETTLE_ITERATIONS,
  TOUCHDOWN_MIN_DESCENT,
  TOUCHDOWN_WINDOW_SECONDS,
  TrialOptionsSchema,
  type TrialOptionsInput,
} from './trial-options';
import { finishTrial, observe } from './trial-record';
import type { Trial, TrialResult } from './trial-state';

export { finishTrial } from './trial-record';
export type { Trial, TrialResult } from './trial-state';
export * from './trial-options';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { solve } = ikSolve;
const { createWorkspace, setRootTransform } = ikWorkspace;
const { resetPose } = ikPose;
const { DOF_BALL, DOF_SLIDE } = ikLayout;
const ORIGIN = new Float64Array(3);
const IDENTITY_QUAT = new Float64Array([0, 0, 0, 1]);
const UP = new Float64Array([0, 1, 0]);
const kneeScratch = new Float64Array(2);

const { createDampedState, createCriticalFilter, stepCritical } = bodyFilter;
const { createSwingPlan, descentStart } = swingPath;
const { legPhase, writeLegPhases } = timing;

const landing = new Float64Array(3);
const aim = new Float64Array(3);
const aimNormal = new Float64Array(3);

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

/** Set up a trial; the setup and options are validated and bad input throws naming the problem. */
export function createTrial(rig: Rig, setupInput: unknown, course: Heightfield, optionsInput: TrialOptionsInput = {}): Trial {
  checkRig(rig);
  const setup = parseLegSetup(setupInput);
  checkLegSetupForRig(setup, rig);
  const options = parseOrThrow(TrialOptionsSchema, optionsInput, 'trial options');
  const gait = resolveGait(setup.gait, rig);
  const L = rig.legs.length;
  const legSolvers = rig.legs.map((l) => legSolverSettings(setup, l.name));
  const solvers = rig.legs.map((l, i) => createWorkspace(chainWithOverrides(l.chain, setup, l.name), solverOptionsOf(legSolvers[i])));

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
  // The walk ends when the body reaches lastBodyZ, or at the duration asked for: slowing on steep ground takes longer.
  const totalFrames = Math.floor(options.duration / dt + 1e-9);
  const recordRate = Math.min(options.recordRate, 1 / dt);
  const capacity = Math.floor(totalFrames * dt * recordRate + 1e-9) + 2;
  const cycleFrames = Math.ceil(gait.cycleTime / dt) + Math.ceil(TOUCHDOWN_WINDOW_SECONDS / dt) + 4;

  const target = new Float64Array(3 * L);
  const kneeStraight = new Float64Array(2 * L);
  const targetNormal = new Float64Array(3 * L);
  const t: Trial = {
    rig,
    setup,
    course,
    options,
    gait,
    legs: L,
    solvers,
    started: false,
    walkHeight: neutralWalkHeight(rig, gait),
    heightCap: Infinity,
    soleHalf: Float64Array.from(rig.legs, (l) => soleHalfLength(l.chain)),
    maxJointStep: Float64Array.from(legSolvers, (s) => (s.maxJointSpeed / DEG) * options.timeStep),
    limitedPose: solvers.map((s) => new Float64Array(s.nDof)),
    // Back to rest over about one swing.
    recoverRate: Math.min(1, dt / ((1 - gait.dutyFactor) * gait.cycleTime)),
    kneeStraight,
    kneeDof: Int32Array.from(rig.legs, (l, i) => {
      const ws = solvers[i];
      setRootTransform(ws, ORIGIN, IDENTITY_QUAT);
      resetPose(ws);
      const d = findStraightKnee(ws, l.chain.knee, kneeScratch);
      kneeStraight[2 * i] = kneeScratch[0];
      kneeStraight[2 * i + 1] = kneeScratch[1];
      return d;
    }),
    foldLimit: Float64Array.from(rig.legs, (l, i) => {
      const ws = solvers[i];
      setRootTransform(ws, ORIGIN, IDENTITY_QUAT);
      resetPose(ws);
      const up = legSolvers[i].footOrientation ? UP : null;
      return measureFoldLimit(ws, l.chain.reach, (target) => solve(ws, target, up, { maxIterations: SETTLE_ITERATIONS }).positionError);
    }),
    // CCD turns one joint at a time toward the sole's position only: it has no orientation rows (the form says so).
    orient: Uint8Array.from(legSolvers, (s) => (s.footOrientation && s.method !== 'ccd' ? 1 : 0)),
    totalFrames,
    frame: 0,
    startZ,
    lastBodyZ,
    pace: createDampedState(1),
    paceFilter: createCriticalFilter(PACE_SETTLE_SECONDS, dt),
    phase: new Float64Array(L),
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
    olderPose: solvers.map((s) => new Float64Array(s.nDof)),
    extrapolate: Uint8Array.from(legSolvers, (s) => (s.warmStart === 'extrapolate' ? 1 : 0)),
    jointSpeed: new Float64Array(L),
    iterations: new Int32Array(L),
    error: new Float64Array(L),
    bodyPos: new Float64Array(3),
    bodyRot: new Float64Array([0, 0, 0, 1]),
    height: createDampedState(),
    pitch: createDampedState(),
    roll: createDampedState(),
    heightTarget: 0,
    filter: createCriticalFilter(setup.body.settleTime, dt),
    detector: new StumbleDetector(L, options.thresholds),
    touchdownWindows: rig.legs.map(() => new ResponseWindow(cycleFrames)),
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
    series: createSeries(L, capacity, recordRate),
  };

  // Feet as if the walk had been going on: each leg planted where its last touchdown put it.
  const { cycleTime: T, dutyFactor: beta } = gait;
  t.bodyPos[2] = startZ;
  for (let i = 0; i < L; i++) {
    const phase = legPhase(0, T, gait.phaseOffsets[i]);
    t.phase[i] = phase;
    const inStance = phase < beta;
    t.stance[i] = inStance ? 1 : 0;
    // The last touchdown happened `phase` cycles ago.
    touchdownPoint(t, i, -phase * T, landing, 0);
    plantAt(t, i, landing[0], landing[1], landing[2]);
    if (!inStance) startSwing(t, i, (1 - phase) * T);
  }
  computeBodyTargets(t, true);
  t.heightTarget = bodyTargets[0];
  computeBodyTargets(t);
  t.height.value = bodyTargets[0];
  t.pitch.value = bodyTargets[1];
  t.roll.value = bodyTargets[2];
  t.bodyPos[1] = t.height.value;
  updateBodyRotation(t);
  placeHips(t);
  updateTargets(t);
  for (let i = 0; i < L; i++) {
    // From rest with the knee already bent to the target's distance: a straight start can settle straight.
    resetPose(solvers[i]);
    preshapeKnee(t, i, t.targetOf[i]);
    const r = solve(solvers[i], t.targetOf[i], t.orient[i] ? t.targetNormalOf[i] : null, {
      maxIterations: SETTLE_ITERATIONS,
    });
    t.prevPose[i].set(r.pose);
    t.olderPose[i].set(r.pose);
  }
  observe(t, 0, false);
  t.started = true;
  return t;
}

/** Half the sole's length: from the toe when the chain has one, else from the reach (common practice, no source). */
function soleHalfLength(chain: LegChain): number {
  const toe = chain.toe?.offset;
  const fromToe = toe ? 0.7 * Math.hypot(toe[0] - chain.sole[0], toe[1] - chain.sole[1], toe[2] - chain.sole[2]) : 0.06 * chain.reach;
  return Math.min(0.1, Math.max(0.03, fromToe));
}

/** Share of the walk done, 0..1: the further of time and distance, since a walk ends at the course's end or its duration. */
export function trialProgress(t: Trial): number {
  const byTime = t.frame / t.totalFrames;
  const byDistance = (t.bodyPos[2] - t.startZ) / (t.lastBodyZ - t.startZ);
  const p = byTime > byDistance ? byTime : byDistance;
  return p < 0 ? 0 : p > 1 ? 1 : p;
}

/** Advance one frame; returns false once the trial is over. */
export function stepTrial(t: Trial): boolean {
  if (t.frame >= t.totalFrames || t.bodyPos[2] >= t.lastBodyZ) return false;
  t.frame++;
  const dt = t.options.timeStep;
  const time = t.frame * dt;
  const { cycleTime: T, dutyFactor: beta } = t.gait;

  // Gait clock: touchdowns lock the feet, liftoffs plan the swings.
  let supportChanged = false;
  writeLegPhases(time, T, t.gait.phaseOffsets, t.phase);
  for (let i = 0; i < t.legs; i++) {
    const phase = t.phase[i];
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
      // A new foothold moves the body's target as much as a touchdown does: the body looks ahead.
      supportChanged = true;
    }
  }

  // Body: forward at the gait speed, height and attitude through the filter.
  stepCritical(t.pace, terrainPace(t), t.paceFilter);
  t.bodyPos[2] += t.gait.speed * t.pace.value * dt;
  // A body step-up is measured from the footholds that ask for it: when a new one is chosen, the height the
  // body will settle at once every swinging foot has landed is the step the response is measured against.
  if (supportChanged) {
    computeBodyTargets(t, true);
    const rise = bodyTargets[0] - t.heightTarget;
    if (Math.abs(rise) >= BODY_STEP_UP_MIN) {
      if (t.bodyWindow.open) t.bodySummary.fold(t.bodyWindow);
      if (rise > 0) t.bodyWindow.start(t.height.value, bodyTargets[0], time, time + BODY_WINDOW_SECONDS);
    }
    t.heightTarget = bodyTargets[0];
  }
  computeBodyTargets(t);
  // Smaller target changes inside a window move where the response should settle.
  if (t.bodyWindow.open) t.bodyWindow.final = bodyTargets[0];
  followBodyTargets(t);
  updateBodyRotation(t);
  placeHips(t);
  updateTargets(t);

  // Touchdown windows open where the swing starts its descent.
  for (let i = 0; i < t.legs; i++) {
    if (t.stance[i]) continue;
    const w = t.touchdownWindows[i];
    if (w.open) continue;
    const phase = t.phase[i];
    const tau = (phase - beta) / (1 - beta);
    const sw = t.swings[i];
    if (tau >= descentStart(sw)) {
      const landTime = time + (1 - phase) * T;
      w.start(t.solvers[i].foot[1], sw.y1, landTime, landTime + TOUCHDOWN_WINDOW_SECONDS);
    }
  }

  // Solve every leg, warm-started from its last pose (or that pose carried on at its last rate of change).
  for (let i = 0; i < t.legs; i++) {
    const ws = t.solvers[i];
    const prev = t.prevPose[i];
    if (t.extrapolate[i]) {
      // Ball joints and joints that would be carried into a limit keep their pose: a knee pressed
      // straight can lock on the wrong side. Everything written stays inside its limits, so the
      // pose is set directly (ball quaternions are untouched).
      const older = t.olderPose[i];
      const pose = ws.pose;
      for (let d = 0; d < ws.nDof; d++) {
        if (ws.dKind[d] === DOF_BALL) continue;
        const g = prev[d] + EXTRAPOLATION_GAIN * (prev[d] - older[d]);
        if (g > ws.lo[d] && g < ws.hi[d]) pose[d] = g;
      }
      older.set(prev);
    }
    const normal = aimLeg(t, i, aim, aimNormal);
    preshapeKnee(t, i, aim);
    const r = solve(ws, aim, normal);
    t.iterations[i] = r.iterations;
    t.error[i] = r.positionError;
    t.solves++;
    t.iterationSum += r.iterations;
    t.solverError[0] += r.positionError;
    if (r.positionError > t.solverError[1]) t.solverError[1] = r.positionError;
    if (!r.converged) t.unconverged++;
    limitLegMotion(t, i, aim);
    let fastest = 0;
    for (let d = 0; d < ws.nDof; d++) {
      if (ws.dKind[d] === DOF_SLIDE) continue;
      const change = Math.abs(ws.pose[d] - prev[d]);
      if (change > fastest) fastest = change;
    }
    prev.set(ws.pose);
    t.jointSpeed[i] = (fastest / dt) * DEG;
  }
  observe(t, time, true);
  return t.frame < t.totalFrames && t.bodyPos[2] < t.lastBodyZ;
}

/** Walk `rig` over `course` with `setup`; deterministic: the same inputs give bit-identical results. */
export function runTrial(rig: Rig, setup: unknown, course: Heightfield, options: TrialOptionsInput = {}): TrialResult {
  const t = createTrial(rig, setup, course, options);
  while (stepTrial(t));
  return finishTrial(t);
}

