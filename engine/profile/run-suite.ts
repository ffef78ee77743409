/** One leg setup walked over every course of a suite, in-process (a 60 s trial takes tens of milliseconds). */
import type { Heightfield } from '../course/heightfield';
import type { Rig } from '../gait/rig';
import { runTrial, type TrialOptionsInput, type TrialResult } from '../gait/trial';
import { summariseSuite, type SuiteMetrics } from './suite-metrics';

export interface SuiteCourse {
  name: string;
  heightfield: Heightfield;
}

export interface SuiteRun {
  metrics: SuiteMetrics;
  trials: { course: string; result: TrialResult }[];
}

export function runSuite(rig: Rig, setup: unknown, courses: readonly SuiteCourse[], options: TrialOptionsInput = {}): SuiteRun {
  const trials = courses.map((c) => {
    try {
      return { course: c.name, result: runTrial(rig, setup, c.heightfield, options) };
    } catch (err) {
      throw new Error(`course ${c.name}: ${(err as Error).message}`);
    }
  });
  return { metrics: summariseSuite(trials.map((t) => ({ course: t.course, metrics: t.result.metrics }))), trials };
}
