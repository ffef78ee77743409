/**
 * A leg profile carries its character's unit fix, and the runtime applies it: a game binding the profile to the
 * centimetre skeleton of its own file gets the rig Treadle measured, in metres. Reference for the rig: the same
 * character authored in metres (tests/fixtures/gltf/exporter-corpus.ts builds both from one design).
 */
import { buildCharacterDocument } from '../../seeds/characters/rig-builder';
import { memoryNodeIO } from '../../server/services/gltf-import-library';
import { importGltf } from '../../server/services/gltf-import';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { scaledSkeleton } from '../../engine/rig/skeleton-scale';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { LegProfileSchema, type LegProfile } from '../../engine/profile/schema';
import { profileRigOf } from '../../engine/profile/rig-mapping';
import { bindLegProfile, loadLegProfile } from '../../engine/profile/runtime';
import { exportLegProfile } from '../../engine/profile/export';
import { quadruped, scaledDesign } from '../fixtures/gltf/exporter-corpus';
import { profileOf, type DemoCharacter } from './profile/fixtures';

jest.setTimeout(60_000);

async function characterOf(design: ReturnType<typeof quadruped>): Promise<DemoCharacter> {
  const glb = await memoryNodeIO().writeBinary(buildCharacterDocument(design));
  const imported = await importGltf([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
  return { name: design.name, glb, skeleton: imported.skeleton, legs: imported.detection.legs.map(mappingOf) };
}

describe('the unit fix in a leg profile', () => {
  it('is written into the rig mapping and brings a centimetre skeleton to the metre rig at bind', async () => {
    const metres = await characterOf(quadruped('Loper'));
    const centimetres = await characterOf(scaledDesign(quadruped('Loper'), 100));
    const reference = rigFromCharacter(metres.skeleton, metres.legs, { name: 'Loper' });

    const fixed = { ...centimetres, skeleton: scaledSkeleton(centimetres.skeleton, 0.01) };
    const base = profileOf(fixed, defaultLegSetup(reference));
    const profile: LegProfile = { ...base, rig: profileRigOf(centimetres.skeleton, centimetres.legs, 0.01) };
    const loaded = loadLegProfile(exportLegProfile(LegProfileSchema.parse(profile)));
    expect(loaded.rig.unitScale).toBe(0.01);

    // The game hands over its own file's skeleton, in centimetres.
    const bound = bindLegProfile(loaded, centimetres.skeleton);
    expect(bound.rig.hipHeight).toBeCloseTo(reference.hipHeight, 9);
    bound.rig.legs.forEach((leg, i) => {
      expect(leg.chain.reach).toBeCloseTo(reference.legs[i].chain.reach, 9);
      for (let a = 0; a < 3; a++) expect(leg.hip[a]).toBeCloseTo(reference.legs[i].hip[a], 9);
    });
    // Without the fix the same skeleton binds a hundred times too large.
    const unfixed = bindLegProfile({ ...loaded, rig: { ...loaded.rig, unitScale: undefined } }, centimetres.skeleton);
    expect(unfixed.rig.hipHeight / reference.hipHeight).toBeCloseTo(100, 6);
  });
});
