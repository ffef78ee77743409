import type { AppDeps } from '../deps';
import { HttpError, parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { profileDiffQuerySchema, publishProfileSchema, type ProfileDetail, type ProfileList } from '../../schemas/profiles';
import { legProfileJsonSchemaText } from '../../engine/profile/export';
import { diffVersions, listProfiles, profileDetail, publishProfile } from '../services/profiles';
import { PUBLISHERS } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

const SCHEMA = permission('profiles.schema', 'Read the leg profile JSON Schema', 'public');
const READ = permission('profiles.read', 'See leg profiles and their versions', 'member');
const PUBLISH = permission('profiles.publish', 'Publish leg profile versions', PUBLISHERS);

/** GET /api/schema/leg-profile.json: public, generated from the zod schema (the repository keeps the same text). */
export function legProfileSchemaRoutes() {
  const routes = declareRoutes('/schema');
  const text = legProfileJsonSchemaText();
  routes.get('/leg-profile.json', SCHEMA, (_req, res) => {
    res.setHeader('Content-Type', 'application/schema+json; charset=utf-8');
    res.setHeader('Cache-Control', 'public, max-age=300');
    res.send(text);
  });
  return routes;
}

/** Leg profiles for the app: list, versions, diffs, publish. Published versions are never changed. */
export function profilesRoutes(deps: AppDeps) {
  const routes = declareRoutes('/profiles');
  routes.id('id', 'That leg profile');

  routes.get('/', READ, async (req, res) => {
    const body: ProfileList = { profiles: await listProfiles(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  routes.get('/:id', READ, async (req, res) => {
    const body: ProfileDetail = await profileDetail(deps.db, viewerOf(req).team.id, idOf(req));
    res.json(body);
  });

  routes.get('/:id/diff', READ, async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req);
    const q = parseWith(profileDiffQuerySchema, req.query);
    res.json({ diff: await diffVersions(deps.db, team.id, id, q.from, q.to) });
  });

  routes.post('/', PUBLISH, async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(publishProfileSchema, req.body);
    const published = await publishProfile(deps.db, { ...input, teamId: team.id, author: { id: user.id, name: user.name }, now: deps.clock.now() });
    res.status(201).json(published);
  });

  const immutable = () => {
    throw new HttpError(409, 'immutable', 'Published leg profile versions cannot be changed or deleted: game builds may depend on them. Publish a new version instead.');
  };
  // Published versions never change: these answer 409 for everyone, so the refusal says why.
  routes.put('/:id/versions/:version', READ, immutable);
  routes.patch('/:id/versions/:version', READ, immutable);
  routes.delete('/:id/versions/:version', READ, immutable);

  return routes;
}
