import type { AppDeps } from '../deps';
import { HttpError } from '../errors';
import type { JobRunner } from '../jobs/job-runner';

/** The app's job runner; an app built without one (some API-only tests) answers 503 on job routes. */
export function jobRunnerOf(deps: AppDeps): JobRunner {
  if (!deps.jobs) throw new HttpError(503, 'jobs_unavailable', 'Background jobs are not running on this server.');
  return deps.jobs;
}
