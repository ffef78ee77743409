/**
 * A stored trial replayed in the browser with the same engine, to recover what its compact series does not
 * hold: each leg joint's solved rotation and position per sample. The engine is deterministic, so the replay
 * reaches the trial's own states; its feet are checked against the stored series to prove it (a course edited
 * after the trial, or a trial recorded by an older engine, replays differently and says so).
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

/**
 * Start replaying a stored trial. `advance` runs it in slices so a page can stay responsive; the options are
 * those of a trial of record (server/services/trials.ts runs TRIAL_SECONDS at the engine's default step and rate).
 */
export function startReplay(rig: Rig, setup: LegSetup, course: Heightfield, stored: TrialSeries): ReplayRun {
  const t: Trial = createTrial(rig, setup, course, { duration: TRIAL_SECONDS, recordRate: stored.rate });
  const jointsPerLeg = rig.legs.map((l) => l.chain.joints.length);
  const jointOffset: number[] = [];
  let joints = 0;
  for (const n of jointsPerLeg) {
    jointOffset.push(joints);
    joints += n;
  }
  const n = stored.length;
  const replay: WalkReplay = {
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
  const rel = new Float64Array(9);
  const q = new Float64Array(4);
  const bodyMat = new Float64Array(9);

  const capture = (k: number) => {
    const b = 7 * k;
    replay.body[b] = t.bodyPos[0];
    replay.body[b + 1] = t.bodyPos[1];
    replay.body[b + 2] = t.bodyPos[2];
    for (let c = 0; c < 4; c++) replay.body[b + 3 + c] = t.bodyRot[c];
    for (let i = 0; i < t.legs; i++) {
      const ws = t.solvers[i];
      // The hip socket's rotation is where the chain's relative rotations start.
      for (let c = 0; c < 9; c++) bodyMat[c] = ws.rootRot[c];
      for (let j = 0; j < jointsPerLeg[i]; j++) {
        const slot = joints * k + jointOffset[i] + j;
        if (j === 0) relative(bodyMat, 0, ws.jRot, 0, rel);
        else relative(ws.jRot, 9 * (j - 1), ws.jRot, 9 * j, rel);
        matToQuat(rel, 0, q);
        for (let c = 0; c < 4; c++) replay.local[4 * slot + c] = q[c];
        for (let c = 0; c < 3; c++) replay.position[3 * slot + c] = ws.jPos[3 * j + c];
      }
      const o = (k * t.legs + i) * 3;
      const d = Math.hypot(ws.foot[0] - stored.foot[o], ws.foot[1] - stored.foot[o + 1], ws.foot[2] - stored.foot[o + 2]);
      if (d > replay.footDeviation) replay.footDeviation = d;
    }
  };

  // The trial records its starting pose (sample 0) when it is created.
  const catchUp = () => {
    while (replay.length < t.series.length && replay.length < n) capture(replay.length++);
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
