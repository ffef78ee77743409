import type { Db } from '../server/db';
import { storeCharacterUpload } from '../server/services/gltf-import-store';
import { sha256Hex } from '../server/services/character-files';
import { buildCharacterGlb } from './characters/rig-builder';
import { DEMO_DESIGNS } from './characters';

/**
 * Adds the demo characters (Wicket, Burrow, Skitter) to the demo team; running it again changes nothing.
 * Each is built in code and stored through the same import as an upload, so the seed exercises the real path.
 * A character whose exact file the team already has is skipped without importing it again.
 */
export async function seedDemoCharacters(db: Db, teamId: number, ownerId: number, dataDir: string, now: number): Promise<void> {
  let tick = 0;
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    // Spaced a minute apart so the list shows them in a stable order.
    const at = now + 60_000 * tick++;
    if (await db('characters').where({ team_id: teamId, sha256: sha256Hex(glb) }).first('id')) continue;
    const fileName = `${design.name.toLowerCase()}.glb`;
    await storeCharacterUpload({ db, dataDir, now: () => at }, { teamId, userId: ownerId, name: design.name, files: [{ originalname: fileName, buffer: Buffer.from(glb) }] });
  }
}
