import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { notFound, parseWith } from '../errors';
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

/** A .gltf may come with its .bin and images; more parts than this is not a character. */
const MAX_FILES = 32;

const idSchema = z.coerce.number().int().positive();
/** A malformed id names no character of the team: the same 404 as another team's. */
function idOf(raw: unknown): number {
  const id = idSchema.safeParse(raw);
  if (!id.success) throw notFound('That character');
  return id.data;
}

/** Characters: upload, list, read, the stored file, leg mapping. */
export function charactersRouter(deps: AppDeps): Router {
  const router = Router();
  const store = { db: deps.db, dataDir: deps.dataDir, now: () => deps.clock.now() };

  router.get('/', async (req, res) => {
    const body: CharacterList = { characters: await listCharacters(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  router.post('/', uploadParser({ maxBytes: uploadCapBytes(), maxFiles: MAX_FILES, maxFields: 4, maxFieldBytes: 1024 }), async (req, res) => {
    const { team, user } = viewerOf(req);
    const fields = parseWith(characterUploadFieldsSchema, req.body);
    const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ originalname: f.originalname, buffer: f.buffer }));
    const stored = await storeCharacterUpload(store, { teamId: team.id, userId: user.id, name: fields.name, files });
    const body: CharacterUploadResult = { character: await getCharacter(deps.db, team.id, stored.id), report: stored.report, existing: stored.existing };
    res.status(stored.existing ? 200 : 201).json(body);
  });

  router.get('/:id', async (req, res) => {
    const body: CharacterDetail = await characterDetail(deps.db, viewerOf(req).team.id, idOf(req.params.id));
    res.json(body);
  });

  router.get('/:id/file', async (req, res) => {
    const file = await storedCharacterFile(deps.db, deps.dataDir, viewerOf(req).team.id, idOf(req.params.id));
    res.setHeader('Content-Type', 'model/gltf-binary');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.setHeader('ETag', `"${file.sha256}"`);
    res.sendFile(file.path);
  });

  router.put('/:id/legs', async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req.params.id);
    const { legs } = parseWith(legMappingUpdateSchema, req.body);
    res.json({ character: await updateCharacterLegs(deps.db, { teamId: team.id, id, legs, now: deps.clock.now() }) });
  });

  router.put('/:id/unit-scale', async (req, res) => {
    const { team } = viewerOf(req);
    const id = idOf(req.params.id);
    const { unitScale } = parseWith(unitScaleUpdateSchema, req.body);
    res.json({ character: await updateCharacterUnitScale(deps.db, { teamId: team.id, id, unitScale, now: deps.clock.now() }) });
  });

  return router;
}
