/**
 * The solver's error iteration by iteration for one frame of a trial, found by replaying the trial in the
 * browser (the engine is deterministic, so the replay reaches the same state) and re-solving that frame's
 * leg from its warm start with a budget of 1, 2, … iterations.
 */
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { createTrial, stepTrial } from '../../engine/gait/trial';
import { setPose, solve } from '../../engine/ik';

export function solverErrorPerIteration(rig: Rig, setup: LegSetup, course: Heightfield, duration: number, frame: number, leg: number): number[] {
  const t = createTrial(rig, setup, course, { duration });
  while (t.frame < frame && stepTrial(t));
  const ws = t.solvers[leg];
  // After the frame, olderPose holds the pose the frame's solve started from (before extrapolation).
  const start = Float64Array.from(t.olderPose[leg]);
  const errors: number[] = [];
  const budget = t.setup.solver.maxIterations;
  for (let k = 1; k <= budget; k++) {
    setPose(ws, start);
    const r = solve(ws, t.targetOf[leg], t.orient[leg] ? t.targetNormalOf[leg] : null, { maxIterations: k });
    errors.push(r.positionError);
    if (r.iterations < k) break;
  }
  setPose(ws, t.prevPose[leg]);
  return errors;
}
