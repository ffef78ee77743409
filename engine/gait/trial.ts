/**
 * The trial: a walk (walk.ts) across a course at a fixed time step, with a
 * recorder (trial-record.ts) observing it: stumbles, step responses, tracking
 * and the series. The body follows the course's walk path, or walks straight
 * ahead along +Z when it has none. Deterministic: no clocks, no randomness;
 * no arrays or objects are allocated per frame.
 *
 * `createTrial` + `stepTrial` let a live preview advance frame by frame;
 * `runTrial` runs the whole walk and returns metrics and series.
 */
import * as groundQueries from '../course/ground';
import type { Heightfield } from '../course/heightfield';
import { courseLength } from '../course/heightfield';
import { parseOrThrow } from '../course/parse';
import { createPathTrack } from '../course/walk-path';
import { resolveGait } from './gait-params';
import { parseLegSetup } from './leg-setup';
import * as trialRecord from './trial-record';
import { END_MARGIN, TrialOptionsSchema, type TrialOptionsInput } from './trial-options';
import type { Trial, TrialResult } from './trial-state';
import * as walkModule from './walk';

export type { Trial, TrialResult } from './trial-state';
export type { TrialRecorder } from './trial-record';
export * from './trial-options';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { heightfieldGround } = groundQueries;
const { createRecorder, finishRecord, observeSolved, observeStep } = trialRecord;
const { createWalk, solveLegs, stepWalk } = walkModule;

/** Set up a trial; the setup and options are validated and bad input throws naming the problem. */
export function createTrial(rig: import('./rig').Rig, setupInput: unknown, course: Heightfield, optionsInput: TrialOptionsInput = {}): Trial {
  const options = parseOrThrow(TrialOptionsSchema, optionsInput, 'trial options');
  const setup = parseLegSetup(setupInput);
  const dt = options.timeStep;
  const track = course.walkPath ? createPathTrack(course.walkPath) : null;
  let startZ = 0;
  let lastBodyZ = Infinity;
  let lastS = Infinity;
  if (track) {
    if (!track.closed) {
      lastS = track.length;
      const stride = resolveGait(setup.gait, rig).stride;
      if (track.length < stride) {
        throw new Error(`course too short: its walk path is ${track.length.toFixed(2)} m long, less than one ${stride.toFixed(2)} m stride`);
      }
    }
  } else {
    // Checked here before the walk is built, so a course too short is named before anything else.
    const gait = resolveGait(setup.gait, rig);
    let reachAhead = 0;
    let reachBehind = 0;
    for (const l of rig.legs) {
      reachAhead = Math.max(reachAhead, l.neutralFoot[1], l.hip[2]);
      reachBehind = Math.max(reachBehind, -l.neutralFoot[1], -l.hip[2]);
    }
    startZ = options.startZ ?? reachBehind + gait.stride + 0.2;
    // The furthest touchdown target lies one cycle ahead of the body plus half a stance.
    lastBodyZ = courseLength(course) - END_MARGIN - reachAhead - gait.stride * (1 + gait.dutyFactor / 2);
    const available = (lastBodyZ - startZ) / gait.speed;
    if (!(available > dt)) {
      throw new Error(
        `course too short: ${courseLength(course).toFixed(2)} m leaves no room to walk from z = ${startZ.toFixed(2)} m with a ${gait.stride.toFixed(2)} m stride`,
      );
    }
  }
  const walk = createWalk(rig, setup, heightfieldGround(course), {
    timeStep: dt,
    replanDistance: options.thresholds.reachMissResidual,
    track,
    pathSpeed: course.walkPath?.speed ?? null,
    startZ,
  });
  // The walk ends at the end of the ground or its path, or at the duration asked for: slowing on steep ground takes longer.
  const totalFrames = Math.floor(options.duration / dt + 1e-9);
  const record = createRecorder(walk, options.thresholds, totalFrames, options.recordRate);
  const t = Object.assign(walk, { course, options, totalFrames, startZ, lastBodyZ, track, lastS, record }) as Trial;
  observeSolved(record, t, 0, false);
  return t;
}

/** Share of the walk done, 0..1: the further of time and distance, since a walk ends at the course's end or its duration. */
export function trialProgress(t: Trial): number {
  const byTime = t.frame / t.totalFrames;
  const byDistance = t.track ? (t.track.closed ? 0 : t.motion.s / t.lastS) : (t.bodyPos[2] - t.startZ) / (t.lastBodyZ - t.startZ);
  const p = byTime > byDistance ? byTime : byDistance;
  return p < 0 ? 0 : p > 1 ? 1 : p;
}

function walking(t: Trial): boolean {
  return t.frame < t.totalFrames && (t.track ? t.motion.s < t.lastS : t.bodyPos[2] < t.lastBodyZ);
}

/** Advance one frame; returns false once the trial is over. */
export function stepTrial(t: Trial): boolean {
  if (!walking(t)) return false;
  stepWalk(t);
  const time = t.frame * t.timeStep;
  observeStep(t.record, t, time);
  solveLegs(t);
  observeSolved(t.record, t, time, true);
  return walking(t);
}

/** Close the open windows and compute the metrics. */
export function finishTrial(t: Trial): TrialResult {
  return finishRecord(t.record, t);
}

/** Walk `rig` over `course` with `setup`; deterministic: the same inputs give bit-identical results. */
export function runTrial(rig: import('./rig').Rig, setup: unknown, course: Heightfield, options: TrialOptionsInput = {}): TrialResult {
  const t = createTrial(rig, setup, course, options);
  while (stepTrial(t));
  return finishTrial(t);
}
