/**
 * What one leg is asked to do each frame, and the limits on how it may move.
 *
 * - aimLeg: the point and sole normal the solver aims at. A target out of
 *   reach is replaced by the nearest point of the reach sphere (never chase
 *   what the leg cannot reach), one closer than the leg can fold is pushed
 *   out to its fold limit; the metrics still see the real target. The sole
 *   follows the ground normal by a share that changes over the cycle.
 * - limitLegMotion: after the solve, a leg that has lost its aim eases toward
 *   its rest pose over about a swing, and no joint moves faster than the
 *   setup's joint speed limit; the pose is re-posed when either applies.
 */
import * as ikKinematics from '../ik/kinematics';
import * as ikWorkspace from '../ik/workspace';
import { pullInsideReach, pushOutsideFold, TARGET_MAX } from './reach';
import type { Trial } from './trial-state';

const { forwardKinematics } = ikKinematics;
const { setPose, DOF_SLIDE } = ikWorkspace;

/** Share of the stance after which the heel comes up and the sole rolls onto its point. */
const HEEL_OFF = 0.5;
/** Share of the stance by which the sole, landed heel first, lies flat. */
const FLAT_BY = 0.25;
/** Share of the swing at which the sole starts turning to the landing ground, and is flat to it. */
const SWING_CATCH = 0.55;
const SWING_FLAT = 0.95;
/** A leg whose solve ends this far from its aim has lost it: m, or a share of its reach if that is more. */
const LOST_DISTANCE = 0.05;
const LOST_SHARE = 0.1;

function smooth(u: number): number {
  return u <= 0 ? 0 : u >= 1 ? 1 : u * u * (3 - 2 * u);
}

/**
 * How much of the ground-normal target the sole follows over the cycle: flat
 * through the middle of the stance, rolling onto the sole point before
 * liftoff (the heel rises) and landing heel first, free in mid-swing, where a
 * foot held flat would drive the ankle into its limit and the hip into a
 * twist. Continuous over the whole cycle.
 */
export function orientationShare(phase: number, dutyFactor: number): number {
  if (phase < dutyFactor) {
    const p = phase / dutyFactor;
    return smooth(p / FLAT_BY) * (1 - smooth((p - HEEL_OFF) / (1 - HEEL_OFF)));
  }
  return smooth(((phase - dutyFactor) / (1 - dutyFactor) - SWING_CATCH) / (SWING_FLAT - SWING_CATCH));
}

/** Fill aim (and aimNormal) for leg i; returns the normal to solve with, or null for position only. */
export function aimLeg(t: Trial, i: number, aim: Float64Array, aimNormal: Float64Array): Float64Array | null {
  const ws = t.solvers[i];
  const o = 3 * i;
  aim[0] = t.target[o];
  aim[1] = t.target[o + 1];
  aim[2] = t.target[o + 2];
  const reach = t.rig.legs[i].chain.reach;
  const hip = ws.rootPos;
  pullInsideReach(hip[0], hip[1], hip[2], TARGET_MAX * reach, aim, 0);
  pushOutsideFold(hip[0], hip[1], hip[2], t.foldLimit[i] * reach, aim, 0);
  if (!t.orient[i]) return null;
  const share = orientationShare(t.phase[i], t.gait.dutyFactor);
  if (share > 1 - 1e-9) return t.targetNormalOf[i];
  if (share <= 1e-3) return null;
  const up = ws.footUp;
  for (let k = 0; k < 3; k++) aimNormal[k] = up[k] + (t.targetNormal[o + k] - up[k]) * share;
  return aimNormal;
}

/** Recovery toward rest and the joint speed limit, applied to leg i's solved pose (prevPose holds last frame's). */
export function limitLegMotion(t: Trial, i: number, aim: Float64Array): void {
  const ws = t.solvers[i];
  const prev = t.prevPose[i];
  const reach = t.rig.legs[i].chain.reach;
  const lost = t.error[i] > Math.max(LOST_DISTANCE, LOST_SHARE * reach);
  const rest = ws.restPose;
  const pose = ws.pose;
  const limit = t.maxJointStep[i];
  const limited = t.limitedPose[i];
  let changed = lost;
  for (let d = 0; d < ws.nDof; d++) {
    let v = pose[d];
    if (lost) v += (rest[d] - v) * t.recoverRate;
    const change = v - prev[d];
    if (ws.dKind[d] !== DOF_SLIDE && (change > limit || change < -limit)) {
      v = prev[d] + (change > 0 ? limit : -limit);
      changed = true;
    }
    limited[d] = v;
  }
  if (!changed) return;
  setPose(ws, limited);
  forwardKinematics(ws);
  const f = ws.foot;
  const dx = f[0] - aim[0];
  const dy = f[1] - aim[1];
  const dz = f[2] - aim[2];
  t.error[i] = Math.sqrt(dx * dx + dy * dy + dz * dz);
}
