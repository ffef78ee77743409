/**
 * Drive mode's walk: the game runtime itself (engine/profile/runtime.ts, createRigRuntime) over the course, with
 * the form's unsaved setup and the stumble detector on, steered the way a game steers it: the stick or keys ask
 * for a speed along the body's own facing and a turn rate; letting go brings every foot to a planted rest.
 */
import type { Heightfield } from '../../engine/course/heightfield';
import { createPathTrack, trackPoint } from '../../engine/course/walk-path';
import { resolveGait } from '../../engine/gait/gait-params';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { createRigRuntime, RUNTIME_STUMBLE_KINDS, type LegRuntime } from '../../engine/profile/runtime';
import type { StumbleKind } from '../../engine/metrics/stumble-thresholds';
import type { WalkPose } from '../trial/walk-scene';

export const DRIVE_STUMBLE_KINDS: readonly StumbleKind[] = RUNTIME_STUMBLE_KINDS;
/** Turn rate at a full sideways push, rad/s (about a quarter turn a second: common practice, no source). */
export const DRIVE_TURN_RATE = 1.5;

export interface DriveWalk {
  /** Advance by a frame time (s) with the forward share (0–1) and turn (−1 right … 1 left) asked for; the pose to draw. */
  advance(dt: number, forward: number, turn: number): WalkPose;
  /** Stumbles counted so far, in the order of DRIVE_STUMBLE_KINDS. */
  counts(out: Int32Array): Int32Array;
  /** Every foot planted and the body standing. */
  readonly resting: boolean;
  /** The runtime's first problem (its ground), or null. */
  readonly problem: string | null;
  /** The body's heading after the last advance (rad about +Y, 0 faces +Z, π/2 faces +X). */
  readonly heading: number;
}

/**
 * Where the driven character stands at first: on a course with a walk path, its first point, facing along the
 * path there (where the course's trials start); otherwise null, and the runtime starts where a straight trial does.
 */
export function driveStart(course: Heightfield): { position: [number, number]; heading: number } | null {
  if (!course.walkPath) return null;
  const at = new Float64Array(3);
  trackPoint(createPathTrack(course.walkPath), 0, at);
  return { position: [at[0], at[1]], heading: at[2] };
}

export function createDriveWalk(rig: Rig, setup: LegSetup, course: Heightfield): DriveWalk {
  const start = driveStart(course);
  const legs: LegRuntime = createRigRuntime(rig, setup, course, { standing: true, watchStumbles: true, ...(start ?? {}) });
  // Full forward is the setup's own walking speed: the speed its trials are scored at.
  const fullSpeed = resolveGait(setup.gait, rig).speed;
  const L = legs.legNames.length;
  const m = new Float64Array(16);
  const q = new Float64Array(4);
  const body = new Float64Array(3);
  const foot = new Float64Array(3);
  const feet = new Float64Array(3 * L);
  const targets = new Float64Array(3 * L);
  const contact = new Uint8Array(L);
  const joints = rig.legs.map((l) => new Float64Array(3 * l.chain.joints.length));
  const pose: WalkPose = { body: [0, 0, 0], pitch: 0, roll: 0, feet, targets, contact, joints, rotation: [0, 0, 0, 1] };
  const clamp = (v: number, lo: number, hi: number) => (Number.isFinite(v) ? Math.max(lo, Math.min(hi, v)) : 0);
  /** The heading of a body rotation [x, y, z, w]: its +Z turned by it and flattened onto the ground. */
  const facing = (r: Float64Array) => {
    const fx = 2 * (r[0] * r[2] + r[3] * r[1]);
    const fz = 1 - 2 * (r[0] * r[0] + r[1] * r[1]);
    return Math.atan2(fx, fz);
  };
  let heading = start?.heading ?? 0;

  return {
    advance(dt, forward, turn) {
      legs.bodyRotation(q);
      const before = facing(q);
      const v = clamp(forward, 0, 1) * fullSpeed;
      legs.drive(Math.sin(before) * v, Math.cos(before) * v, clamp(turn, -1, 1) * DRIVE_TURN_RATE);
      if (Number.isFinite(dt) && dt > 0) legs.update(dt);

      legs.bodyPosition(body);
      legs.bodyRotation(q);
      heading = facing(q);
      pose.body = [body[0], body[1], body[2]];
      pose.rotation = [q[0], q[1], q[2], q[3]];
      for (let i = 0; i < L; i++) {
        legs.footPosition(i, foot);
        feet.set(foot, 3 * i);
        legs.footTarget(i, foot);
        targets.set(foot, 3 * i);
        contact[i] = legs.inStance(i) ? 1 : 0;
        const J = joints[i].length / 3;
        for (let k = 0; k < J; k++) {
          legs.jointWorldMatrix(i, k, m);
          joints[i][3 * k] = m[12];
          joints[i][3 * k + 1] = m[13];
          joints[i][3 * k + 2] = m[14];
        }
      }
      return pose;
    },
    counts: (out) => legs.stumbleCounts(out),
    get resting() {
      return legs.resting;
    },
    get problem() {
      return legs.lastError?.message ?? null;
    },
    get heading() {
      return heading;
    },
  };
}
