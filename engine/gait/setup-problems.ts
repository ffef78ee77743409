/**
 * What stops a leg setup from walking a rig over a course, as sentences a person can act on: each names the
 * setting, its value and limit, and the fix. The server runs these at submission, so a trial or dial-in that
 * cannot run is refused with field messages instead of failing as a job; a job that still fails is told in
 * the same words (zod issues turned into sentences, never their raw text).
 */
import type { Heightfield } from '../course/heightfield';
import { LegSetupError, LegSetupSchema, checkLegSetupForRig, type LegSetup } from './leg-setup';
import type { Rig } from './rig';
import { createTrial, type TrialOptionsInput } from './trial';
import { nameOf, setupIssueSentence, valueAtPath, type IssueLike } from './setting-sentences';

export { setupIssueSentence, valueAtPath, type IssueLike } from './setting-sentences';

export interface SetupProblem {
  /** Dotted path inside the leg setup ('gait.stepHeight'), or '' for the setup as a whole. */
  path: string;
  message: string;
}

/** The rig check's messages start with the setting's path ("gait.pattern: …"); say it as a sentence. */
function rigProblem(err: LegSetupError): SetupProblem {
  const m = /^([\w.[\]]+): (.*)$/s.exec(err.message);
  if (!m) return { path: '', message: `${err.message}.` };
  const path = m[1].replace(/\[(\d+)\]/g, '.$1');
  const { label } = nameOf(path);
  return { path, message: `${label}: ${m[2]}. Change it in the leg setup form.` };
}

/** The rig check alone (leg and joint names, phase offsets per leg) for a setup that already parsed, as a sentence; null when it fits. */
export function rigFitProblem(setup: LegSetup, rig: Rig): SetupProblem | null {
  try {
    checkLegSetupForRig(setup, rig);
    return null;
  } catch (err) {
    if (err instanceof LegSetupError) return rigProblem(err);
    throw err;
  }
}

/** Every problem with a leg setup for a rig: the schema first (all its issues), then the checks that need the rig. */
export function legSetupProblems(input: unknown, rig: Rig): SetupProblem[] {
  const parsed = LegSetupSchema.safeParse(input);
  if (!parsed.success) {
    return parsed.error.issues.map((issue) => ({
      path: issue.path.map(String).join('.'),
      message: setupIssueSentence(issue as IssueLike, valueAtPath(input, issue.path), rig),
    }));
  }
  try {
    checkLegSetupForRig(parsed.data, rig);
  } catch (err) {
    if (err instanceof LegSetupError) return [rigProblem(err)];
    throw err;
  }
  return [];
}

export interface NamedCourse {
  name: string;
  heightfield: Heightfield;
}

/**
 * What would stop a trial of this setup on each course: the engine's own trial set-up is run (it checks the rig,
 * setup, options and that the course leaves room to walk) and its refusal is told as a sentence. Call it after
 * legSetupProblems found nothing. `path` is 'course' for a problem of one course.
 */
export function trialStartProblems(rig: Rig, setup: LegSetup, courses: readonly NamedCourse[], options: TrialOptionsInput = {}): SetupProblem[] {
  const problems: SetupProblem[] = [];
  for (const c of courses) {
    try {
      createTrial(rig, setup, c.heightfield, options);
    } catch (err) {
      const m = (err as Error).message;
      if (/^course too short/.test(m)) {
        problems.push({ path: 'course', message: `“${c.name}” is too short for this character: ${m.replace(/^course too short: /, '')}. Lengthen the course, or shorten the stride.` });
      } else {
        problems.push({ path: 'course', message: `A trial of “${c.name}” cannot start: ${m.replace(/\n/g, ' ')}.` });
      }
    }
  }
  return problems;
}
