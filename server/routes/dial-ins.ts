import type { AppDeps } from '../deps';
import { HttpError, parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { dialInAcceptSchema, dialInRequestSchema } from '../../schemas/dial-ins';
import type { JobAccepted } from '../../schemas/jobs';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { loadSuiteCoursesToRun } from '../services/courses';
import { attachReservation, releaseReservation, reserveAllowance } from '../services/billing-limits';
import { findLegSetup, resolveLegSetup } from '../services/leg-setups';
import { acceptDialIn } from '../services/dial-in-accept';
import { loadCharacterRig } from '../services/characters';
import type { DialInJobInput } from '../jobs/dial-in-job';
import { jobRunnerOf } from './job-runner-of';
import { assertRunnable } from '../services/submission-checks';
import { trialStartProblems } from '../../engine/gait/setup-problems';
import { EDITORS } from '../role-sets';
import { START_DIAL_INS } from './dial-in-allowance';
import { declareRoutes, idOf, permission } from './declare';

const ACCEPT = permission('dial-ins.accept', 'Accept dial-in results', EDITORS);

/** Dial-ins: start one as a job (202); accept a finished one as a new leg setup version (201). */
export function dialInsRoutes(deps: AppDeps) {
  const routes = declareRoutes('/dial-ins');
  routes.id('id', 'That dial-in');

  routes.post('/', START_DIAL_INS, async (req, res) => {
    const { team, user } = viewerOf(req);
    const ask = parseWith(dialInRequestSchema, req.body);
    const character = await loadCharacterRig(deps.db, team.id, ask.characterId);
    const resolved = await resolveLegSetup(deps.db, team.id, character, { legSetupId: ask.legSetupId });
    const courses = await loadSuiteCoursesToRun(deps.db, team.id, ask.suiteId);
    // Whatever the job would fail on is refused now (before any allowance is held), naming the setting and the fix.
    assertRunnable(character.rig, resolved.setup, courses, { field: 'setup', courseField: 'suiteId', options: { duration: TRIAL_SECONDS } });
    // A longer stance needs more course ahead: the longest the search may try must fit too.
    const duty = ask.params.findIndex((p) => p.key === 'gait.dutyFactor');
    if (duty >= 0 && ask.params[duty].max > resolved.setup.gait.dutyFactor) {
      const longest = { ...resolved.setup, gait: { ...resolved.setup.gait, dutyFactor: ask.params[duty].max } };
      const [problem] = trialStartProblems(character.rig, longest, courses, { duration: TRIAL_SECONDS });
      if (problem) {
        const message = `At duty factor ${ask.params[duty].max}, ${problem.message.charAt(0).toLowerCase()}${problem.message.slice(1)} Or lower the upper bound of the duty factor.`;
        throw new HttpError(400, 'cannot_run', message, { [`params.${duty}.max`]: message });
      }
    }
    // The candidates are held against the month's allowance now (refused when they would not fit); what the job does not run is given back when it ends.
    const jobs = jobRunnerOf(deps);
    const held = await reserveAllowance(deps.db, team.id, 'dialInCandidates', ask.candidates, deps.clock.now());
    const input: DialInJobInput = {
      characterId: character.id,
      suiteId: ask.suiteId,
      courseIds: courses.map((c) => c.id),
      base: resolved.setup,
      baseLegSetupId: resolved.legSetupId,
      params: ask.params,
      candidates: ask.candidates,
      seed: ask.seed,
      duration: TRIAL_SECONDS,
    };
    const body: JobAccepted = { job: await jobs.enqueue({ teamId: team.id, userId: user.id, kind: 'dial-in', input }).catch(releaseReservation(deps.db, held)) };
    await attachReservation(deps.db, held, body.job.id);
    res.status(202).json(body);
  });

  routes.post('/:id/accept', ACCEPT, async (req, res) => {
    const { team, user } = viewerOf(req);
    const id = idOf(req);
    const { note } = parseWith(dialInAcceptSchema, req.body);
    const legSetupId = await acceptDialIn(deps.db, { teamId: team.id, userId: user.id, jobId: id, note, now: deps.clock.now() });
    res.status(201).json({ legSetup: await findLegSetup(deps.db, team.id, legSetupId) });
  });

  return routes;
}
