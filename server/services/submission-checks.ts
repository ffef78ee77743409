/**
 * Refuse at submission what a trial or dial-in job would fail on: the leg setup against its schema and the
 * rig, and the engine's own trial set-up on every course (course long enough for the stride, options).
 * Refusals are a 400 whose field messages name the setting and the fix. A job that fails anyway stores a
 * readable reason (readableJobFailure), never raw validation output.
 */
import { ZodError } from 'zod';
import { HttpError, validationError } from '../errors';
import { fieldMessages } from '../../schemas/errors';
import { legSetupProblems, setupIssueSentence, trialStartProblems, valueAtPath, type IssueLike, type NamedCourse, type SetupProblem } from '../../engine/gait/setup-problems';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { TrialOptionsInput } from '../../engine/gait/trial';

function refusal(problems: SetupProblem[], field: string, courseField: string): HttpError {
  const fields: Record<string, string> = {};
  for (const p of problems) {
    const key = p.path === 'course' ? courseField : p.path ? `${field}.${p.path}` : field;
    if (!(key in fields)) fields[key] = p.message;
  }
  const first = problems[0].message;
  const more = problems.length > 1 ? ` (and ${problems.length - 1} more: see the messages beside the settings)` : '';
  return new HttpError(400, 'cannot_run', `This cannot run yet: ${first}${more}`, fields);
}

/**
 * Throws a 400 naming each setting that stops `setup` walking `rig` over `courses`. `field` prefixes the
 * setup's paths in the field messages ('legSetup' for a setup sent with the request, 'setup' for a saved
 * version or the defaults); `courseField` is where a course's problem is told ('courseId' or 'suiteId').
 */
export function assertRunnable(rig: Rig, setup: unknown, courses: readonly NamedCourse[], o: { field: string; courseField: string; options?: TrialOptionsInput }): void {
  const problems = legSetupProblems(setup, rig);
  if (problems.length === 0) problems.push(...trialStartProblems(rig, setup as LegSetup, courses, o.options));
  if (problems.length) throw refusal(problems, o.field, o.courseField);
}

/**
 * parseWith for a request that may carry a leg setup under `setupKey`: the setup's issues are told as
 * sentences naming the setting and the fix; the other fields keep the schema's own messages.
 */
export function parseSubmission<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: ZodError } }, body: unknown, setupKey = 'legSetup'): T {
  const result = schema.safeParse(body ?? {});
  if (result.success) return result.data;
  const setup = (body as Record<string, unknown> | null)?.[setupKey];
  const ours = result.error.issues.filter((i) => i.path[0] === setupKey);
  if (ours.length === 0) throw validationError(result.error);
  const fields = fieldMessages(result.error.issues.filter((i) => i.path[0] !== setupKey));
  for (const issue of ours) {
    const inner = { ...(issue as unknown as IssueLike), path: issue.path.slice(1) };
    const key = issue.path.map(String).join('.');
    if (!(key in fields)) fields[key] = setupIssueSentence(inner, valueAtPath(setup, inner.path));
  }
  const first = fields[ours[0].path.map(String).join('.')];
  throw new HttpError(400, 'invalid_input', first, fields);
}

interface RawIssue {
  code?: string;
  path?: unknown[];
  message?: string;
}

const isIssueList = (v: unknown): v is RawIssue[] => Array.isArray(v) && v.length > 0 && v.every((i) => i && typeof i === 'object' && Array.isArray((i as RawIssue).path) && typeof (i as RawIssue).message === 'string');

/** Issues of a stored job input are under 'setup' (trial) or 'base' (dial-in): strip that to name the setting. */
function issueSentences(issues: RawIssue[], input: unknown): string {
  return issues
    .map((i) => {
      const path = (i.path ?? []).map(String);
      const inSetup = path[0] === 'setup' || path[0] === 'base';
      return setupIssueSentence({ ...(i as IssueLike), path: inSetup ? path.slice(1) : path }, valueAtPath(input, path));
    })
    .join(' ');
}

/**
 * What a failed job tells the person who started it: zod issues (thrown here or serialised by a worker) become
 * sentences naming the setting (`input`, the job's stored input, gives the values); a prettified zod report loses
 * its symbols; anything else is kept as it is.
 */
export function readableJobFailure(err: unknown, input?: unknown): string {
  if (err instanceof ZodError) return issueSentences(err.issues as unknown as RawIssue[], input);
  const message = err instanceof Error ? err.message : String(err);
  const start = message.indexOf('[{');
  const end = message.lastIndexOf('}]');
  if (start >= 0 && end > start) {
    try {
      const issues: unknown = JSON.parse(message.slice(start, end + 2));
      if (isIssueList(issues)) return `${message.slice(0, start)}${issueSentences(issues, input)}`.trim();
    } catch {
      // Not JSON after all: fall through and keep the message.
    }
  }
  if (message.includes('✖')) {
    return message
      .split('\n')
      .map((l) => l.trim())
      .filter(Boolean)
      .reduce<string[]>((out, line) => {
        if (line.startsWith('→ at ')) out[out.length - 1] = `${line.slice(5)}: ${out[out.length - 1]}`;
        else out.push(line.replace(/^✖\s*/, ''));
        return out;
      }, [])
      .join('; ');
  }
  return message;
}
