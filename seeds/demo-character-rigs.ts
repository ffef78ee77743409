/** The demo characters as walking rigs, built in code and read through the same import as an upload. */
import { rigFromCharacter } from '../engine/gait/character-rig';
import type { Rig } from '../engine/gait/rig';
import { analyseUpload } from '../server/services/gltf-import-analyse';
import { mappingOf } from '../engine/rig/leg-mapping';
import { DEMO_DESIGNS } from './characters';
import { buildCharacterGlb } from './characters/rig-builder';

export async function demoCharacterRigs(): Promise<{ name: string; rig: Rig }[]> {
  const out: { name: string; rig: Rig }[] = [];
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    const imported = await analyseUpload([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
    out.push({ name: design.name, rig: rigFromCharacter(imported.skeleton, imported.detection.legs.map(mappingOf), { name: design.name }) });
  }
  return out;
}
