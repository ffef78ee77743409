import fs from 'node:fs';
import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { HttpError, notFound, parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import {
  characterUploadFieldsSchema,
  legMappingUpdateSchema,
  type CharacterDetail,
  type CharacterList,
  type CharacterUploadResult,
  type DetectedLeg,
  type ImportReport,
} from '../../schemas/characters';
import { legMappingProblems } from '../../engine/rig/skeleton-leg-check';
import { characterFilePath, uploadCapBytes } from '../services/character-files';
import { characterFromRow, characterRows, findCharacterRow, storeCharacterUpload, type StoredSkeleton } from '../services/gltf-import-store';
import { uploadParser } from '../middleware/uploads';

/** A .gltf may come with its .bin and images; more parts than this is not a character. */
const MAX_FILES = 32;

const idSchema = z.coerce.number().int().positive();

/** Characters: upload, list, read, the stored file, leg mapping. */
export function charactersRouter(deps: AppDeps): Router {
  const router = Router();
  const store = { db: deps.db, dataDir: deps.dataDir, now: () => deps.clock.now() };

  async function rowOr404(teamId: number, rawId: unknown) {
    const id = idSchema.safeParse(rawId);
    const row = id.success ? await findCharacterRow(deps.db, teamId, id.data) : undefined;
    if (!row) throw notFound('That character');
    return row;
  }

  router.get('/', async (req, res) => {
    const { team } = viewerOf(req);
    const rows = await characterRows(deps.db, team.id).orderBy('c.created_at', 'desc').orderBy('c.id', 'desc');
    const body: CharacterList = { characters: rows.map(characterFromRow) };
    res.json(body);
  });

  router.post('/', uploadParser({ maxBytes: uploadCapBytes(), maxFiles: MAX_FILES, maxFields: 4, maxFieldBytes: 1024 }), async (req, res) => {
    const { team, user } = viewerOf(req);
    const fields = parseWith(characterUploadFieldsSchema, req.body);
    const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ originalname: f.originalname, buffer: f.buffer }));
    const stored = await storeCharacterUpload(store, { teamId: team.id, userId: user.id, name: fields.name, files });
    const row = await findCharacterRow(deps.db, team.id, stored.id);
    const body: CharacterUploadResult = { character: characterFromRow(row!), report: stored.report, existing: stored.existing };
    res.status(stored.existing ? 200 : 201).json(body);
  });

  router.get('/:id', async (req, res) => {
    const row = await rowOr404(viewerOf(req).team.id, req.params.id);
    const skeleton = JSON.parse(row.skeleton_json) as StoredSkeleton;
    const body: CharacterDetail = {
      character: characterFromRow(row),
      skeleton: {
        joints: skeleton.joints.map((j, i) => ({
          name: j.name,
          parent: j.parent,
          position: [skeleton.positions[3 * i], skeleton.positions[3 * i + 1], skeleton.positions[3 * i + 2]],
        })),
      },
      detectedLegs: JSON.parse(row.detected_legs_json) as DetectedLeg[],
      report: JSON.parse(row.report_json) as ImportReport,
    };
    res.json(body);
  });

  router.get('/:id/file', async (req, res) => {
    const row = await rowOr404(viewerOf(req).team.id, req.params.id);
    const file = characterFilePath(deps.dataDir, row.sha256);
    if (!fs.existsSync(file)) throw new HttpError(410, 'file_missing', 'The stored file of this character is missing from the server. Upload it again.');
    res.setHeader('Content-Type', 'model/gltf-binary');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.setHeader('ETag', `"${row.sha256}"`);
    res.sendFile(file);
  });

  router.put('/:id/legs', async (req, res) => {
    const { team } = viewerOf(req);
    const row = await rowOr404(team.id, req.params.id);
    const { legs } = parseWith(legMappingUpdateSchema, req.body);
    const skeleton = JSON.parse(row.skeleton_json) as StoredSkeleton;
    const problems = legMappingProblems({ joints: skeleton.joints }, legs);
    const keys = Object.keys(problems);
    if (keys.length) throw new HttpError(400, 'invalid_legs', problems[keys[0]], problems);
    await deps.db.transaction(async (trx) => {
      await trx('characters')
        .where({ id: row.id, team_id: team.id })
        .update({ legs_json: JSON.stringify(legs), leg_count: legs.length, legs_edited: true, updated_at: deps.clock.now() });
    });
    const updated = await findCharacterRow(deps.db, team.id, row.id);
    res.json({ character: characterFromRow(updated!) });
  });

  return router;
}
