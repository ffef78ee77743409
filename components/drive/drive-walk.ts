/**
 * Drive mode's walk: the live preview's engine walk (the trial loop, with its stumble detector) on a clock that
 * runs only while the player pushes forward, at the share pushed. Letting go holds the walk where it is.
 *
 * Kept in this one file so the drive mode can move onto the game runtime's own drive (engine/profile/runtime.ts:
 * drive(vx, vz, turnRate), turning, planted rest) once that reports stumbles too: the view only calls this.
 */
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { STUMBLE_KINDS, type StumbleKind } from '../../engine/metrics/stumble-thresholds';
import { createLiveWalk } from '../preview/live-walk';
import type { WalkPose } from '../trial/walk-scene';

export const DRIVE_STUMBLE_KINDS: readonly StumbleKind[] = STUMBLE_KINDS;

export interface DriveWalk {
  /** Advance by a frame time (s) with the forward share pushed (0–1); the pose to draw. */
  advance(dt: number, forward: number): WalkPose;
  /** Stumbles counted since the walk (re)started, in the order of DRIVE_STUMBLE_KINDS. */
  counts(out: Int32Array): Int32Array;
}

export function createDriveWalk(rig: Rig, setup: LegSetup, course: Heightfield): DriveWalk {
  const live = createLiveWalk(rig, setup, course);
  let clock = 0;
  return {
    advance(dt, forward) {
      const share = Number.isFinite(forward) ? Math.max(0, Math.min(1, forward)) : 0;
      if (Number.isFinite(dt) && dt > 0) clock += dt * 1000 * share;
      return live.advance(clock);
    },
    counts(out) {
      const c = live.counts();
      DRIVE_STUMBLE_KINDS.forEach((k, i) => (out[i] = c[k]));
      return out;
    },
  };
}
