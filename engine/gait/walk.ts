/**
 * The walk: a rig crossing ground at a fixed time step, with nothing recorded.
 *
 * Each step: the body moves (along its path, after a desired velocity and turn
 * rate, or to where the game put it); the gait clock advances at the cadence
 * the speed asks for (walk-speed.ts); touchdowns lock the feet, liftoffs plan
 * the swings (foot-planner.ts); the body's height, pitch and roll follow the
 * planted feet through a critically damped filter (body-pose.ts); every leg is
 * solved toward its target with its chosen solver, warm-started from the last
 * frame's pose (by default carried on at part of its last rate of change).
 * Deterministic: no clocks, no randomness; nothing is allocated per step.
 *
 * A trial is a walk plus a recorder (trial.ts); the game runtime (engine/profile)
 * runs a walk alone.
 */
import type { Ground } from '../course/ground';
import type { PathTrack } from '../course/walk-path';
import * as walkPath from '../course/walk-path';
import * as ik from '../ik';
import * as ikLayout from '../ik/layout';
import type { LegChain } from '../rig/types';
import * as bodyFilter from './body-filter';
import * as bodyPose from './body-pose';
import * as footPlanner from './foot-planner';
import { resolveGait } from './gait-params';
import { checkLegSetupForRig, legSolverSettings, parseLegSetup, solverOptionsOf, type LegSetup } from './leg-setup';
import * as legMotion from './leg-motion';
import * as paceRules from './pace';
import { measureFoldLimit } from './reach';
import { checkRig, type Rig } from './rig';
import * as swingPath from './swing-path';
import * as timing from './timing';
import * as trialOptions from './trial-options';
import { neutralWalkHeight } from './walk-height';
import * as walkSpeed from './walk-speed';
import * as walkState from './walk-state';
import type { Walk } from './walk-state';

export * from './walk-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { solve, createWorkspace, setRootTransform, resetPose } = ik;
const { DOF_BALL, DOF_SLIDE } = ikLayout;
const { createDampedState, createCriticalFilter, stepCritical } = bodyFilter;
const { createSwingPlan } = swingPath;
const { legPhase, wrap01 } = timing;
const { trackPoint } = walkPath;
const { bodyTargets, computeBodyTargets, followBodyTargets, placeHips, updateBodyRotation } = bodyPose;
const { plantAt, restsWhereItStands, startSwing, touchdownPoint, updateTargets } = footPlanner;
const { aimLeg, findStraightKnee, kneeNearStraight, limitLegMotion, preshapeKnee } = legMotion;
const { PACE_SETTLE_SECONDS, terrainPace } = paceRules;
const { DEG, EXTRAPOLATION_GAIN, SETTLE_ITERATIONS } = trialOptions;
const { cycleTimeForMotion, cycleTimeForSpeed, STOP_SHARE, strideForSpeed, topTurnRate, topWalkSpeed } = walkSpeed;
const { DRIVE_PATH, DRIVE_POSE, DRIVE_VELOCITY } = walkState;

const ORIGIN = new Float64Array(3);
const IDENTITY_QUAT = new Float64Array([0, 0, 0, 1]);
const UP = new Float64Array([0, 1, 0]);
const kneeScratch = new Float64Array(2);
const landing = new Float64Array(3);
const aim = new Float64Array(3);
const aimNormal = new Float64Array(3);
const onTrack = new Float64Array(3);
/** A resting leg shows this share of its stance to the sole's orientation (flat on the ground). */
const REST_PHASE_SHARE = 0.4;

export interface WalkOptions {
  timeStep: number;
  /** A swing starts from where the foot really is when it is this far off its plant, m. */
  replanDistance: number;
  /** How the body moves to begin with (walk-state.ts); default: along the path. */
  mode?: number;
  /** Path mode: the path (null: straight ahead along the start heading) and the speed along it (null: the gait's). */
  track?: PathTrack | null;
  pathSpeed?: number | null;
  /** Where the body starts: s along the track; or (x, z) facing `heading` without one. */
  startS?: number;
  startX?: number;
  startZ?: number;
  heading?: number;
  /** Velocity and pose modes: start standing (true) or walking at the path speed (false, the default). */
  standing?: boolean;
}

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

/** Half the sole's length: from the toe when the chain has one, else from the reach (common practice, no source). */
function soleHalfLength(chain: LegChain): number {
  const toe = chain.toe?.offset;
  const fromToe = toe ? 0.7 * Math.hypot(toe[0] - chain.sole[0], toe[1] - chain.sole[1], toe[2] - chain.sole[2]) : 0.06 * chain.reach;
  return Math.min(0.1, Math.max(0.03, fromToe));
}

/** Set up a walk with its feet placed as if it had been going on; the setup is validated and bad input throws naming the problem. */
export function createWalk(rig: Rig, setupInput: unknown, ground: Ground, options: WalkOptions): Walk {
  checkRig(rig);
  const setup = parseLegSetup(setupInput);
  checkLegSetupForRig(setup, rig);
  const gait = resolveGait(setup.gait, rig);
  const L = rig.legs.length;
  const legSolvers = rig.legs.map((l) => legSolverSettings(setup, l.name));
  const solvers = rig.legs.map((l, i) => createWorkspace(chainWithOverrides(l.chain, setup, l.name), solverOptionsOf(legSolvers[i])));
  const dt = options.timeStep;
  const track = options.track ?? null;
  const pathSpeed = options.pathSpeed ?? gait.speed;
  const heading0 = options.heading ?? 0;
  const mode = options.mode ?? DRIVE_PATH;
  const standing = mode !== DRIVE_PATH && options.standing === true;
  const footSpeed0 = standing ? 0 : pathSpeed;
  const cycleTime = cycleTimeForSpeed(gait, footSpeed0);

  const target = new Float64Array(3 * L);
  const kneeStraight = new Float64Array(2 * L);
  const targetNormal = new Float64Array(3 * L);
  const w: Walk = {
    rig,
    setup,
    ground,
    gait,
    legs: L,
    solvers,
    timeStep: dt,
    replanDistance: options.replanDistance,
    started: false,
    walkHeight: neutralWalkHeight(rig, gait),
    heightCap: Infinity,
    soleHalf: Float64Array.from(rig.legs, (l) => soleHalfLength(l.chain)),
    maxJointStep: Float64Array.from(legSolvers, (s) => (s.maxJointSpeed / DEG) * dt),
    limitedPose: solvers.map((s) => new Float64Array(s.nDof)),
    // Back to rest over about one swing.
    recoverRate: Math.min(1, dt / ((1 - gait.dutyFactor) * gait.cycleTime)),
    kneeStraight,
    kneeShaping: new Uint8Array(L),
    ankleFoot: Uint8Array.from(rig.legs, (l) => {
      const j = l.chain.joints;
      const last = j[j.length - 1];
      return l.chain.knee === j.length - 2 && (last.kind === 'universal' || last.kind === 'ball') ? 1 : 0;
    }),
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
    turnRadius: rig.legs.reduce((r, l) => Math.max(r, Math.hypot(l.neutralFoot[0], l.neutralFoot[1])), 0),
    // CCD turns one joint at a time toward the sole's position only: it has no orientation rows (the form says so).
    orient: Uint8Array.from(legSolvers, (s) => (s.footOrientation && s.method !== 'ccd' ? 1 : 0)),
    frame: 0,
    pace: createDampedState(1),
    paceFilter: createCriticalFilter(PACE_SETTLE_SECONDS, dt),
    cycleTime,
    stride: strideForSpeed(gait, footSpeed0, cycleTime),
    clockCycles: 0,
    clockFrame: 0,
    stopping: standing,
    phase: new Float64Array(L),
    stance: new Uint8Array(L),
    resting: new Uint8Array(L),
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
    solveError: new Float64Array(L),
    converged: new Uint8Array(L),
    bodyPos: new Float64Array(3),
    bodyRot: new Float64Array([0, 0, 0, 1]),
    heading: heading0,
    height: createDampedState(),
    pitch: createDampedState(),
    roll: createDampedState(),
    heightTarget: 0,
    heightGoal: 0,
    supportChanged: false,
    filter: createCriticalFilter(setup.body.settleTime, dt),
    motion: {
      mode,
      track,
      s: options.startS ?? 0,
      pathSpeed,
      vx: 0,
      vz: 0,
      turnRate: 0,
      wantVx: 0,
      wantVz: 0,
      wantTurn: 0,
      poseX: 0,
      poseZ: 0,
      poseHeading: heading0,
    },
  };
  const m = w.motion;
  if (track) {
    trackPoint(track, m.s, onTrack);
    w.bodyPos[0] = onTrack[0];
    w.bodyPos[2] = onTrack[1];
    w.heading = onTrack[2];
    m.vx = Math.sin(w.heading) * pathSpeed;
    m.vz = Math.cos(w.heading) * pathSpeed;
    m.turnRate = trackTurnRate(w, track, m.s);
  } else {
    w.bodyPos[0] = options.startX ?? 0;
    w.bodyPos[2] = options.startZ ?? m.s;
    m.s = w.bodyPos[2];
    if (!standing) {
      m.vx = Math.sin(heading0) * pathSpeed;
      m.vz = Math.cos(heading0) * pathSpeed;
    }
  }
  m.poseX = w.bodyPos[0];
  m.poseZ = w.bodyPos[2];
  m.wantVx = m.vx;
  m.wantVz = m.vz;
  m.wantTurn = m.turnRate;

  // The body faces its heading before any hip is placed from it.
  updateBodyRotation(w);
  // The walk starts at the pace the ground ahead asks for (no foot is planted yet, so only the ground counts):
  // started at the foot of a stair run at the full pace, the first swings were planned a whole stride long and
  // climbed every riser at once, toes into a nosing, before the pace filter had slowed the body.
  w.pace.value = terrainPace(w);
  // Feet as if the walk had been going on: each leg planted where its last touchdown put it.
  const T = w.cycleTime;
  const beta = gait.dutyFactor;
  for (let i = 0; i < L; i++) {
    if (standing) {
      // Standing: every foot planted at rest under its hip.
      w.phase[i] = REST_PHASE_SHARE * beta;
      w.stance[i] = 1;
      w.resting[i] = 1;
      touchdownPoint(w, i, 0, landing, 0);
      plantAt(w, i, landing[0], landing[1], landing[2]);
      continue;
    }
    const phase = legPhase(0, T, gait.phaseOffsets[i]);
    w.phase[i] = phase;
    const inStance = phase < beta;
    w.stance[i] = inStance ? 1 : 0;
    // The last touchdown happened `phase` cycles ago.
    touchdownPoint(w, i, -phase * T, landing, 0);
    plantAt(w, i, landing[0], landing[1], landing[2]);
    if (!inStance) startSwing(w, i, (1 - phase) * T);
  }
  computeBodyTargets(w, true);
  w.heightTarget = bodyTargets[0];
  computeBodyTargets(w);
  w.heightGoal = bodyTargets[0];
  w.height.value = bodyTargets[0];
  w.pitch.value = bodyTargets[1];
  w.roll.value = bodyTargets[2];
  w.bodyPos[1] = w.height.value;
  updateBodyRotation(w);
  placeHips(w);
  updateTargets(w);
  for (let i = 0; i < L; i++) {
    // From rest with the knee already bent to the target's distance: a straight start can settle straight.
    resetPose(solvers[i]);
    preshapeKnee(w, i, w.targetOf[i]);
    let r = solve(solvers[i], w.targetOf[i], w.orient[i] ? w.targetNormalOf[i] : null, {
      maxIterations: SETTLE_ITERATIONS,
    });
    if (kneeNearStraight(w, i)) {
      // Settled straight (the ankle took the fold at its limit, a pose the first swing snaps out of): bend the
      // knee from rest to the target's distance, however far the rest knee is from straight, and settle again.
      resetPose(solvers[i]);
      preshapeKnee(w, i, w.targetOf[i], true);
      r = solve(solvers[i], w.targetOf[i], w.orient[i] ? w.targetNormalOf[i] : null, { maxIterations: SETTLE_ITERATIONS });
    }
    w.prevPose[i].set(r.pose);
    w.olderPose[i].set(r.pose);
    const f = solvers[i].foot;
    w.foot[3 * i] = f[0];
    w.foot[3 * i + 1] = f[1];
    w.foot[3 * i + 2] = f[2];
  }
  w.started = true;
  return w;
}

/** Turn rate of the path at s, rad/s: the change of heading over a centimetre, at the path speed. */
function trackTurnRate(w: Walk, track: PathTrack, s: number): number {
  const ds = 0.01;
  trackPoint(track, s + ds, onTrack);
  const ahead = onTrack[2];
  trackPoint(track, s, onTrack);
  let d = ahead - onTrack[2];
  d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
  return (d / ds) * w.motion.pathSpeed;
}

/** Velocity mode: ask for a planar velocity (world axes, m/s) and a turn rate (rad/s); followed within the limits. */
export function driveWalk(w: Walk, vx: number, vz: number, turnRate: number): void {
  const m = w.motion;
  if (m.mode !== DRIVE_VELOCITY) {
    m.mode = DRIVE_VELOCITY;
    w.pace.value = w.pace.value > 0 ? w.pace.value : 1;
  }
  m.wantVx = Number.isFinite(vx) ? vx : 0;
  m.wantVz = Number.isFinite(vz) ? vz : 0;
  m.wantTurn = Number.isFinite(turnRate) ? turnRate : 0;
}

/** Pose mode: the body is at (x, z) facing `heading` at the end of the coming step, moving at (vx, vz) and turning at turnRate. */
export function poseWalk(w: Walk, x: number, z: number, heading: number, vx: number, vz: number, turnRate: number): void {
  const m = w.motion;
  m.mode = DRIVE_POSE;
  m.poseX = x;
  m.poseZ = z;
  m.poseHeading = heading;
  m.vx = vx;
  m.vz = vz;
  m.turnRate = turnRate;
  w.pace.value = 1;
  w.pace.velocity = 0;
}

const { sin, cos, sqrt, abs } = Math;

/** Move the body one step by its drive. */
function moveBody(w: Walk, dt: number): void {
  const m = w.motion;
  if (m.mode === DRIVE_POSE) {
    w.bodyPos[0] = m.poseX;
    w.bodyPos[2] = m.poseZ;
    w.heading = m.poseHeading;
    return;
  }
  // Body: forward at its speed, slowed by the ground ahead (pace.ts).
  stepCritical(w.pace, terrainPace(w), w.paceFilter);
  if (m.mode === DRIVE_PATH && m.track) {
    m.s += m.pathSpeed * w.pace.value * dt;
    m.turnRate = trackTurnRate(w, m.track, m.s);
    trackPoint(m.track, m.s, onTrack);
    w.bodyPos[0] = onTrack[0];
    w.bodyPos[2] = onTrack[1];
    w.heading = onTrack[2];
    m.vx = sin(w.heading) * m.pathSpeed;
    m.vz = cos(w.heading) * m.pathSpeed;
    return;
  }
  if (m.mode === DRIVE_VELOCITY) followCommand(w, dt);
  w.bodyPos[0] += m.vx * w.pace.value * dt;
  w.bodyPos[2] += m.vz * w.pace.value * dt;
  if (m.turnRate !== 0) w.heading += m.turnRate * dt;
  m.s = w.bodyPos[2];
}

/**
 * Cycles over which the body may go from standing to its top speed, and to its top turn rate (common practice,
 * no source; a game's turn should answer within a step: over four cycles a driven biped went on turning 33°
 * after the turn was let go).
 */
const SPEED_RAMP_CYCLES = 2;
const TURN_RAMP_CYCLES = 1;
const BRAKE_SHARE = 2;

/** Velocity mode: the velocity and turn rate move toward the command, within the top speed, ramping over a few cycles. */
function followCommand(w: Walk, dt: number): void {
  const m = w.motion;
  const g = w.gait;
  const vTop = topWalkSpeed(g, w.rig.hipHeight);
  const wTop = topTurnRate(g, w.rig.hipHeight, w.turnRadius);
  let wx = m.wantVx;
  let wz = m.wantVz;
  let wt = m.wantTurn;
  // The fastest foot (|v| + |ω|·r) stays within the top speed: both are scaled down together.
  const foot = sqrt(wx * wx + wz * wz) + abs(wt) * w.turnRadius;
  if (foot > vTop) {
    const k = vTop / foot;
    wx *= k;
    wz *= k;
    wt *= k;
  }
  if (wt > wTop) wt = wTop;
  else if (wt < -wTop) wt = -wTop;
  // Slowing down is allowed twice as fast as speeding up.
  const braking = wx * wx + wz * wz < m.vx * m.vx + m.vz * m.vz ? BRAKE_SHARE : 1;
  const dvMax = ((braking * vTop) / (SPEED_RAMP_CYCLES * g.cycleTime)) * dt;
  const dx = wx - m.vx;
  const dz = wz - m.vz;
  const dv = sqrt(dx * dx + dz * dz);
  if (dv > dvMax) {
    m.vx += (dx * dvMax) / dv;
    m.vz += (dz * dvMax) / dv;
  } else {
    m.vx = wx;
    m.vz = wz;
  }
  const dwMax = (((abs(wt) < abs(m.turnRate) ? BRAKE_SHARE : 1) * wTop) / (TURN_RAMP_CYCLES * g.cycleTime)) * dt;
  const dw = wt - m.turnRate;
  m.turnRate = dw > dwMax ? m.turnRate + dwMax : dw < -dwMax ? m.turnRate - dwMax : wt;
}

/** How fast the fastest foot moves relative to the body, m/s (path mode: the path speed, as the gait was set for). */
function footSpeed(w: Walk): number {
  const m = w.motion;
  if (m.mode === DRIVE_PATH) return m.track ? m.pathSpeed + abs(m.turnRate) * w.turnRadius : m.pathSpeed;
  return sqrt(m.vx * m.vx + m.vz * m.vz) + abs(m.turnRate) * w.turnRadius;
}

/** The cadence follows the speed: a new cycle time restarts the clock's count from this frame, so phases stay continuous. */
function followCadence(w: Walk): void {
  const v = footSpeed(w);
  w.stopping = w.motion.mode !== DRIVE_PATH && v < STOP_SHARE * w.gait.speed;
  // A stopping walk steps at the setup's own cadence, so every foot is home within about a cycle.
  const T = w.stopping ? w.gait.cycleTime : cycleTimeForMotion(w.gait, v, w.motion.turnRate);
  w.stride = strideForSpeed(w.gait, v, T);
  if (T === w.cycleTime) return;
  w.clockCycles += ((w.frame - w.clockFrame) * w.timeStep) / w.cycleTime;
  w.clockFrame = w.frame;
  w.cycleTime = T;
}

/** Advance the walk one fixed step up to the leg solves (solveLegs): a recorder may look in between. */
export function stepWalk(w: Walk): void {
  w.frame++;
  const dt = w.timeStep;
  const time = w.frame * dt;
  const beta = w.gait.dutyFactor;
  const offsets = w.gait.phaseOffsets;

  // The cadence of the speed the body had: the feet are planned before the body moves on.
  followCadence(w);
  const T = w.cycleTime;

  // Setting off from a full rest, the clock restarts just before a liftoff with every other leg planted.
  if (!w.stopping && walkResting(w)) {
    w.clockCycles = restartCycle(w);
    w.clockFrame = w.frame;
  }
  // Gait clock: touchdowns lock the feet, liftoffs plan the swings.
  let supportChanged = false;
  const cycles = w.clockCycles + ((w.frame - w.clockFrame) * dt) / T;
  for (let i = 0; i < w.legs; i++) {
    const phase = wrap01(cycles - offsets[i]);
    if (w.resting[i]) {
      // A resting foot stays planted until the clock next has it in stance with the walk going on.
      if (w.stopping || phase >= beta) {
        w.phase[i] = REST_PHASE_SHARE * beta;
        continue;
      }
      w.resting[i] = 0;
    }
    w.phase[i] = phase;
    const nowStance = phase < beta ? 1 : 0;
    // Stopping, a planted foot already where a step would put it stays there.
    if (w.stopping && w.stance[i] && restsWhereItStands(w, i, time)) {
      w.resting[i] = 1;
      w.phase[i] = REST_PHASE_SHARE * beta;
      continue;
    }
    if (nowStance === w.stance[i]) continue;
    if (!nowStance && w.stopping && restsWhereItStands(w, i, time + (1 - phase) * T)) {
      w.resting[i] = 1;
      w.phase[i] = REST_PHASE_SHARE * beta;
      continue;
    }
    w.stance[i] = nowStance;
    const sw = w.swings[i];
    if (nowStance) {
      plantAt(w, i, sw.x1, sw.y1, sw.z1);
      supportChanged = true;
    } else {
      startSwing(w, i, time + (1 - phase) * T);
      // A new foothold moves the body's target as much as a touchdown does: the body looks ahead.
      supportChanged = true;
    }
  }

  moveBody(w, dt);
  // Body height and attitude through the filter. A new foothold sets the height the body will settle at once
  // every swinging foot has landed (what a body step-up is measured against).
  w.supportChanged = supportChanged;
  if (supportChanged) {
    computeBodyTargets(w, true);
    w.heightTarget = bodyTargets[0];
  }
  computeBodyTargets(w);
  w.heightGoal = bodyTargets[0];
  followBodyTargets(w);
  updateBodyRotation(w);
  placeHips(w);
  updateTargets(w);
}

/** Solve every leg toward its target, warm-started from its last pose (or that pose carried on at its last rate of change). */
export function solveLegs(w: Walk): void {
  const dt = w.timeStep;
  for (let i = 0; i < w.legs; i++) {
    const ws = w.solvers[i];
    const prev = w.prevPose[i];
    if (w.extrapolate[i]) {
      // Ball joints and joints that would be carried into a limit keep their pose: a knee pressed
      // straight can lock on the wrong side. Everything written stays inside its limits, so the
      // pose is set directly (ball quaternions are untouched).
      const older = w.olderPose[i];
      const pose = ws.pose;
      for (let d = 0; d < ws.nDof; d++) {
        if (ws.dKind[d] === DOF_BALL) continue;
        const g = prev[d] + EXTRAPOLATION_GAIN * (prev[d] - older[d]);
        if (g > ws.lo[d] && g < ws.hi[d]) pose[d] = g;
      }
      older.set(prev);
    }
    const normal = aimLeg(w, i, aim, aimNormal);
    // A swing that met a straight knee keeps it shaped for the rest of the swing: left to the solver once
    // it had bent a little, the knee went back toward straight while the preshape bent it again, each
    // frame in turn, and the joint speed limit held the foot between the two (10–17 cm off its target).
    // A leg ending in a knee and an ankle is shaped from liftoff: otherwise a trailing straight leg lifted
    // its sole with the ankle alone until the ankle met its limit, then had to bend the knee all at once.
    if (w.stance[i]) w.kneeShaping[i] = 0;
    else if (w.ankleFoot[i] || kneeNearStraight(w, i)) w.kneeShaping[i] = 1;
    preshapeKnee(w, i, aim, w.kneeShaping[i] === 1);
    const r = solve(ws, aim, normal);
    w.iterations[i] = r.iterations;
    w.error[i] = r.positionError;
    w.solveError[i] = r.positionError;
    w.converged[i] = r.converged ? 1 : 0;
    limitLegMotion(w, i, aim);
    let fastest = 0;
    for (let d = 0; d < ws.nDof; d++) {
      if (ws.dKind[d] === DOF_SLIDE) continue;
      const change = Math.abs(ws.pose[d] - prev[d]);
      if (change > fastest) fastest = change;
    }
    prev.set(ws.pose);
    w.jointSpeed[i] = (fastest / dt) * DEG;
    const f = ws.foot;
    w.foot[3 * i] = f[0];
    w.foot[3 * i + 1] = f[1];
    w.foot[3 * i + 2] = f[2];
  }
}

/** Where in the cycle to set off from rest: the point where the legs wait least for their touchdown and the first liftoff comes soonest. */
function restartCycle(w: Walk): number {
  const beta = w.gait.dutyFactor;
  const offsets = w.gait.phaseOffsets;
  let best = 0;
  let bestCost = Infinity;
  for (let k = 0; k < RESTART_SAMPLES; k++) {
    const c = k / RESTART_SAMPLES;
    let wait = 0;
    let firstLift = 1;
    for (let i = 0; i < w.legs; i++) {
      const p = wrap01(c - offsets[i]);
      if (p >= beta) wait += 1 - p;
      else if (beta - p < firstLift) firstLift = beta - p;
    }
    const cost = wait + firstLift;
    if (cost < bestCost) {
      bestCost = cost;
      best = c;
    }
  }
  return best;
}
const RESTART_SAMPLES = 200;

/** One whole step of a walk alone: the body, the clock and the feet, then the legs solved. */
export function advanceWalk(w: Walk): void {
  stepWalk(w);
  solveLegs(w);
}

/** Every foot planted at rest (a walk that was told to stop has stopped). */
export function walkResting(w: Walk): boolean {
  for (let i = 0; i < w.legs; i++) if (!w.resting[i]) return false;
  return true;
}
