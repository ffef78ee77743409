/** Leg profiles built the way the server builds them, from the demo characters on generated courses (our own). */
import { buildCharacterGlb } from '../../../seeds/characters/rig-builder';
import type { RigDesign } from '../../../seeds/characters/rig-builder';
import { importGltf } from '../../../server/services/gltf-import';
import { mappingOf } from '../../../engine/rig/leg-mapping';
import type { LegMapping } from '../../../schemas/characters';
import type { Skeleton } from '../../../engine/rig/types';
import { rigFromCharacter } from '../../../engine/gait/character-rig';
import { defaultLegSetup, type LegSetup } from '../../../engine/gait/leg-setup';
import { flatCourse, mixedCourse } from '../../../engine/course/generators';
import { runSuite, type SuiteCourse } from '../../../engine/profile/run-suite';
import { LEG_PROFILE_SCHEMA_ID, type LegProfile } from '../../../engine/profile/schema';
import { profileRigOf } from '../../../engine/profile/rig-mapping';

export interface DemoCharacter {
  name: string;
  glb: Uint8Array;
  skeleton: Skeleton;
  legs: LegMapping[];
}

export async function demoCharacter(design: RigDesign): Promise<DemoCharacter> {
  const glb = await buildCharacterGlb(design);
  const imported = await importGltf([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
  return { name: design.name, glb, skeleton: imported.skeleton, legs: imported.detection.legs.map(mappingOf) };
}

/** Two short courses: flat, and a curb with a low step (common practice, no source: enough to make stumbles differ). */
export const testCourses = (): SuiteCourse[] => [
  { name: 'Flat yard', heightfield: flatCourse(8) },
  { name: 'Curb and steps', heightfield: mixedCourse([{ kind: 'flat', length: 2 }, { kind: 'curb', height: 0.06, length: 1 }, { kind: 'flat', length: 3 }]) },
];

export function profileOf(c: DemoCharacter, setup?: LegSetup, version = 1): LegProfile {
  const rig = rigFromCharacter(c.skeleton, c.legs, { name: c.name });
  const legSetup = setup ?? defaultLegSetup(rig);
  const courses = testCourses();
  const run = runSuite(rig, legSetup, courses);
  return {
    schema: LEG_PROFILE_SCHEMA_ID,
    profileId: 1,
    version,
    character: { name: c.name, sha256: 'ab'.repeat(32) },
    notes: 'test profile',
    author: { name: 'Dario Moth' },
    publishedAt: '2026-12-01T09:00:00.000Z',
    legSetup,
    rig: profileRigOf(c.skeleton, c.legs),
    suite: { name: 'Test suite', courses: courses.map((k) => ({ name: k.name, version: 1 })) },
    metrics: run.metrics,
  };
}
