import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { createTokenSchema, type ApiTokenList, type CreatedToken } from '../../schemas/tokens';
import { createToken, listTokens, revokeToken } from '../services/api-tokens';
import { TOKEN_KEEPERS } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

const MANAGE = permission('tokens.manage', 'Create and revoke API tokens', TOKEN_KEEPERS);

/** API tokens of the team: list, create (the secret is in this one answer only), revoke. */
export function tokensRoutes(deps: AppDeps) {
  const routes = declareRoutes('/tokens');
  routes.id('id', 'That token');

  routes.get('/', MANAGE, async (req, res) => {
    const body: ApiTokenList = { tokens: await listTokens(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  routes.post('/', MANAGE, async (req, res) => {
    const { team, user } = viewerOf(req);
    const { name } = parseWith(createTokenSchema, req.body);
    const body: CreatedToken = await createToken(deps.db, { teamId: team.id, userId: user.id, name, now: deps.clock.now() });
    res.setHeader('Cache-Control', 'no-store');
    res.status(201).json(body);
  });

  routes.delete('/:id', MANAGE, async (req, res) => {
    const { team } = viewerOf(req);
    res.json({ token: await revokeToken(deps.db, team.id, idOf(req), deps.clock.now()) });
  });

  return routes;
}
