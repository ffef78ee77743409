import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { createTokenSchema, type ApiTokenList, type CreatedToken } from '../../schemas/tokens';
import { createToken, listTokens, revokeToken } from '../services/api-tokens';
import { parseId } from './profiles';

/** API tokens of the team: list, create (the secret is in this one answer only), revoke. */
export function tokensRouter(deps: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const body: ApiTokenList = { tokens: await listTokens(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const { team, user } = viewerOf(req);
    const { name } = parseWith(createTokenSchema, req.body);
    const body: CreatedToken = await createToken(deps.db, { teamId: team.id, userId: user.id, name, now: deps.clock.now() });
    res.setHeader('Cache-Control', 'no-store');
    res.status(201).json(body);
  });

  router.delete('/:id', async (req, res) => {
    const { team } = viewerOf(req);
    res.json({ token: await revokeToken(deps.db, team.id, parseId(req.params.id, 'That token'), deps.clock.now()) });
  });

  return router;
}
