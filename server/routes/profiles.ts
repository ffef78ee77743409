import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { HttpError, notFound, parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { profileDiffQuerySchema, publishProfileSchema, type ProfileDetail, type ProfileList } from '../../schemas/profiles';
import { legProfileJsonSchemaText } from '../../engine/profile/export';
import { diffVersions, listProfiles, profileDetail, publishProfile } from '../services/profiles';

const idSchema = z.coerce.number().int().positive();
export const parseId = (raw: unknown, what: string) => {
  const id = idSchema.safeParse(raw);
  if (!id.success) throw notFound(what);
  return id.data;
};

/** GET /api/schema/leg-profile.json: public, generated from the zod schema (the repository keeps the same text). */
export function legProfileSchemaRouter(): Router {
  const router = Router();
  const text = legProfileJsonSchemaText();
  router.get('/leg-profile.json', (_req, res) => {
    res.setHeader('Content-Type', 'application/schema+json; charset=utf-8');
    res.setHeader('Cache-Control', 'public, max-age=300');
    res.send(text);
  });
  return router;
}

/** Leg profiles for the app: list, versions, diffs, publish. Published versions are never changed. */
export function profilesRouter(deps: AppDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const body: ProfileList = { profiles: await listProfiles(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  router.get('/:id', async (req, res) => {
    const body: ProfileDetail = await profileDetail(deps.db, viewerOf(req).team.id, parseId(req.params.id, 'That leg profile'));
    res.json(body);
  });

  router.get('/:id/diff', async (req, res) => {
    const { team } = viewerOf(req);
    const id = parseId(req.params.id, 'That leg profile');
    const q = parseWith(profileDiffQuerySchema, req.query);
    res.json({ diff: await diffVersions(deps.db, team.id, id, q.from, q.to) });
  });

  router.post('/', async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(publishProfileSchema, req.body);
    const published = await publishProfile(deps.db, { ...input, teamId: team.id, author: { id: user.id, name: user.name }, now: deps.clock.now() });
    res.status(201).json(published);
  });

  const immutable = () => {
    throw new HttpError(409, 'immutable', 'Published leg profile versions cannot be changed or deleted: game builds may depend on them. Publish a new version instead.');
  };
  router.put('/:id/versions/:version', immutable);
  router.patch('/:id/versions/:version', immutable);
  router.delete('/:id/versions/:version', immutable);

  return router;
}
