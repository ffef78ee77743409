/**
 * The API for build scripts and the app alike: `Authorization: Bearer …` (read-only) or a signed-in session.
 * Files carry a strong ETag (the sha256 of the exact bytes), so If-None-Match answers 304.
 */
import type { RequestHandler } from 'express';
import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { uploadParser } from '../middleware/uploads';
import { viewerOf } from '../middleware/auth';
import { checkFieldsSchema, versionParamSchema, type ApiCharacterList, type CheckResult } from '../../schemas/profiles';
import { charactersWithProfiles } from '../services/characters';
import { uploadCapBytes } from '../services/character-files';
import { findVersion, profilesOfCharacter } from '../services/profiles';
import { checkProfile } from '../services/profile-check';
import { declareRoutes, idOf, permission } from './declare';

/** A session works on these too. */
const READ = permission('api.read', 'Read characters and leg profiles through the API', 'member');
/** A POST that changes nothing: it only re-runs trials and answers with a verdict. */
const CHECK = permission('api.check', 'Check a character build against a leg profile', 'member');

const revalidate: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'private, no-cache');
  next();
};

/** The character to check may come as a .gltf with its parts, like an upload. */
const MAX_FILES = 32;

/** RFC 9110 §13.1.2: a list of entity tags or "*", compared weakly (a W/ prefix is ignored). */
function matchesNoneMatch(header: string | undefined, etag: string): boolean {
  if (!header) return false;
  if (header.trim() === '*') return true;
  return header.split(',').some((t) => t.trim().replace(/^W\//, '') === etag);
}

/** A file's download name: the character, the version, and what it is. */
const fileName = (character: string, version: number) => `${character.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'character'}-v${version}.leg-profile.json`;

/** /api/v1/characters: the team's characters with their profiles, for build scripts. */
export function apiV1CharactersRoutes(deps: AppDeps) {
  const routes = declareRoutes('/v1/characters');
  routes.router.use(revalidate);
  routes.id('id', 'That character');

  routes.get('/', READ, async (req, res) => {
    const { team } = viewerOf(req);
    const body: ApiCharacterList = { characters: await charactersWithProfiles(deps.db, team.id) };
    res.json(body);
  });

  routes.get('/:id/profiles', READ, async (req, res) => {
    const { team } = viewerOf(req);
    res.json({ profiles: await profilesOfCharacter(deps.db, team.id, idOf(req)) });
  });

  return routes;
}

/** /api/v1/profiles: a published version's file (with its ETag) and the regression check of a build. */
export function apiV1ProfilesRoutes(deps: AppDeps) {
  const routes = declareRoutes('/v1/profiles');
  routes.router.use(revalidate);
  routes.id('id', 'That leg profile');

  routes.get('/:id/versions/:version', READ, async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req);
    const version = parseWith(versionParamSchema, req.params.version);
    const row = await findVersion(deps.db, team.id, id, version);
    const etag = `"${row.sha256}"`;
    res.setHeader('ETag', etag);
    // Evaluated here rather than by Express's req.fresh, which ignores If-None-Match when the request says
    // Cache-Control: no-cache — and fetch() adds exactly that to every conditional request (Fetch standard, HTTP-network-or-cache fetch).
    if (matchesNoneMatch(req.get('if-none-match'), etag)) {
      res.status(304).end();
      return;
    }
    res.setHeader('Content-Type', 'application/json; charset=utf-8');
    if (req.query.download !== undefined) {
      const name = (JSON.parse(row.document) as { character: { name: string } }).character.name;
      res.attachment(fileName(name, row.version));
    }
    res.send(row.document);
  });

  routes.post('/:id/check', CHECK, uploadParser({ maxBytes: uploadCapBytes(), maxFiles: MAX_FILES, maxFields: 8, maxFieldBytes: 256, optional: true }), async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req);
    const fields = parseWith(checkFieldsSchema, req.body);
    const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ originalname: f.originalname, buffer: f.buffer }));
    const body: CheckResult = await checkProfile(deps.db, {
      teamId: team.id,
      profileId: id,
      version: fields.version,
      files,
      tolerances: { score: fields.scoreTolerance, stumbles: fields.stumbleTolerance },
    });
    res.json(body);
  });

  return routes;
}
