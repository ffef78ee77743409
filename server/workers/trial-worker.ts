/**
 * One trial on a worker thread: the engine's trial loop over one course, reporting the fraction done over
 * the task's port every few hundred frames. Returns the metrics and the compact series encoding.
 */
import type { MessagePort } from 'node:worker_threads';
import { decodeCourse, type CourseEncoding } from '../../engine/course/encoding';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { encodeSeries, type SeriesEncoding } from '../../engine/gait/series-encoding';
import { createTrial, finishTrial, stepTrial, trialProgress, type TrialOptionsInput } from '../../engine/gait/trial';
import type { TrialMetrics } from '../../engine/metrics/trial-metrics';

export interface TrialTask {
  rig: Rig;
  setup: LegSetup;
  course: CourseEncoding;
  options: TrialOptionsInput;
}

export interface TrialTaskResult {
  metrics: TrialMetrics;
  legNames: string[];
  series: SeriesEncoding;
}

/** Frames between progress messages. */
const REPORT_EVERY = 120;

export function runTrialTask({ payload, port }: { payload: TrialTask; port?: MessagePort }): TrialTaskResult {
  const t = createTrial(payload.rig, payload.setup, decodeCourse(payload.course), payload.options);
  while (stepTrial(t)) {
    if (port && t.frame % REPORT_EVERY === 0) port.postMessage({ fraction: trialProgress(t) });
  }
  const r = finishTrial(t);
  port?.postMessage({ fraction: 1 });
  return { metrics: r.metrics, legNames: r.legNames, series: encodeSeries(r.series) };
}
