/**
 * The runtime's clock and outputs: fixed internal steps under any frame time, and the feet, joints and body
 * interpolated between the last two steps for drawing (after "Fix Your Timestep!", Fiedler 2004: the walk runs
 * at most one step ahead of the game's clock and drawing blends the two steps around it).
 */
import { mat4, quat } from 'gl-matrix';
import type { Heightfield } from '../course/heightfield';
import type { LegSetup } from '../gait/leg-setup';
import type { Rig } from '../gait/rig';
import { createTrial, stepTrial, type Trial } from '../gait/trial';
import { jointWorldMatrix } from '../ik';
import type { GroundQuery, LegRuntimeError, LegRuntimeOptions } from './runtime';

export interface DrivenWalk {
  readonly timeStep: number;
  readonly frame: number;
  readonly time: number;
  readonly alpha: number;
  readonly speed: number;
  readonly turnRate: number;
  readonly cycleTime: number;
  readonly resting: boolean;
  readonly lastError: LegRuntimeError | null;
  drive(vx: number, vz: number, turnRate: number): void;
  follow(x: number, z: number, heading: number): void;
  update(dt: number): void;
  step(): boolean;
  inStance(leg: number): boolean;
  footPosition(leg: number, out: Float64Array): Float64Array;
  footTarget(leg: number, out: Float64Array): Float64Array;
  jointWorldMatrix(leg: number, k: number, out: Float64Array): Float64Array;
  bodyPosition(out: Float64Array): Float64Array;
  bodyRotation(out: Float64Array): Float64Array;
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

const m4 = new Float64Array(16);
const qa = new Float64Array(4);
const qb = new Float64Array(4);
const p3 = new Float64Array(3);

export function createDrivenWalk(rig: Rig, setup: LegSetup, ground: Heightfield | GroundQuery, options: LegRuntimeOptions): DrivenWalk {
  if (typeof ground === 'function') throw new Error('a ground callback is not supported by this build yet: pass a Heightfield');
  const trial: Trial = createTrial(rig, setup, ground, {
    duration: options.duration ?? 600,
    ...(options.timeStep ? { timeStep: options.timeStep } : {}),
  });
  const h = trial.options.timeStep;
  const L = trial.legs;
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
  let lastError: LegRuntimeError | null = null;
  let ended = false;
  /** Game time consumed, and the walk's own time (frame × h), which runs at most one step ahead of it. */
  let gameTime = 0;

  const capture = (f: Frame) => {
    f.foot.set(trial.foot);
    f.target.set(trial.target);
    f.bodyPos.set(trial.bodyPos);
    f.bodyRot.set(trial.bodyRot);
    for (let i = 0; i < L; i++) {
      const ws = trial.solvers[i];
      for (let k = 0; k < jointCount[i]; k++) {
        const j = jointFirst[i] + k;
        jointWorldMatrix(ws, k, m4);
        f.jointPos[3 * j] = m4[12];
        f.jointPos[3 * j + 1] = m4[13];
        f.jointPos[3 * j + 2] = m4[14];
        mat4.getRotation(qa as unknown as quat, m4 as unknown as mat4);
        f.jointRot.set(qa, 4 * j);
      }
    }
  };
  capture(curr);
  capture(prev);

  const advance = (): boolean => {
    if (ended) return false;
    const tmp = prev;
    prev = curr;
    curr = tmp;
    const more = stepTrial(trial);
    capture(curr);
    if (!more) ended = true;
    return more;
  };

  const alphaNow = () => {
    const ahead = trial.frame * h - gameTime;
    const a = 1 - ahead / h;
    return a < 0 ? 0 : a > 1 ? 1 : a;
  };
  const lerp3 = (a: Float64Array, b: Float64Array, o: number, t: number, out: Float64Array) => {
    for (let c = 0; c < 3; c++) out[c] = a[o + c] + (b[o + c] - a[o + c]) * t;
    return out;
  };

  return {
    timeStep: h,
    get frame() {
      return trial.frame;
    },
    get time() {
      return gameTime;
    },
    get alpha() {
      return alphaNow();
    },
    get speed() {
      return trial.gait.speed * trial.pace.value;
    },
    turnRate: 0,
    get cycleTime() {
      return trial.gait.cycleTime;
    },
    resting: false,
    get lastError() {
      return lastError;
    },
    drive() {
      // Interim build: the walk goes straight ahead at the profile's speed.
    },
    follow() {},
    update(dt: number) {
      if (!(dt >= 0) || !Number.isFinite(dt)) return;
      gameTime += dt;
      while (trial.frame * h < gameTime - 1e-12 && advance());
    },
    step() {
      const more = advance();
      gameTime = trial.frame * h;
      return more;
    },
    inStance: (leg) => trial.stance[leg] === 1,
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
  };
}
