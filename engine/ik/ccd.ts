/**
 * Cyclic coordinate descent (position only): one DOF at a time, foot → hip,
 * each turned (or slid) to bring the sole as near the target as it can alone.
 */
import * as Q from '../math/quat';
import { forwardKinematics as forwardKinematicsImport } from './kinematics';
import { JOINT_HINGE as JOINT_HINGE_, JOINT_BALL as JOINT_BALL_, JOINT_SLIDER as JOINT_SLIDER_, S_CHANGE as S_CHANGE_, S_MOVE as S_MOVE_ } from './layout';
import { clampBall as clampBallImport } from './limits';
import type { IKWorkspace } from './workspace';

// Local bindings (transpiled imports are getter calls on every use).
const forwardKinematics = forwardKinematicsImport;
const clampBall = clampBallImport;
const fromRotationVector = Q.fromRotationVector;
const premultiplyUnit = Q.premultiplyUnit;
const JOINT_HINGE = JOINT_HINGE_;
const JOINT_BALL = JOINT_BALL_;
const JOINT_SLIDER = JOINT_SLIDER_;
const S_CHANGE = S_CHANGE_;
const S_MOVE = S_MOVE_;

/** Sole and target this close to the line through a ball's pivot: no turn toward the target is defined. */
const BALL_DEGENERATE_BELOW = 1e-14;
/** A hinge already pointing the sole at the target (|sin| below this, cos ≥ 0) is left alone. */
const HINGE_ALIGNED_BELOW = 1e-15;

// Rotation vector and quaternion of a ball's turn.
const TURN = new Float64Array(3);
const TURN_QUAT = new Float64Array(4);

/**
 * One CCD sweep, foot → hip: each DOF in turn moves the sole toward the target
 * (hinge: the angle between the projections on the plane ⟂ axis; ball: the
 * shortest rotation; slider: the projection on its axis), clamped to its limits.
 * Returns limit hits; the largest change goes to ws.scalars[S_CHANGE]. The
 * hinge and slider moves are written out in the loop (as functions they cost
 * CCD a few per cent); a ball's turn, rarer, is its own function.
 */
export function ccdSweep(ws: IKWorkspace): number {
  let hits = 0;
  let change = 0;
  for (let j = ws.nJoints - 1; j >= 0; j--) {
    const kind = ws.jKind[j];
    const d0 = ws.jDof0[j];
    if (kind === JOINT_BALL) {
      if (!turnBallTowardTarget(ws, j, d0)) continue;
      const ang = ws.scalars[S_MOVE];
      if (clampBall(ws, ws.jBall[j])) hits++;
      if (ang > change) change = ang;
      forwardKinematics(ws, j);
      continue;
    }
    const nd = kind === JOINT_SLIDER || kind === JOINT_HINGE ? 1 : 2;
    const t = ws.target;
    for (let d = d0 + nd - 1; d >= d0; d--) {
      const ax = ws.dAxisW[3 * d];
      const ay = ws.dAxisW[3 * d + 1];
      const az = ws.dAxisW[3 * d + 2];
      let delta: number;
      if (kind === JOINT_SLIDER) {
        // A slider's best move: the error's projection on its axis.
        delta = ax * (t[0] - ws.foot[0]) + ay * (t[1] - ws.foot[1]) + az * (t[2] - ws.foot[2]);
      } else {
        // A hinge's: the angle between pivot→sole and pivot→target projected on the plane ⟂ its axis.
        const px = ws.jPos[3 * j];
        const py = ws.jPos[3 * j + 1];
        const pz = ws.jPos[3 * j + 2];
        let r1x = ws.foot[0] - px;
        let r1y = ws.foot[1] - py;
        let r1z = ws.foot[2] - pz;
        let r2x = t[0] - px;
        let r2y = t[1] - py;
        let r2z = t[2] - pz;
        const p1 = r1x * ax + r1y * ay + r1z * az;
        const p2 = r2x * ax + r2y * ay + r2z * az;
        r1x -= p1 * ax;
        r1y -= p1 * ay;
        r1z -= p1 * az;
        r2x -= p2 * ax;
        r2y -= p2 * ay;
        r2z -= p2 * az;
        const cx = r1y * r2z - r1z * r2y;
        const cy = r1z * r2x - r1x * r2z;
        const cz = r1x * r2y - r1y * r2x;
        const s = ax * cx + ay * cy + az * cz;
        const c = r1x * r2x + r1y * r2y + r1z * r2z;
        if (Math.abs(s) < HINGE_ALIGNED_BELOW && c >= 0) continue;
        delta = Math.atan2(s, c);
      }
      let v = ws.pose[d] + delta;
      if (v < ws.lo[d]) {
        v = ws.lo[d];
        hits++;
      } else if (v > ws.hi[d]) {
        v = ws.hi[d];
        hits++;
      }
      const ch = Math.abs(v - ws.pose[d]);
      if (ch > change) change = ch;
      ws.pose[d] = v;
      forwardKinematics(ws, j);
    }
  }
  ws.scalars[S_CHANGE] = change;
  return hits;
}

/**
 * Turn ball joint j by the shortest rotation taking pivot→sole onto
 * pivot→target (in its rest frame, premultiplied); the angle goes to
 * ws.scalars[S_MOVE]. False when the two are parallel (nothing turned).
 */
function turnBallTowardTarget(ws: IKWorkspace, j: number, d0: number): boolean {
  const t = ws.target;
  const px = ws.jPos[3 * j];
  const py = ws.jPos[3 * j + 1];
  const pz = ws.jPos[3 * j + 2];
  const r1x = ws.foot[0] - px;
  const r1y = ws.foot[1] - py;
  const r1z = ws.foot[2] - pz;
  const r2x = t[0] - px;
  const r2y = t[1] - py;
  const r2z = t[2] - pz;
  const cx = r1y * r2z - r1z * r2y;
  const cy = r1z * r2x - r1x * r2z;
  const cz = r1x * r2y - r1y * r2x;
  const sn = Math.sqrt(cx * cx + cy * cy + cz * cz);
  if (sn < BALL_DEGENERATE_BELOW) return false;
  const ang = Math.atan2(sn, r1x * r2x + r1y * r2y + r1z * r2z);
  const k = ang / sn;
  const wx = cx * k;
  const wy = cy * k;
  const wz = cz * k;
  // World rotation vector → the ball's rest frame (its axes are the columns stored by FK).
  const A = ws.dAxisW;
  TURN[0] = A[3 * d0] * wx + A[3 * d0 + 1] * wy + A[3 * d0 + 2] * wz;
  TURN[1] = A[3 * d0 + 3] * wx + A[3 * d0 + 4] * wy + A[3 * d0 + 5] * wz;
  TURN[2] = A[3 * d0 + 6] * wx + A[3 * d0 + 7] * wy + A[3 * d0 + 8] * wz;
  fromRotationVector(TURN_QUAT, 0, TURN, 0);
  premultiplyUnit(ws.quat, 4 * ws.jBall[j], TURN_QUAT, 0);
  ws.scalars[S_MOVE] = ang;
  return true;
}
