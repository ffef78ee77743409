import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { legSetupCreateSchema, type LegSetupList } from '../../schemas/leg-setups';
import { assertFitsRig, findLegSetup, listLegSetups, saveLegSetup } from '../services/leg-setups';
import { loadCharacterRig } from '../services/characters';
import { EDITORS } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

const READ = permission('leg-setups.read', 'See leg setups', 'member');
const SAVE = permission('leg-setups.save', 'Save leg setups', EDITORS);

/** A character's leg setup versions, under /api/characters/:id/leg-setups. */
export function characterLegSetupsRoutes(deps: AppDeps) {
  const routes = declareRoutes('/characters');
  routes.id('id', 'That character');

  routes.get('/:id/leg-setups', READ, async (req, res) => {
    const { team } = viewerOf(req);
    const character = await loadCharacterRig(deps.db, team.id, idOf(req));
    const body: LegSetupList = {
      versions: await listLegSetups(deps.db, team.id, character.id),
      defaults: defaultLegSetup(character.rig),
      legNames: character.rig.legs.map((l) => l.name),
      rig: character.rig,
    };
    res.json(body);
  });

  routes.post('/:id/leg-setups', SAVE, async (req, res) => {
    const { team, user } = viewerOf(req);
    const character = await loadCharacterRig(deps.db, team.id, idOf(req));
    const input = parseWith(legSetupCreateSchema, req.body);
    assertFitsRig(input.setup, character.rig);
    const id = await saveLegSetup(deps.db, { teamId: team.id, characterId: character.id, userId: user.id, setup: input.setup, note: input.note, source: 'form', now: deps.clock.now() });
    res.status(201).json({ legSetup: await findLegSetup(deps.db, team.id, id) });
  });

  return routes;
}

/** One leg setup version by its id. */
export function legSetupsRoutes(deps: AppDeps) {
  const routes = declareRoutes('/leg-setups');
  routes.id('id', 'That leg setup');
  routes.get('/:id', READ, async (req, res) => {
    res.json({ legSetup: await findLegSetup(deps.db, viewerOf(req).team.id, idOf(req)) });
  });
  return routes;
}
