import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import { checkLimit, usageMonth } from '../services/billing-limits';
import { planById } from '../services/plans';
import type { DialInAllowance } from '../../schemas/dial-in-allowance';
import { EDITORS } from '../role-sets';
import { declareRoutes, permission } from './declare';

/** Reading the allowance is part of starting a dial-in (routes/dial-ins.ts starts them under the same action). */
export const START_DIAL_INS = permission('dial-ins.run', 'Start dial-ins', EDITORS);

/** GET /api/dial-ins/allowance: the month's dial-in candidates (used or held by running dial-ins), read before starting one. */
export function dialInAllowanceRoutes(deps: AppDeps) {
  const routes = declareRoutes('/dial-ins/allowance');
  routes.get('/', START_DIAL_INS, async (req, res) => {
    const { team } = viewerOf(req);
    const now = deps.clock.now();
    const check = await checkLimit(deps.db, team.id, 'dialInCandidates', { adding: 0, now });
    const body: DialInAllowance = { planName: planById(check.plan).name, used: check.used, limit: check.limit, month: usageMonth(now) };
    res.json(body);
  });
  return routes;
}
