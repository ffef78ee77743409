/**
 * The files the package ships for its example and sample game: the demo biped Wicket (our own invented robot,
 * generated in code like the demo studio's), a leg profile of it built the way Treadle publishes one (engine
 * defaults measured on two short courses), and a course to walk over. Made at build time, never by hand.
 */
import { createHash } from 'node:crypto';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { wicket } from '../../seeds/characters';
import { analyseUpload } from '../../server/services/gltf-import-analyse';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { encodeCourse } from '../../engine/course/encoding';
import { flatCourse, mixedCourse } from '../../engine/course/generators';
import { runSuite } from '../../engine/profile/run-suite';
import { exportLegProfile } from '../../engine/profile/export';
import { LEG_PROFILE_SCHEMA_ID, type LegProfile } from '../../engine/profile/schema';
import { profileRigOf } from '../../engine/profile/rig-mapping';

export interface ExampleFiles {
  'wicket.glb': Uint8Array;
  'wicket.leg-profile.json': string;
  'scrapyard.course.json': string;
}

export async function exampleFiles(): Promise<ExampleFiles> {
  const glb = await buildCharacterGlb(wicket);
  const imported = await analyseUpload([{ originalname: 'wicket.glb', buffer: Buffer.from(glb) }]);
  const legs = imported.detection.legs.map(mappingOf);
  const rig = rigFromCharacter(imported.skeleton, legs, { name: 'Wicket' });
  const legSetup = defaultLegSetup(rig);
  const courses = [
    { name: 'Flat yard', heightfield: flatCourse(8) },
    { name: 'Curb and steps', heightfield: mixedCourse([{ kind: 'flat', length: 2 }, { kind: 'curb', height: 0.06, length: 1 }, { kind: 'flat', length: 3 }]) },
  ];
  const run = runSuite(rig, legSetup, courses);
  const profile: LegProfile = {
    schema: LEG_PROFILE_SCHEMA_ID,
    profileId: 1,
    version: 1,
    character: { name: 'Wicket', sha256: createHash('sha256').update(glb).digest('hex') },
    notes: 'Example profile shipped with treadle-runtime: engine defaults for the demo biped.',
    author: { name: 'Treadle' },
    publishedAt: '2026-12-01T00:00:00.000Z',
    legSetup,
    rig: profileRigOf(imported.skeleton, legs),
    suite: { name: 'Example suite', courses: courses.map((c) => ({ name: c.name, version: 1 })) },
    metrics: run.metrics,
  };
  const yard = mixedCourse([
    { kind: 'flat', length: 3 },
    { kind: 'rubble', length: 4, amplitude: 0.03, featureSize: 0.4, seed: 7 },
    { kind: 'flat', length: 2 },
    { kind: 'curb', height: 0.08, length: 2 },
    { kind: 'flat', length: 6 },
  ]);
  return {
    'wicket.glb': glb,
    'wicket.leg-profile.json': exportLegProfile(profile),
    'scrapyard.course.json': `${JSON.stringify(encodeCourse(yard))}\n`,
  };
}
