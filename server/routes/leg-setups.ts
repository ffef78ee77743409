import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { notFound, parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { legSetupCreateSchema, type LegSetupList } from '../../schemas/leg-setups';
import { assertFitsRig, findLegSetup, listLegSetups, loadWalkingCharacter, saveLegSetup } from '../services/leg-setups';

const idSchema = z.coerce.number().int().positive();

function idOr404(raw: unknown, what: string): number {
  const id = idSchema.safeParse(raw);
  if (!id.success) throw notFound(what);
  return id.data;
}

/** Leg setups: versions per character (mounted at /api, paths in full). */
export function legSetupsRouter(deps: AppDeps): Router {
  const router = Router();

  router.get('/characters/:id/leg-setups', async (req, res) => {
    const { team } = viewerOf(req);
    const character = await loadWalkingCharacter(deps.db, team.id, idOr404(req.params.id, 'That character'));
    const body: LegSetupList = {
      versions: await listLegSetups(deps.db, team.id, character.id),
      defaults: defaultLegSetup(character.rig),
      legNames: character.rig.legs.map((l) => l.name),
      rig: character.rig,
    };
    res.json(body);
  });

  router.post('/characters/:id/leg-setups', async (req, res) => {
    const { team, user } = viewerOf(req);
    const character = await loadWalkingCharacter(deps.db, team.id, idOr404(req.params.id, 'That character'));
    const input = parseWith(legSetupCreateSchema, req.body);
    assertFitsRig(input.setup, character.rig);
    const id = await saveLegSetup(deps.db, { teamId: team.id, characterId: character.id, userId: user.id, setup: input.setup, note: input.note, source: 'form', now: deps.clock.now() });
    res.status(201).json({ legSetup: await findLegSetup(deps.db, team.id, id) });
  });

  router.get('/leg-setups/:id', async (req, res) => {
    const { team } = viewerOf(req);
    res.json({ legSetup: await findLegSetup(deps.db, team.id, idOr404(req.params.id, 'That leg setup')) });
  });

  return router;
}
