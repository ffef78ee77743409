/**
 * What one leg is asked to do each frame, and the limits on how it may move.
 *
 * - aimLeg: the point and sole normal the solver aims at. A target out of
 *   reach is replaced by the nearest point of the reach sphere (never chase
 *   what the leg cannot reach), and a stance foot closer than the leg can fold
 *   is pushed out to its fold limit; the metrics still see the real target. A
 *   swinging foot is not pushed: pushed away from the hip it would be driven
 *   down into the step it is clearing. The sole
 *   follows the ground normal by a share that changes over the cycle.
 * - limitLegMotion: after the solve, a leg that has lost its aim eases toward
 *   its rest pose over about a swing, and no joint moves faster than the
 *   setup's joint speed limit; the pose is re-posed when either applies.
 */
import * as ikKinematics from '../ik/kinematics';
import * as ikLayout from '../ik/layout';
import * as ikPose from '../ik/pose';
import { pullInsideReach, pushOutsideFold, TARGET_MAX } from './reach';
import type { IKWorkspace } from '../ik/workspace';
import type { Walk } from './walk-state';

const { forwardKinematics } = ikKinematics;
const { setPose } = ikPose;
const { DOF_BALL, DOF_SLIDE } = ikLayout;

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
export function aimLeg(t: Walk, i: number, aim: Float64Array, aimNormal: Float64Array): Float64Array | null {
  const ws = t.solvers[i];
  const o = 3 * i;
  aim[0] = t.target[o];
  aim[1] = t.target[o + 1];
  aim[2] = t.target[o + 2];
  const reach = t.rig.legs[i].chain.reach;
  const hip = ws.rootPos;
  pullInsideReach(hip[0], hip[1], hip[2], TARGET_MAX * reach, aim, 0);
  if (t.stance[i]) pushOutsideFold(hip[0], hip[1], hip[2], t.foldLimit[i] * reach, aim, 0);
  if (!t.orient[i]) return null;
  const share = orientationShare(t.phase[i], t.gait.dutyFactor);
  if (share > 1 - 1e-9) return t.targetNormalOf[i];
  if (share <= 1e-3) return null;
  const up = ws.footUp;
  for (let k = 0; k < 3; k++) aimNormal[k] = up[k] + (t.targetNormal[o + k] - up[k]) * share;
  return aimNormal;
}

/** Recovery toward rest and the joint speed limit, applied to leg i's solved pose (prevPose holds last frame's). */
export function limitLegMotion(t: Walk, i: number, aim: Float64Array): void {
  const ws = t.solvers[i];
  const prev = t.prevPose[i];
  const reach = t.rig.legs[i].chain.reach;
  const lost = t.error[i] > Math.max(LOST_DISTANCE, LOST_SHARE * reach);
  const rest = ws.restPose;
  const pose = ws.pose;
  const limit = t.maxJointStep[i];
  const limited = t.limitedPose[i];
  let changed = lost;
  let fastest = 0;
  for (let d = 0; d < ws.nDof; d++) {
    let v = pose[d];
    if (lost) v += (rest[d] - v) * t.recoverRate;
    limited[d] = v;
    if (ws.dKind[d] === DOF_SLIDE) continue;
    const change = v > prev[d] ? v - prev[d] : prev[d] - v;
    if (change > fastest) fastest = change;
  }
  if (fastest > limit) {
    // A planted leg slows every joint by one scale: its limited pose lies on the way from the last pose to
    // the solved one, both of which hold the foot on its plant (each joint clamped alone, a hip turning
    // fast while the ankle did not dragged the foot 4 cm: a skid). A swinging leg clamps each joint alone,
    // so the joints that can keep up still carry the foot toward its target.
    const scale = limit / fastest;
    const planted = t.stance[i] === 1;
    for (let d = 0; d < ws.nDof; d++) {
      if (ws.dKind[d] === DOF_SLIDE) continue;
      const change = limited[d] - prev[d];
      if (planted) limited[d] = prev[d] + change * scale;
      else if (change > limit || change < -limit) limited[d] = prev[d] + (change > 0 ? limit : -limit);
    }
    changed = true;
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

/**
 * The knee's straight limit, found once per leg: the limit of the knee DOF
 * that puts the sole further from the hip (rest pose otherwise). Writes the
 * straight value and the sign of bending (+1: bending raises the DOF) into
 * out; returns the DOF index, or -1 when the leg has no hinge knee.
 */
export function findStraightKnee(ws: IKWorkspace, kneeJoint: number | undefined, out: Float64Array): number {
  if (kneeJoint === undefined || kneeJoint < 1 || kneeJoint >= ws.nJoints) return -1;
  const d = ws.jDof0[kneeJoint];
  if (d < 0 || ws.dKind[d] === DOF_BALL || ws.dKind[d] === DOF_SLIDE) return -1;
  const lo = ws.lo[d];
  const hi = ws.hi[d];
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return -1;
  const saved = ws.pose[d];
  ws.pose[d] = lo;
  forwardKinematics(ws);
  const atLo = Math.hypot(ws.foot[0] - ws.rootPos[0], ws.foot[1] - ws.rootPos[1], ws.foot[2] - ws.rootPos[2]);
  ws.pose[d] = hi;
  forwardKinematics(ws);
  const atHi = Math.hypot(ws.foot[0] - ws.rootPos[0], ws.foot[1] - ws.rootPos[1], ws.foot[2] - ws.rootPos[2]);
  ws.pose[d] = saved;
  forwardKinematics(ws);
  out[0] = atLo >= atHi ? lo : hi;
  out[1] = atLo >= atHi ? 1 : -1;
  return d;
}

/** A knee within this of its straight limit, rad, is preshaped. */
const KNEE_NEAR_STRAIGHT = 0.15;

/** Whether leg i's knee (if it has a hinge knee) is within KNEE_NEAR_STRAIGHT of its straight limit. */
export function kneeNearStraight(t: Walk, i: number): boolean {
  const d = t.kneeDof[i];
  return d >= 0 && Math.abs(t.solvers[i].pose[d] - t.kneeStraight[2 * i]) <= KNEE_NEAR_STRAIGHT;
}

/**
 * Two-bone preshaping of the warm start: the knee is set to the bend that
 * makes the hip-to-sole distance what the aim asks for (law of cosines over
 * the thigh and the knee-to-sole segment as they stand), and the solver then
 * only turns the leg to the aim. A damped least-squares step alone takes the
 * cheapest motion, and for a foot that must rise behind the hip that is
 * swinging a straight leg forward, through the ground, rather than bending
 * the knee; at full extension the knee's Jacobian column has no component
 * along the leg at all, so a straight knee never bends by itself.
 */
export function preshapeKnee(t: Walk, i: number, aim: Float64Array, always = false): void {
  const d = t.kneeDof[i];
  if (d < 0) return;
  const ws = t.solvers[i];
  // Only a knee near its straight limit: a bent one is left to the solver, which follows it smoothly.
  if (!always && !kneeNearStraight(t, i)) return;
  forwardKinematics(ws);
  const k = 3 * (t.rig.legs[i].chain.knee as number);
  const p = ws.jPos;
  const hx = p[0];
  const hy = p[1];
  const hz = p[2];
  const a = Math.hypot(p[k] - hx, p[k + 1] - hy, p[k + 2] - hz);
  const f = ws.foot;
  const b = Math.hypot(f[0] - p[k], f[1] - p[k + 1], f[2] - p[k + 2]);
  if (!(a > 1e-9 && b > 1e-9)) return;
  const now = Math.hypot(f[0] - hx, f[1] - hy, f[2] - hz);
  let want = Math.hypot(aim[0] - hx, aim[1] - hy, aim[2] - hz);
  const shortest = Math.abs(a - b) + 1e-6;
  const longest = a + b - 1e-6;
  want = want < shortest ? shortest : want > longest ? longest : want;
  const inner = (c: number) => {
    const cos = (a * a + b * b - c * c) / (2 * a * b);
    return Math.acos(cos > 1 ? 1 : cos < -1 ? -1 : cos);
  };
  const v = ws.pose[d] + (inner(now) - inner(want)) * t.kneeStraight[2 * i + 1];
  ws.pose[d] = v < ws.lo[d] ? ws.lo[d] : v > ws.hi[d] ? ws.hi[d] : v;
}
