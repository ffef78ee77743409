/**
 * The regression check of a game build: re-run the published version's suite with its leg setup on the stored
 * character, or on a newer character file sent with the request (imported like an upload but never stored),
 * and compare with what the published version earned.
 */
import type { Db } from '../db';
import { HttpError } from '../errors';
import type { CheckResult } from '../../schemas/profiles';
import { checkAgainstPublished, describeTolerances } from '../../engine/profile/check';
import { LegProfileBindError, legMappingsFor } from '../../engine/profile/rig-mapping';
import { sha256Hex } from './character-files';
import { importGltf, type UploadedFile } from './gltf-import';
import { findCharacterRow, rigOf, trialCharacterOf, type TrialCharacter } from './characters';
import { scaledSkeleton } from '../../engine/rig/skeleton-scale';
import { documentOf, findVersion } from './profiles';
import { loadSuite, runCharacterSuite, setupFor } from './suite-runs';

export interface CheckInput {
  teamId: number;
  profileId: number;
  version: number | 'latest';
  files: UploadedFile[];
  tolerances: { score?: number; stumbles?: number };
}

export async function checkProfile(db: Db, input: CheckInput): Promise<CheckResult> {
  const row = await findVersion(db, input.teamId, input.profileId, input.version);
  const published = documentOf(row);
  if (row.suite_id === null) throw new HttpError(409, 'suite_missing', 'This version has no suite to re-run.');
  const suite = await loadSuite(db, input.teamId, row.suite_id).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) {
      throw new HttpError(409, 'suite_missing', `The suite "${published.suite.name}" this version was measured on no longer exists, so it cannot be re-run.`);
    }
    throw err;
  });

  let character: TrialCharacter;
  if (input.files.length) {
    const imported = await importGltf(input.files);
    let legs;
    try {
      legs = legMappingsFor(imported.skeleton, published.rig);
    } catch (err) {
      if (err instanceof LegProfileBindError) throw new HttpError(400, 'missing_joints', `The uploaded file does not fit this profile: ${err.message}.`, { file: err.message });
      throw err;
    }
    // The profile's unit fix, as a game applies it to the file's skeleton.
    const unitScale = published.rig.unitScale ?? 1;
    character = { name: published.character.name, sha256: sha256Hex(imported.glb), skeleton: scaledSkeleton(imported.skeleton, unitScale), legs, unitScale };
  } else {
    const profile = await db('profiles').where({ id: input.profileId, team_id: input.teamId }).first('character_id');
    const stored = profile ? await findCharacterRow(db, input.teamId, profile.character_id) : undefined;
    if (!stored) throw new HttpError(409, 'character_missing', 'The character of this profile is gone; send the character file to check.');
    character = trialCharacterOf(stored);
  }
  const setup = setupFor(rigOf(character, input.files.length ? 'file' : 'profileId'), published.legSetup);
  const run = runCharacterSuite(character, setup, suite);
  const verdict = checkAgainstPublished(published.metrics, run.metrics, input.tolerances);
  return {
    pass: verdict.pass,
    profileId: input.profileId,
    version: row.version,
    checked: input.files.length ? 'uploaded' : 'stored',
    characterSha256: character.sha256,
    regressions: verdict.regressions,
    deltas: verdict.deltas,
    tolerances: verdict.tolerances,
    toleranceNote: describeTolerances(verdict.tolerances),
  };
}
