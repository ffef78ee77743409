import { z } from 'zod';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { assertRunnable, parseSubmission } from '../services/submission-checks';
import { viewerOf } from '../middleware/auth';
import { trialRequestSchema, TRIAL_SECONDS, type TrialList } from '../../schemas/trials';
import type { JobAccepted } from '../../schemas/jobs';
import { loadCourse, loadSuiteCoursesToRun } from '../services/courses';
import { resolveLegSetup } from '../services/leg-setups';
import { loadCharacterRig } from '../services/characters';
import { listTrials, trialDetail } from '../services/trials';
import type { TrialJobInput } from '../jobs/trial-job';
import { jobRunnerOf } from './job-runner-of';
import { EDITORS } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

const RUN = permission('trials.run', 'Run trials', EDITORS);
const READ = permission('trials.read', 'See trials', 'member');

const idSchema = z.coerce.number().int().positive();
const listQuerySchema = z.object({ characterId: idSchema.optional(), jobId: idSchema.optional() });

/** Trials: start one as a job (202), list, read one with its series. */
export function trialsRoutes(deps: AppDeps) {
  const routes = declareRoutes('/trials');
  routes.id('id', 'That trial');

  routes.post('/', RUN, async (req, res) => {
    const { team, user } = viewerOf(req);
    const ask = parseSubmission(trialRequestSchema, req.body);
    const character = await loadCharacterRig(deps.db, team.id, ask.characterId);
    const resolved = await resolveLegSetup(deps.db, team.id, character, ask);
    const courses = ask.courseId !== undefined ? [await loadCourse(deps.db, team.id, ask.courseId)] : await loadSuiteCoursesToRun(deps.db, team.id, ask.suiteId!);
    // Whatever the job would fail on is refused now, naming the setting and the fix.
    assertRunnable(character.rig, resolved.setup, courses, { field: ask.legSetup ? 'legSetup' : 'setup', courseField: ask.courseId !== undefined ? 'courseId' : 'suiteId', options: { duration: TRIAL_SECONDS } });
    const courseIds = courses.map((c) => c.id);
    const input: TrialJobInput = { characterId: character.id, courseIds, setup: resolved.setup, legSetupId: resolved.legSetupId, duration: TRIAL_SECONDS };
    const body: JobAccepted = { job: await jobRunnerOf(deps).enqueue({ teamId: team.id, userId: user.id, kind: 'trial', input }) };
    res.status(202).json(body);
  });

  routes.get('/', READ, async (req, res) => {
    const q = parseWith(listQuerySchema, req.query);
    const body: TrialList = { trials: await listTrials(deps.db, viewerOf(req).team.id, q) };
    res.json(body);
  });

  routes.get('/:id', READ, async (req, res) => {
    const teamId = viewerOf(req).team.id;
    res.json(await trialDetail(deps.db, teamId, idOf(req), async (characterId) => (await loadCharacterRig(deps.db, teamId, characterId)).rig));
  });

  return routes;
}
