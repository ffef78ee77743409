/**
 * The runtime's clock, drive and outputs over a walk (engine/gait/walk.ts), with no trial recorder.
 *
 * - Frame time: `update(dt)` takes any frame time and runs whole fixed steps so that the walk is at most one
 *   step ahead of the game's clock; drawing blends the two steps around the game's time ("Fix Your
 *   Timestep!", Fiedler 2004). A long pause (more than MAX_CATCH_UP_SECONDS) is dropped, not raced through.
 * - Drive: velocity and turn rate (followed within the walk's limits, walk-speed.ts), or the body's pose
 *   from the game, interpolated between the game's frames to each fixed step (extrapolated at its last
 *   velocity for the step ahead).
 * - Ground failures: each step starts from a snapshot; a step whose ground query throws (or that yields a
 *   non-finite number) is undone, the error is reported once (until a step succeeds again), and the last
 *   good pose is held.
 */
import { mat4, quat } from 'gl-matrix';
import * as groundQueries from '../course/ground';
import type { Ground } from '../course/ground';
import type { Heightfield } from '../course/heightfield';
import { courseLength } from '../course/heightfield';
import { resolveGait } from '../gait/gait-params';
import { parseLegSetup } from '../gait/leg-setup';
import type { Rig } from '../gait/rig';
import { END_MARGIN } from '../gait/trial-options';
import { advanceWalk, createWalk, driveWalk, DRIVE_POSE, DRIVE_VELOCITY, poseWalk, walkResting, type Walk } from '../gait/walk';
import { createWalkSnapshot, restoreWalk, saveWalk } from '../gait/walk-snapshot';
import * as quatMath from '../math/quat';
import { StumbleDetector } from '../metrics/stumble-detector';
import { DEFAULT_STUMBLE_THRESHOLDS } from '../metrics/stumble-thresholds';
import type { GroundQuery, LegRuntime, LegRuntimeError, LegRuntimeOptions } from './runtime';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { heightfieldGround, isGround, queryGround, GroundQueryError } = groundQueries;
const { fromMat3: quatFromMat3 } = quatMath;

/** Longest stretch of game time one update catches up, s. */
export const MAX_CATCH_UP_SECONDS = 0.25;

/** The runtime's state and controls (documented on LegRuntime) over its walk; outputs take their `out` array. */
export interface DrivenWalk
  extends Pick<
    LegRuntime,
    'timeStep' | 'frame' | 'time' | 'alpha' | 'speed' | 'turnRate' | 'cycleTime' | 'resting' | 'lastError' | 'drive' | 'follow' | 'update' | 'step' | 'inStance'
  > {
  readonly walk: Walk;
  footPosition(leg: number, out: Float64Array): Float64Array;
  footTarget(leg: number, out: Float64Array): Float64Array;
  jointWorldMatrix(leg: number, k: number, out: Float64Array): Float64Array;
  bodyPosition(out: Float64Array): Float64Array;
  bodyRotation(out: Float64Array): Float64Array;
  stumbleCounts(out: Int32Array): Int32Array;
}

/** Pose of everything drawn, at one fixed step. */
interface Frame {
  foot: Float64Array;
  target: Float64Array;
  /** Per moving joint of every leg: position (3) and rotation (4). */
  jointPos: Float64Array;
  jointRot: Float64Array;
  bodyPos: Float64Array;
  bodyRot: Float64Array;
}

const qa = new Float64Array(4);
const qb = new Float64Array(4);
const p3 = new Float64Array(3);

function groundOf(ground: Heightfield | Ground | GroundQuery, spacing: number | undefined): Ground {
  if (typeof ground === 'function') return queryGround(ground, spacing);
  return isGround(ground) ? ground : heightfieldGround(ground);
}

/** Where a trial of this heightfield starts the body, and where its straight walk ends (the ground runs out). */
function straightWalkSpan(rig: Rig, setupInput: unknown, hf: Heightfield): { startZ: number; lastZ: number } {
  const gait = resolveGait(parseLegSetup(setupInput).gait, rig);
  let reachAhead = 0;
  let reachBehind = 0;
  for (const l of rig.legs) {
    reachAhead = Math.max(reachAhead, l.neutralFoot[1], l.hip[2]);
    reachBehind = Math.max(reachBehind, -l.neutralFoot[1], -l.hip[2]);
  }
  return {
    startZ: reachBehind + gait.stride + 0.2,
    lastZ: courseLength(hf) - END_MARGIN - reachAhead - gait.stride * (1 + gait.dutyFactor / 2),
  };
}

export function createDrivenWalk(rig: Rig, setup: unknown, ground: Heightfield | Ground | GroundQuery, options: LegRuntimeOptions): DrivenWalk {
  const h = options.timeStep ?? 1 / 60;
  if (!(h >= 1 / 1000 && h <= 1 / 10)) throw new RangeError(`timeStep must be between 1/1000 and 1/10 s, got ${h}`);
  const g = groundOf(ground, options.groundSpacing);
  const hf = typeof ground !== 'function' && !isGround(ground) ? ground : null;
  const span = hf && !options.position ? straightWalkSpan(rig, setup, hf) : null;
  const walk = createWalk(rig, setup, g, {
    timeStep: h,
    replanDistance: DEFAULT_STUMBLE_THRESHOLDS.reachMissResidual,
    startX: options.position ? options.position[0] : 0,
    startZ: options.position ? options.position[1] : span ? span.startZ : 0,
    heading: options.heading ?? 0,
    ...(options.standing ? { mode: DRIVE_VELOCITY, standing: true } : {}),
  });
  // A walk the game never drives ends where a trial of the same ground would (the old runtime's behaviour).
  const lastZ = span ? span.lastZ : Infinity;
  const lastFrame = Math.floor((options.duration ?? 600) / h + 1e-9);
  const L = walk.legs;
  const jointCount = rig.legs.map((l) => l.chain.joints.length);
  const jointFirst = jointCount.map((_, i) => jointCount.slice(0, i).reduce((a, b) => a + b, 0));
  const J = jointCount.reduce((a, b) => a + b, 0);
  const makeFrame = (): Frame => ({
    foot: new Float64Array(3 * L),
    target: new Float64Array(3 * L),
    jointPos: new Float64Array(3 * J),
    jointRot: new Float64Array(4 * J),
    bodyPos: new Float64Array(3),
    bodyRot: new Float64Array(4),
  });
  let prev = makeFrame();
  let curr = makeFrame();
  const snapshot = createWalkSnapshot(walk);
  const detector = options.watchStumbles ? new StumbleDetector(L, DEFAULT_STUMBLE_THRESHOLDS) : null;
  const underFeet = new Float64Array(L);
  let lastError: LegRuntimeError | null = null;
  let failing = false;
  let driven = options.standing === true;
  let ended = false;
  /** Game time consumed; the walk's own time is frame × h, at most one step ahead of it. */
  let gameTime = 0;
  // The game's pose samples (follow): the two newest, with their game times, and one waiting for its update.
  const poseT = new Float64Array(2);
  const poseX = new Float64Array(2);
  const poseZ = new Float64Array(2);
  const poseH = new Float64Array(2);
  let poses = 0;
  let pending = false;
  let pendingX = 0;
  let pendingZ = 0;
  let pendingH = 0;

  const capture = (f: Frame) => {
    f.foot.set(walk.foot);
    f.target.set(walk.target);
    f.bodyPos.set(walk.bodyPos);
    f.bodyRot.set(walk.bodyRot);
    for (let i = 0; i < L; i++) {
      const ws = walk.solvers[i];
      for (let k = 0; k < jointCount[i]; k++) {
        const j = jointFirst[i] + k;
        // The joint's world position and rotation straight from the solver (gl-matrix's getRotation allocates).
        f.jointPos[3 * j] = ws.jPos[3 * k];
        f.jointPos[3 * j + 1] = ws.jPos[3 * k + 1];
        f.jointPos[3 * j + 2] = ws.jPos[3 * k + 2];
        quatFromMat3(f.jointRot, 4 * j, ws.jRot, 9 * k);
      }
    }
  };
  capture(curr);
  capture(prev);

  const report = (message: string, x: number, z: number) => {
    if (failing) return;
    failing = true;
    lastError = { kind: 'ground', message, x, z };
    if (options.onError) options.onError(lastError);
  };

  const finite = (): boolean => {
    for (let k = 0; k < 3 * L; k++) if (!Number.isFinite(walk.foot[k])) return false;
    for (let k = 0; k < 3; k++) if (!Number.isFinite(walk.bodyPos[k])) return false;
    for (let k = 0; k < 4; k++) if (!Number.isFinite(walk.bodyRot[k])) return false;
    return true;
  };

  /** The game's pose at walk time t: between its two newest samples, or carried on past the newest at their velocity. */
  const setPoseFor = (t: number) => {
    if (poses === 0) return;
    const n = poses === 1 ? 0 : 1;
    if (poses === 1 || poseT[1] <= poseT[0]) {
      poseWalk(walk, poseX[n], poseZ[n], poseH[n], 0, 0, 0);
      return;
    }
    const span = poseT[1] - poseT[0];
    const vx = (poseX[1] - poseX[0]) / span;
    const vz = (poseZ[1] - poseZ[0]) / span;
    const w = (poseH[1] - poseH[0]) / span;
    const u = t - poseT[1];
    poseWalk(walk, poseX[1] + vx * u, poseZ[1] + vz * u, poseH[1] + w * u, vx, vz, w);
  };

  /** One fixed step; false when it failed (undone) or the undriven walk is over. */
  const advance = (): boolean => {
    if (ended) return false;
    if (!driven && (walk.frame >= lastFrame || walk.bodyPos[2] >= lastZ)) {
      ended = true;
      return false;
    }
    if (walk.motion.mode === DRIVE_POSE) setPoseFor((walk.frame + 1) * h);
    saveWalk(walk, snapshot);
    try {
      advanceWalk(walk);
      if (detector) {
        for (let i = 0; i < L; i++) underFeet[i] = g.height(walk.foot[3 * i], walk.foot[3 * i + 2]);
      }
      if (!finite()) throw new GroundQueryError('the walk produced a value that is not a finite number; the last good pose is held', walk.bodyPos[0], walk.bodyPos[2]);
    } catch (err) {
      restoreWalk(walk, snapshot);
      if (!(err instanceof GroundQueryError)) throw err;
      report(err.message, err.x, err.z);
      // Hold the last good pose whatever the blend.
      prev.foot.set(curr.foot);
      prev.target.set(curr.target);
      prev.jointPos.set(curr.jointPos);
      prev.jointRot.set(curr.jointRot);
      prev.bodyPos.set(curr.bodyPos);
      prev.bodyRot.set(curr.bodyRot);
      return false;
    }
    failing = false;
    if (detector) detector.observe(walk.frame * h, walk.stance, walk.foot, walk.target, underFeet, walk.jointSpeed);
    const tmp = prev;
    prev = curr;
    curr = tmp;
    capture(curr);
    return true;
  };

  const alphaNow = () => {
    const behind = gameTime - (walk.frame - 1) * h;
    const a = behind / h;
    // A game clock summed from frame times lands on a step's time only to rounding: that is the step itself.
    return a < 0 ? 0 : a > 1 - 1e-9 ? 1 : a;
  };
  const lerp3 = (a: Float64Array, b: Float64Array, o: number, t: number, out: Float64Array) => {
    // At the ends the step's own numbers, not a blend that rounds them.
    if (t >= 1) for (let c = 0; c < 3; c++) out[c] = b[o + c];
    else for (let c = 0; c < 3; c++) out[c] = a[o + c] + (b[o + c] - a[o + c]) * t;
    return out;
  };

  return {
    walk,
    timeStep: h,
    get frame() {
      return walk.frame;
    },
    get time() {
      return gameTime;
    },
    get alpha() {
      return alphaNow();
    },
    get speed() {
      const m = walk.motion;
      return Math.sqrt(m.vx * m.vx + m.vz * m.vz) * walk.pace.value;
    },
    get turnRate() {
      return walk.motion.turnRate;
    },
    get cycleTime() {
      return walk.cycleTime;
    },
    get resting() {
      return walkResting(walk);
    },
    get lastError() {
      return lastError;
    },
    drive(vx: number, vz: number, turnRate: number) {
      driven = true;
      driveWalk(walk, vx, vz, turnRate);
    },
    follow(x: number, z: number, heading: number) {
      if (!(Number.isFinite(x) && Number.isFinite(z) && Number.isFinite(heading))) return;
      driven = true;
      pending = true;
      pendingX = x;
      pendingZ = z;
      pendingH = heading;
      if (poses === 0) {
        // The first pose places the body at once.
        poseT[0] = gameTime;
        poseX[0] = x;
        poseZ[0] = z;
        poseH[0] = heading;
        poses = 1;
        poseWalk(walk, x, z, heading, 0, 0, 0);
      }
    },
    update(dt: number) {
      if (!(dt >= 0) || !Number.isFinite(dt)) return;
      gameTime += dt;
      if (pending) {
        pending = false;
        if (poses === 2) {
          poseT[0] = poseT[1];
          poseX[0] = poseX[1];
          poseZ[0] = poseZ[1];
          poseH[0] = poseH[1];
        }
        const n = poses === 0 ? 0 : 1;
        poseT[n] = gameTime;
        poseX[n] = pendingX;
        // The heading is unwrapped against the previous sample so a turn through ±π stays a small turn.
        let hd = pendingH;
        if (n === 1) hd -= 2 * Math.PI * Math.round((hd - poseH[0]) / (2 * Math.PI));
        poseH[n] = hd;
        poseZ[n] = pendingZ;
        poses = n + 1;
      }
      if (gameTime - walk.frame * h > MAX_CATCH_UP_SECONDS) gameTime = walk.frame * h + MAX_CATCH_UP_SECONDS;
      while (walk.frame * h < gameTime - 1e-12) {
        if (!advance()) {
          // Failed or over: the clock holds with the pose.
          gameTime = walk.frame * h;
          break;
        }
      }
    },
    step() {
      const more = advance();
      gameTime = walk.frame * h;
      return more && !(!driven && (walk.frame >= lastFrame || walk.bodyPos[2] >= lastZ));
    },
    inStance: (leg) => walk.stance[leg] === 1,
    footPosition: (leg, out) => lerp3(prev.foot, curr.foot, 3 * leg, alphaNow(), out),
    footTarget: (leg, out) => lerp3(prev.target, curr.target, 3 * leg, alphaNow(), out),
    jointWorldMatrix(leg, k, out) {
      const j = jointFirst[leg] + k;
      const a = alphaNow();
      for (let c = 0; c < 4; c++) {
        qa[c] = prev.jointRot[4 * j + c];
        qb[c] = curr.jointRot[4 * j + c];
      }
      quat.slerp(qa as unknown as quat, qa as unknown as quat, qb as unknown as quat, a);
      lerp3(prev.jointPos, curr.jointPos, 3 * j, a, p3);
      mat4.fromRotationTranslation(out as unknown as mat4, qa as unknown as quat, p3 as unknown as [number, number, number]);
      return out;
    },
    bodyPosition: (out) => lerp3(prev.bodyPos, curr.bodyPos, 0, alphaNow(), out),
    bodyRotation(out) {
      quat.slerp(out as unknown as quat, prev.bodyRot as unknown as quat, curr.bodyRot as unknown as quat, alphaNow());
      return out;
    },
    stumbleCounts(out) {
      if (detector) out.set(detector.counts);
      else out.fill(0);
      return out;
    },
  };
}

