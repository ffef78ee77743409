/** The demo characters as walking rigs with their seeded setups, built and imported like an upload (for benchmarks). */
import { rigFromCharacter } from '../../engine/gait/character-rig';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { analyseUpload } from '../../server/services/gltf-import-analyse';
import { mappingOf } from '../../server/services/gltf-import-store';
import { DEMO_DESIGNS } from '../../seeds/characters';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { seededSetupFor } from '../../seeds/demo-setups';

export async function demoCharacterRigs(): Promise<{ name: string; rig: Rig; setup: LegSetup }[]> {
  const out: { name: string; rig: Rig; setup: LegSetup }[] = [];
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    const imported = await analyseUpload([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
    const rig = rigFromCharacter(imported.skeleton, imported.detection.legs.map(mappingOf), { name: design.name });
    out.push({ name: design.name, rig, setup: seededSetupFor(design.name, rig) });
  }
  return out;
}
