/**
 * A copy of everything a walk step changes, taken before the step and put back when the step fails (a game's
 * ground callback threw): the walk is then exactly as it was after its last good step. Made once per walk;
 * saving and restoring copy into preallocated arrays and allocate nothing.
 */
import * as ik from '../ik';
import type { DampedState } from './body-filter';
import type { Walk } from './walk-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { forwardKinematics } = ik;

type Numbers = Float64Array | Uint8Array | Int32Array;

const WALK_SCALARS = ['frame', 'heightCap', 'cycleTime', 'stride', 'clockCycles', 'clockFrame', 'heading', 'heightTarget', 'heightGoal'] as const;
const WALK_FLAGS = ['stopping', 'supportChanged'] as const;
const MOTION_SCALARS = ['mode', 's', 'pathSpeed', 'vx', 'vz', 'turnRate', 'wantVx', 'wantVz', 'wantTurn', 'poseX', 'poseZ', 'poseHeading'] as const;
const SWING_SCALARS = ['x0', 'y0', 'z0', 'x1', 'y1', 'z1', 'apex', 'boxiness', 'clearance'] as const;

export interface WalkSnapshot {
  readonly live: Numbers[];
  readonly saved: Numbers[];
  readonly damped: DampedState[];
  readonly scalars: Float64Array;
}

function stateArrays(w: Walk): Numbers[] {
  const a: Numbers[] = [
    w.phase, w.stance, w.resting, w.plant, w.plantNormal, w.support, w.liftNormal, w.landNormal, w.target, w.targetNormal,
    w.foot, w.jointSpeed, w.iterations, w.error, w.solveError, w.converged, w.bodyPos, w.bodyRot,
  ];
  for (const p of w.prevPose) a.push(p);
  for (const p of w.olderPose) a.push(p);
  // The solvers' state: pose, ball quaternions and the root; the rest is recomputed by forward kinematics.
  for (const ws of w.solvers) a.push(ws.pose, ws.quat, ws.rootPos, ws.rootRot);
  return a;
}

const dampedOf = (w: Walk): DampedState[] => [w.pace, w.height, w.pitch, w.roll];
const scalarCount = (w: Walk) => WALK_SCALARS.length + WALK_FLAGS.length + MOTION_SCALARS.length + 8 + SWING_SCALARS.length * w.legs;

export function createWalkSnapshot(w: Walk): WalkSnapshot {
  const live = stateArrays(w);
  return { live, saved: live.map((x) => x.slice()), damped: dampedOf(w), scalars: new Float64Array(scalarCount(w)) };
}

export function saveWalk(w: Walk, snap: WalkSnapshot): void {
  for (let k = 0; k < snap.live.length; k++) snap.saved[k].set(snap.live[k]);
  const s = snap.scalars;
  const mw = w as unknown as Record<string, number | boolean>;
  const m = w.motion as unknown as Record<string, number>;
  let n = 0;
  for (let k = 0; k < WALK_SCALARS.length; k++) s[n++] = mw[WALK_SCALARS[k]] as number;
  for (let k = 0; k < WALK_FLAGS.length; k++) s[n++] = mw[WALK_FLAGS[k]] ? 1 : 0;
  for (let k = 0; k < MOTION_SCALARS.length; k++) s[n++] = m[MOTION_SCALARS[k]];
  for (let k = 0; k < snap.damped.length; k++) {
    s[n++] = snap.damped[k].value;
    s[n++] = snap.damped[k].velocity;
  }
  for (let i = 0; i < w.legs; i++) {
    const sw = w.swings[i] as unknown as Record<string, number>;
    for (let k = 0; k < SWING_SCALARS.length; k++) s[n++] = sw[SWING_SCALARS[k]];
  }
}

export function restoreWalk(w: Walk, snap: WalkSnapshot): void {
  for (let k = 0; k < snap.live.length; k++) snap.live[k].set(snap.saved[k]);
  const s = snap.scalars;
  const mw = w as unknown as Record<string, number | boolean>;
  const m = w.motion as unknown as Record<string, number>;
  let n = 0;
  for (let k = 0; k < WALK_SCALARS.length; k++) mw[WALK_SCALARS[k]] = s[n++];
  for (let k = 0; k < WALK_FLAGS.length; k++) mw[WALK_FLAGS[k]] = s[n++] === 1;
  for (let k = 0; k < MOTION_SCALARS.length; k++) m[MOTION_SCALARS[k]] = s[n++];
  for (let k = 0; k < snap.damped.length; k++) {
    snap.damped[k].value = s[n++];
    snap.damped[k].velocity = s[n++];
  }
  for (let i = 0; i < w.legs; i++) {
    const sw = w.swings[i] as unknown as Record<string, number>;
    for (let k = 0; k < SWING_SCALARS.length; k++) sw[SWING_SCALARS[k]] = s[n++];
  }
  for (let i = 0; i < w.legs; i++) forwardKinematics(w.solvers[i]);
}
