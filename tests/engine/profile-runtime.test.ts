/**
 * The game runtime: bound to a demo character's skeleton as a game would read it (joints straight from the
 * glTF file with @gltf-transform/core, in another order than Treadle's import), it must put the feet exactly
 * where the server's trial of record puts them for the same setup and ground.
 */
import { memoryNodeIO } from '../../server/services/gltf-import-library';
import { wicket, burrow, skitter } from '../../seeds/characters';
import type { RigDesign } from '../../seeds/characters/rig-builder';
import type { Skeleton, SkeletonJoint } from '../../engine/rig/types';
import { bindLegProfile, createLegRuntime, loadLegProfile } from '../../engine/profile/runtime';
import { exportLegProfile } from '../../engine/profile/export';
import { LegProfileBindError } from '../../engine/profile/rig-mapping';
import { runCharacterSuite } from '../../server/services/suite-runs';
import { trialCharacterOf } from '../../server/services/characters';
import { demoCharacter, profileOf, testCourses, type DemoCharacter } from './profile/fixtures';

/** The skin's joints as a game engine lists them: from the file itself, here reversed so indices differ from Treadle's. */
async function gameSkeleton(glb: Uint8Array): Promise<Skeleton> {
  const doc = await memoryNodeIO().readBinary(glb);
  const nodes = doc.getRoot().listSkins()[0].listJoints().reverse();
  const joints: SkeletonJoint[] = nodes.map((n) => ({
    name: n.getName(),
    parent: n.getParentNode() ? nodes.indexOf(n.getParentNode()!) : -1,
    translation: [...n.getTranslation()] as [number, number, number],
    rotation: [...n.getRotation()] as [number, number, number, number],
    scale: [...n.getScale()] as [number, number, number],
  }));
  return { joints };
}

/** What the server stores for a character and trials read back. */
const storedRow = (c: DemoCharacter) => ({
  name: c.name,
  sha256: `${c.name}-test`,
  skeleton_json: JSON.stringify({ joints: c.skeleton.joints, positions: [], inverseBindMatrices: [] }),
  legs_json: JSON.stringify(c.legs),
});

describe.each([
  ['Wicket', wicket],
  ['Burrow', burrow],
  ['Skitter', skitter],
] as [string, RigDesign][])('the runtime on %s', (_name, design) => {
  let c: DemoCharacter;
  beforeAll(async () => {
    c = await demoCharacter(design);
  });

  it('gives the same foot positions as the server trial, frame by frame', async () => {
    const file = exportLegProfile(profileOf(c));
    const course = testCourses()[1];
    const server = runCharacterSuite(trialCharacterOf(storedRow(c)), loadLegProfile(file).legSetup, {
      id: 1,
      name: 'one course',
      courses: [{ id: 1, name: course.name, version: 1, heightfield: course.heightfield }],
    }).trials[0].result;

    const legs = createLegRuntime(bindLegProfile(loadLegProfile(file), await gameSkeleton(c.glb)), course.heightfield, { duration: 60 });
    expect(legs.legNames).toEqual(server.legNames);
    const s = server.series;
    const foot = new Float64Array(3);
    const perSample = Math.round(1 / legs.timeStep / s.rate);
    let compared = 0;
    for (let k = 1; k < s.length; k++) {
      for (let f = 0; f < perSample; f++) legs.step();
      for (let i = 0; i < s.legs; i++) {
        legs.footPosition(i, foot);
        // The series keeps float32 copies of the same doubles: rounding the runtime's value must give them exactly.
        for (let a = 0; a < 3; a++) expect(Math.fround(foot[a])).toBe(s.foot[(k * s.legs + i) * 3 + a]);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(100);
  });

  it('maps every moving joint to the game skeleton by name', async () => {
    const skeleton = await gameSkeleton(c.glb);
    const legs = createLegRuntime(bindLegProfile(loadLegProfile(exportLegProfile(profileOf(c))), skeleton), testCourses()[0].heightfield);
    for (let i = 0; i < legs.legNames.length; i++) {
      for (const j of legs.jointIndices(i)) expect(c.skeleton.joints.map((x) => x.name)).toContain(skeleton.joints[j].name);
    }
  });
});

describe('binding errors', () => {
  it('names every joint the game skeleton lacks', async () => {
    const c = await demoCharacter(wicket);
    const profile = loadLegProfile(exportLegProfile(profileOf(c)));
    const skeleton = await gameSkeleton(c.glb);
    const renamed = { joints: skeleton.joints.map((j) => (j.name === 'shin_L' ? { ...j, name: 'lower_leg_L' } : j.name === 'foot_R' ? { ...j, name: 'ankle_R' } : j)) };
    let error: unknown;
    try {
      bindLegProfile(profile, renamed);
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(LegProfileBindError);
    expect((error as Error).message).toMatch(/"shin_L"/);
    expect((error as Error).message).toMatch(/"foot_R"/);
    expect((error as LegProfileBindError).missing).toHaveLength(2);
  });

  it('refuses a file that is not a profile, naming the problem', () => {
    expect(() => loadLegProfile('{ not json')).toThrow(/not JSON/);
    expect(() => loadLegProfile({ schema: 'x' })).toThrow(/schema/);
  });
});
