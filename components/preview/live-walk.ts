/**
 * The live preview's walk: the same engine trial loop as a stored trial, stepped in the browser at display
 * rate (as many fixed steps as the wall clock asks, at most a few per frame), starting over at the end.
 */
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { createTrial, stepTrial, type Trial } from '../../engine/gait/trial';
import { STUMBLE_KINDS, type StumbleKind } from '../../engine/metrics/stumble-thresholds';
import type { WalkPose } from '../trial/walk-scene';

/** Most trial steps per displayed frame, so a slow frame does not stall the page. */
const MAX_STEPS_PER_FRAME = 4;
const PREVIEW_SECONDS = 30;

export interface LiveWalk {
  trial: Trial;
  advance(now: number): WalkPose;
  counts(): Record<StumbleKind, number>;
}

export function createLiveWalk(rig: Rig, setup: LegSetup, course: Heightfield): LiveWalk {
  let trial = createTrial(rig, setup, course, { duration: PREVIEW_SECONDS, recordRate: 1 });
  let started: number | null = null;
  const joints: ArrayLike<number>[] = rig.legs.map(() => []);
  const walk: LiveWalk = {
    trial,
    advance(now) {
      started ??= now;
      const due = Math.floor(((now - started) / 1000) / trial.options.timeStep);
      for (let k = 0; k < MAX_STEPS_PER_FRAME && trial.frame < due; k++) {
        if (!stepTrial(trial)) {
          trial = createTrial(rig, setup, course, { duration: PREVIEW_SECONDS, recordRate: 1 });
          walk.trial = trial;
          started = now;
          break;
        }
      }
      // Behind the wall clock after slow frames: drop the backlog rather than race to catch up.
      if (due - trial.frame > MAX_STEPS_PER_FRAME) started = now - (trial.frame * trial.options.timeStep * 1000);
      trial.solvers.forEach((ws, i) => (joints[i] = ws.jPos));
      return {
        body: [trial.bodyPos[0], trial.bodyPos[1], trial.bodyPos[2]],
        pitch: trial.pitch.value,
        roll: trial.roll.value,
        feet: trial.foot,
        targets: trial.target,
        contact: trial.stance,
        joints,
      };
    },
    counts() {
      return Object.fromEntries(STUMBLE_KINDS.map((k, i) => [k, trial.record.detector.counts[i]])) as Record<StumbleKind, number>;
    },
  };
  return walk;
}
