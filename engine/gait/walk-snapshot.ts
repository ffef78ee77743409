/**
 * A copy of everything a walk step changes, taken before the step and put back when the step fails (a game's
 * ground callback threw): the walk is then exactly as it was after its last good step. Made once per walk;
 * saving and restoring copy into preallocated arrays and allocate nothing.
 */
import * as ik from '../ik';
import type { Walk } from './walk-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { forwardKinematics } = ik;

type Numbers = Float64Array | Uint8Array | Int32Array;

/** Scalars of the walk, its motion and its four filters, before the swing plans (10 numbers per leg). */
const SCALARS = 31;
const SWING_NUMBERS = 10;

export interface WalkSnapshot {
  readonly live: Numbers[];
  readonly saved: Numbers[];
  readonly scalars: Float64Array;
}

function stateArrays(w: Walk): Numbers[] {
  const a: Numbers[] = [
    w.phase, w.stance, w.resting, w.plant, w.plantNormal, w.support, w.liftNormal, w.landNormal, w.target, w.targetNormal,
    w.foot, w.jointSpeed, w.iterations, w.error, w.solveError, w.converged, w.bodyPos, w.bodyRot, w.kneeShaping,
  ];
  for (const p of w.prevPose) a.push(p);
  for (const p of w.olderPose) a.push(p);
  // The solvers' state: pose, ball quaternions and the root; the rest is recomputed by forward kinematics.
  for (const ws of w.solvers) a.push(ws.pose, ws.quat, ws.rootPos, ws.rootRot);
  return a;
}


export function createWalkSnapshot(w: Walk): WalkSnapshot {
  const live = stateArrays(w);
  return { live, saved: live.map((x) => x.slice()), scalars: new Float64Array(SCALARS + SWING_NUMBERS * w.legs) };
}

// Named fields, not a loop over keys: a generic keyed load of a number field boxes it (allocates) every step.
export function saveWalk(w: Walk, snap: WalkSnapshot): void {
  for (let k = 0; k < snap.live.length; k++) snap.saved[k].set(snap.live[k]);
  const s = snap.scalars;
  const m = w.motion;
  s[0] = w.frame;
  s[1] = w.heightCap;
  s[2] = w.cycleTime;
  s[3] = w.stride;
  s[4] = w.clockCycles;
  s[5] = w.clockFrame;
  s[6] = w.heading;
  s[7] = w.heightTarget;
  s[8] = w.heightGoal;
  s[9] = w.stopping ? 1 : 0;
  s[10] = w.supportChanged ? 1 : 0;
  s[11] = m.mode;
  s[12] = m.s;
  s[13] = m.pathSpeed;
  s[14] = m.vx;
  s[15] = m.vz;
  s[16] = m.turnRate;
  s[17] = m.wantVx;
  s[18] = m.wantVz;
  s[19] = m.wantTurn;
  s[20] = m.poseX;
  s[21] = m.poseZ;
  s[22] = m.poseHeading;
  s[23] = w.pace.value;
  s[24] = w.pace.velocity;
  s[25] = w.height.value;
  s[26] = w.height.velocity;
  s[27] = w.pitch.value;
  s[28] = w.pitch.velocity;
  s[29] = w.roll.value;
  s[30] = w.roll.velocity;
  let n = SCALARS;
  for (let i = 0; i < w.legs; i++) {
    const sw = w.swings[i];
    s[n++] = sw.x0;
    s[n++] = sw.y0;
    s[n++] = sw.z0;
    s[n++] = sw.x1;
    s[n++] = sw.y1;
    s[n++] = sw.z1;
    s[n++] = sw.apex;
    s[n++] = sw.boxiness;
    s[n++] = sw.clearance;
    s[n++] = sw.rise;
  }
}

export function restoreWalk(w: Walk, snap: WalkSnapshot): void {
  for (let k = 0; k < snap.live.length; k++) snap.live[k].set(snap.saved[k]);
  const s = snap.scalars;
  const m = w.motion;
  w.frame = s[0];
  w.heightCap = s[1];
  w.cycleTime = s[2];
  w.stride = s[3];
  w.clockCycles = s[4];
  w.clockFrame = s[5];
  w.heading = s[6];
  w.heightTarget = s[7];
  w.heightGoal = s[8];
  w.stopping = s[9] === 1;
  w.supportChanged = s[10] === 1;
  m.mode = s[11];
  m.s = s[12];
  m.pathSpeed = s[13];
  m.vx = s[14];
  m.vz = s[15];
  m.turnRate = s[16];
  m.wantVx = s[17];
  m.wantVz = s[18];
  m.wantTurn = s[19];
  m.poseX = s[20];
  m.poseZ = s[21];
  m.poseHeading = s[22];
  w.pace.value = s[23];
  w.pace.velocity = s[24];
  w.height.value = s[25];
  w.height.velocity = s[26];
  w.pitch.value = s[27];
  w.pitch.velocity = s[28];
  w.roll.value = s[29];
  w.roll.velocity = s[30];
  let n = SCALARS;
  for (let i = 0; i < w.legs; i++) {
    const sw = w.swings[i];
    sw.x0 = s[n++];
    sw.y0 = s[n++];
    sw.z0 = s[n++];
    sw.x1 = s[n++];
    sw.y1 = s[n++];
    sw.z1 = s[n++];
    sw.apex = s[n++];
    sw.boxiness = s[n++];
    sw.clearance = s[n++];
    sw.rise = s[n++];
  }
  for (let i = 0; i < w.legs; i++) forwardKinematics(w.solvers[i]);
}
