/**
 * One dial-in search on a worker thread (dial-in-search.ts), reporting every candidate over the task's
 * port so the job shows progress and the best-so-far plot while it runs.
 */
import type { MessagePort } from 'node:worker_threads';
import { decodeCourse, type CourseEncoding } from '../../engine/course/encoding';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { TrialOptionsInput } from '../../engine/gait/trial';
import type { DialInParam } from '../../schemas/dial-ins';
import { searchSetup, type SearchResult } from './dial-in-search';

export interface DialInTask {
  rig: Rig;
  base: LegSetup;
  params: DialInParam[];
  courses: CourseEncoding[];
  budget: number;
  seed: number;
  start: number[] | null;
  options: TrialOptionsInput;
}

export interface CandidateMessage {
  tried: number;
  score: number;
  best: number;
}

export function runDialInTask({ payload, port }: { payload: DialInTask; port?: MessagePort }): SearchResult {
  const courses = payload.courses.map((c) => decodeCourse(c));
  return searchSetup({ ...payload, courses }, (c, tried, best) => {
    const m: CandidateMessage = { tried, score: c.score, best: best.score };
    port?.postMessage(m);
  });
}
