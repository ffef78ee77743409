import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import {
  characterUploadFieldsSchema,
  legMappingUpdateSchema,
  unitScaleUpdateSchema,
  type CharacterDetail,
  type CharacterList,
  type CharacterUploadResult,
} from '../../schemas/characters';
import { uploadCapBytes } from '../services/character-files';
import { storeCharacterUpload } from '../services/gltf-import-store';
import { characterDetail, getCharacter, listCharacters, storedCharacterFile, updateCharacterLegs, updateCharacterUnitScale } from '../services/characters';
import { uploadParser } from '../middleware/uploads';
import { EDITORS } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

/** A .gltf may come with its .bin and images; more parts than this is not a character. */
const MAX_FILES = 32;

const READ = permission('characters.read', 'See characters and their legs', 'member');
const UPLOAD = permission('characters.upload', 'Upload characters', EDITORS);
/** The unit fix is edited with the legs: both decide how the character stands. */
const EDIT_LEGS = permission('characters.legs.edit', 'Edit leg mappings', EDITORS);

/** Characters: upload, list, read, the stored file, leg mapping, unit fix. */
export function charactersRoutes(deps: AppDeps) {
  const routes = declareRoutes('/characters');
  routes.id('id', 'That character');
  const store = { db: deps.db, dataDir: deps.dataDir, now: () => deps.clock.now() };

  routes.get('/', READ, async (req, res) => {
    const body: CharacterList = { characters: await listCharacters(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  routes.post('/', UPLOAD, uploadParser({ maxBytes: uploadCapBytes(), maxFiles: MAX_FILES, maxFields: 4, maxFieldBytes: 1024 }), async (req, res) => {
    const { team, user } = viewerOf(req);
    const fields = parseWith(characterUploadFieldsSchema, req.body);
    const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ originalname: f.originalname, buffer: f.buffer }));
    const stored = await storeCharacterUpload(store, { teamId: team.id, userId: user.id, name: fields.name, files });
    const body: CharacterUploadResult = { character: await getCharacter(deps.db, team.id, stored.id), report: stored.report, existing: stored.existing };
    res.status(stored.existing ? 200 : 201).json(body);
  });

  routes.get('/:id', READ, async (req, res) => {
    const body: CharacterDetail = await characterDetail(deps.db, viewerOf(req).team.id, idOf(req));
    res.json(body);
  });

  routes.get('/:id/file', READ, async (req, res) => {
    const file = await storedCharacterFile(deps.db, deps.dataDir, viewerOf(req).team.id, idOf(req));
    res.setHeader('Content-Type', 'model/gltf-binary');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.setHeader('ETag', `"${file.sha256}"`);
    res.sendFile(file.path);
  });

  routes.put('/:id/legs', EDIT_LEGS, async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req);
    const { legs } = parseWith(legMappingUpdateSchema, req.body);
    res.json({ character: await updateCharacterLegs(deps.db, { teamId: team.id, id, legs, now: deps.clock.now() }) });
  });

  routes.put('/:id/unit-scale', EDIT_LEGS, async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req);
    const { unitScale } = parseWith(unitScaleUpdateSchema, req.body);
    res.json({ character: await updateCharacterUnitScale(deps.db, { teamId: team.id, id, unitScale, now: deps.clock.now() }) });
  });

  return routes;
}
