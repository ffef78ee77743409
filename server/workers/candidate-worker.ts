/** One dial-in candidate on a worker: its setup walked over every course of the suite, scored by the footing penalty. */
import { decodeCourse } from '../../engine/course/encoding';
import { evaluateCandidate, type CandidateOutcome } from '../../engine/dialin/objective';
import { withValues, type CandidateTask } from './dial-in-search';

export function runCandidateTask({ payload }: { payload: CandidateTask }): CandidateOutcome {
  const { context, values } = payload;
  const courses = context.courses.map((c) => decodeCourse(c));
  return evaluateCandidate(context.rig, withValues(context.base, values), courses, context.options);
}
