/**
 * Each leg joint's solved rotation and position per sample of a stored trial, for posing the character's mesh.
 * Trials record their solved joint angles (engine/gait/joint-angles.ts): forward kinematics of those values
 * (engine/ik) gives the poses exactly as the trial of record solved them. Trials stored before that are
 * replayed with the engine's trial loop instead; the engine is deterministic, so a replay by the same engine
 * over the same course reaches the trial's own states. Either way the feet are checked against the stored
 * series (a course edited after the trial, or an older engine, replays differently and says so).
 *
 * Per sample it keeps, in Float32: the body position (3) and rotation quaternion (4); per leg and chain joint
 * the joint's own rotation relative to the joint before it (or the hip socket), a quaternion in the rig's
 * rest-aligned axes (the chain joints of a character rig keep identity rest rotations, engine/gait/character-rig.ts),
 * and the joint's world position (3).
 */
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { TrialSeries } from '../../engine/gait/series';
import { createTrial, stepTrial, type Trial } from '../../engine/gait/trial';
import { BODY_FRAME_VALUES, readJointAngles } from '../../engine/gait/joint-angles';
import { createWorkspace, forwardKinematics, setPose, setRootTransform, type IKWorkspace } from '../../engine/ik';
import { TRIAL_SECONDS } from '../../schemas/trials';

export interface WalkReplay {
  /** Samples replayed so far (the stored series' rate). */
  length: number;
  rate: number;
  /** Chain joints per leg, and each leg's first joint slot in the per-sample joint block. */
  jointsPerLeg: number[];
  jointOffset: number[];
  /** Joint slots per sample (sum of jointsPerLeg). */
  joints: number;
  /** 7 per sample: body x, y, z, quaternion x, y, z, w. */
  body: Float32Array;
  /** 4 per joint slot per sample: the joint's own rotation (x, y, z, w). */
  local: Float32Array;
  /** 3 per joint slot per sample: joint world position. */
  position: Float32Array;
  /** Largest distance between a replayed foot and the stored one, m. */
  footDeviation: number;
  done: boolean;
}

/** Replayed feet further than this from the record mean the replay is not the trial (1 mm, the pose test's bar). */
export const REPLAY_TOLERANCE = 1e-3;

export interface ReplayRun {
  replay: WalkReplay;
  /** Advance up to `frames` engine frames; true while more remain. */
  advance(frames: number): boolean;
}

/** Rotation matrix (row-major 3×3) to quaternion [x, y, z, w] (Shepperd's method). */
function matToQuat(m: ArrayLike<number>, o: number, out: Float64Array): void {
  const m00 = m[o], m01 = m[o + 1], m02 = m[o + 2], m10 = m[o + 3], m11 = m[o + 4], m12 = m[o + 5], m20 = m[o + 6], m21 = m[o + 7], m22 = m[o + 8];
  const tr = m00 + m11 + m22;
  if (tr > 0) {
    const s = 0.5 / Math.sqrt(tr + 1);
    out[3] = 0.25 / s;
    out[0] = (m21 - m12) * s;
    out[1] = (m02 - m20) * s;
    out[2] = (m10 - m01) * s;
  } else if (m00 > m11 && m00 > m22) {
    const s = 2 * Math.sqrt(1 + m00 - m11 - m22);
    out[3] = (m21 - m12) / s;
    out[0] = 0.25 * s;
    out[1] = (m01 + m10) / s;
    out[2] = (m02 + m20) / s;
  } else if (m11 > m22) {
    const s = 2 * Math.sqrt(1 + m11 - m00 - m22);
    out[3] = (m02 - m20) / s;
    out[0] = (m01 + m10) / s;
    out[1] = 0.25 * s;
    out[2] = (m12 + m21) / s;
  } else {
    const s = 2 * Math.sqrt(1 + m22 - m00 - m11);
    out[3] = (m10 - m01) / s;
    out[0] = (m02 + m20) / s;
    out[1] = (m12 + m21) / s;
    out[2] = 0.25 * s;
  }
}

/** Rᵀ·S for row-major 3×3 matrices R (at ro in r) and S (at so in s): the rotation from R's frame to S's. */
function relative(r: ArrayLike<number>, ro: number, s: ArrayLike<number>, so: number, out: Float64Array): void {
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      out[3 * i + j] = r[ro + i] * s[so + j] + r[ro + 3 + i] * s[so + 3 + j] + r[ro + 6 + i] * s[so + 6 + j];
    }
  }
}

function emptyReplay(rig: Rig, stored: TrialSeries): WalkReplay {
  const jointsPerLeg = rig.legs.map((l) => l.chain.joints.length);
  const jointOffset: number[] = [];
  let joints = 0;
  for (const n of jointsPerLeg) {
    jointOffset.push(joints);
    joints += n;
  }
  const n = stored.length;
  return {
    length: 0,
    rate: stored.rate,
    jointsPerLeg,
    jointOffset,
    joints,
    body: new Float32Array(7 * n),
    local: new Float32Array(4 * joints * n),
    position: new Float32Array(3 * joints * n),
    footDeviation: 0,
    done: n === 0,
  };
}

/** Sample k of the replay from the legs' solved state (after forward kinematics) and the body frame. */
function captureInto(replay: WalkReplay, k: number, solvers: readonly IKWorkspace[], bodyPos: ArrayLike<number>, bodyRot: ArrayLike<number>, stored: TrialSeries): void {
  const rel = scratch.rel;
  const q = scratch.q;
  const b = 7 * k;
  for (let c = 0; c < 3; c++) replay.body[b + c] = bodyPos[c];
  for (let c = 0; c < 4; c++) replay.body[b + 3 + c] = bodyRot[c];
  for (let i = 0; i < solvers.length; i++) {
    const ws = solvers[i];
    for (let j = 0; j < replay.jointsPerLeg[i]; j++) {
      const slot = replay.joints * k + replay.jointOffset[i] + j;
      // The hip socket's rotation is where the chain's relative rotations start.
      if (j === 0) relative(ws.rootRot, 0, ws.jRot, 0, rel);
      else relative(ws.jRot, 9 * (j - 1), ws.jRot, 9 * j, rel);
      matToQuat(rel, 0, q);
      for (let c = 0; c < 4; c++) replay.local[4 * slot + c] = q[c];
      for (let c = 0; c < 3; c++) replay.position[3 * slot + c] = ws.jPos[3 * j + c];
    }
    const o = (k * solvers.length + i) * 3;
    const d = Math.hypot(ws.foot[0] - stored.foot[o], ws.foot[1] - stored.foot[o + 1], ws.foot[2] - stored.foot[o + 2]);
    if (d > replay.footDeviation) replay.footDeviation = d;
  }
}
const scratch = { rel: new Float64Array(9), q: new Float64Array(4) };

/**
 * Poses from the joint angles the trial recorded, or null when it recorded none (or not for this rig's legs).
 * Cheap: one forward kinematics pass per leg and sample.
 */
export function replayFromRecord(rig: Rig, stored: TrialSeries): WalkReplay | null {
  if (!stored.jointDofs || stored.legs !== rig.legs.length) return null;
  const solvers = rig.legs.map((l) => createWorkspace(l.chain));
  const first: number[] = [];
  let dofs = 0;
  for (const ws of solvers) {
    first.push(dofs);
    dofs += ws.nDof;
  }
  if (dofs !== stored.jointDofs || stored.bodyFrame.length < BODY_FRAME_VALUES * stored.length) return null;
  const replay = emptyReplay(rig, stored);
  const values = solvers.map((ws) => new Float64Array(ws.nDof));
  const pos = new Float64Array(3);
  const rot = new Float64Array(4);
  const hip = new Float64Array(3);
  const hipRot = new Float64Array(4);
  for (let k = 0; k < stored.length; k++) {
    const f = BODY_FRAME_VALUES * k;
    for (let c = 0; c < 3; c++) pos[c] = stored.bodyFrame[f + c];
    for (let c = 0; c < 4; c++) rot[c] = stored.bodyFrame[f + 3 + c];
    const [x, y, z, w] = rot;
    rig.legs.forEach((leg, i) => {
      // Hip socket = body position + body rotation · hip offset; its rotation = body rotation · hip rotation.
      const [hx, hy, hz] = leg.hip;
      const tx = 2 * (y * hz - z * hy);
      const ty = 2 * (z * hx - x * hz);
      const tz = 2 * (x * hy - y * hx);
      hip[0] = pos[0] + hx + w * tx + (y * tz - z * ty);
      hip[1] = pos[1] + hy + w * ty + (z * tx - x * tz);
      hip[2] = pos[2] + hz + w * tz + (x * ty - y * tx);
      const [bx, by, bz, bw] = leg.hipRotation;
      hipRot[0] = w * bx + x * bw + y * bz - z * by;
      hipRot[1] = w * by - x * bz + y * bw + z * bx;
      hipRot[2] = w * bz + x * by - y * bx + z * bw;
      hipRot[3] = w * bw - x * bx - y * by - z * bz;
      const ws = solvers[i];
      setRootTransform(ws, hip, hipRot);
      readJointAngles(stored, k, ws, first[i], values[i]);
      // The recorded values are the trial's own (already inside their limits); clamping again could move them.
      setPose(ws, values[i], false);
      forwardKinematics(ws);
    });
    captureInto(replay, k, solvers, pos, rot, stored);
    replay.length = k + 1;
  }
  replay.done = true;
  return replay;
}

/**
 * Start replaying a stored trial with the trial loop (for trials that recorded no joint angles). `advance` runs
 * it in slices so a page can stay responsive; the options are those of a trial of record (server/routes/trials.ts
 * runs TRIAL_SECONDS at the engine's default step and rate).
 */
export function startReplay(rig: Rig, setup: LegSetup, course: Heightfield, stored: TrialSeries): ReplayRun {
  const t: Trial = createTrial(rig, setup, course, { duration: TRIAL_SECONDS, recordRate: stored.rate });
  const n = stored.length;
  const replay = emptyReplay(rig, stored);
  // The trial records its starting pose (sample 0) when it is created.
  const catchUp = () => {
    while (replay.length < t.record.series.length && replay.length < n) {
      captureInto(replay, replay.length, t.solvers, t.bodyPos, t.bodyRot, stored);
      replay.length++;
    }
  };
  catchUp();
  return {
    replay,
    advance(frames) {
      if (replay.done) return false;
      for (let f = 0; f < frames; f++) {
        const more = stepTrial(t);
        // The trial records sample k at the first frame at or after k / rate; capture the same frame.
        catchUp();
        if (!more || replay.length >= n) {
          replay.done = true;
          if (replay.length < n) replay.footDeviation = Infinity;
          return false;
        }
      }
      return true;
    },
  };
}

/** Replay a whole stored trial at once (tests, benchmarks). */
export function replayTrial(rig: Rig, setup: LegSetup, course: Heightfield, stored: TrialSeries): WalkReplay {
  const run = startReplay(rig, setup, course, stored);
  while (run.advance(600));
  return run.replay;
}
