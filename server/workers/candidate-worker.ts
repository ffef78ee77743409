/** One course of one dial-in candidate on a worker: the setup walked over the course, scored by the footing penalty. */
import { decodeCourse } from '../../engine/course/encoding';
import { evaluateCourse, type CourseOutcome } from '../../engine/dialin/objective';
import { withValues, type CandidateTask } from './dial-in-search';

export function runCandidateTask({ payload }: { payload: CandidateTask }): CourseOutcome {
  const { context, values, course } = payload;
  return evaluateCourse(context.rig, withValues(context.base, values), decodeCourse(context.courses[course]), context.options);
}
