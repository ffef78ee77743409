import type { Db } from '../server/db';
import { storeCharacterUpload } from '../server/services/gltf-import-store';
import { buildCharacterGlb } from './characters/rig-builder';
import { DEMO_DESIGNS } from './characters';

/**
 * Adds the demo characters (Wicket, Burrow, Skitter) to the demo team; running it again changes nothing.
 * Each is built in code and stored through the same import as an upload, so the seed exercises the real path
 * (a repeated run is recognised by the files' sha256).
 */
export async function seedDemoCharacters(db: Db, teamId: number, ownerId: number, dataDir: string, now: number): Promise<void> {
  let tick = 0;
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    const fileName = `${design.name.toLowerCase()}.glb`;
    // Spaced a minute apart so the list shows them in a stable order.
    const at = now + 60_000 * tick++;
    await storeCharacterUpload({ db, dataDir, now: () => at }, { teamId, userId: ownerId, name: design.name, files: [{ originalname: fileName, buffer: Buffer.from(glb) }] });
  }
}
