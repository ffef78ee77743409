import { Router } from 'express';
import type { AppDeps } from '../deps';
import { viewerOf } from '../middleware/auth';
import { checkLimit, usageMonth } from '../services/billing-limits';
import { planById } from '../services/plans';
import type { DialInAllowance } from '../../schemas/dial-in-allowance';

/** GET /api/dial-ins/allowance: the month's dial-in candidates (used or held by running dial-ins), read before starting one. */
export function dialInAllowanceRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const { team } = viewerOf(req);
    const now = deps.clock.now();
    const check = await checkLimit(deps.db, team.id, 'dialInCandidates', { adding: 0, now });
    const body: DialInAllowance = { planName: planById(check.plan).name, used: check.used, limit: check.limit, month: usageMonth(now) };
    res.json(body);
  });
  return router;
}
