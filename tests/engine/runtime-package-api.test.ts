/**
 * The package's helpers around the engine runtime (packages/runtime/src): the skeleton read straight from a .glb
 * must be the skeleton Treadle's import reads with @gltf-transform/core, and characterMatrix must carry each
 * leg's hip joint from its rest position to where the runtime's own solver puts it.
 */
import { analyseUpload } from '../../server/services/gltf-import-analyse';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { burrow, skitter, wicket } from '../../seeds/characters';
import { jointWorldPositions } from '../../engine/rig/skeleton-world';
import { bindLegProfile, createLegRuntime, courseGround, flatGround, loadLegProfile, skeletonFromBones, skeletonFromGltf } from '../../packages/runtime/src';
import { exampleFiles } from '../../packages/runtime/example-files';

jest.setTimeout(120_000);

describe('skeletonFromGltf', () => {
  it.each([
    ['Wicket', wicket],
    ['Burrow', burrow],
    ['Skitter', skitter],
  ])('reads %s as Treadle’s import does', async (_name, design) => {
    const glb = await buildCharacterGlb(design);
    const imported = await analyseUpload([{ originalname: 'c.glb', buffer: Buffer.from(glb) }]);
    const mine = skeletonFromGltf(glb);
    expect(mine.joints.map((j) => [j.name, j.parent])).toEqual(imported.skeleton.joints.map((j) => [j.name, j.parent]));
    mine.joints.forEach((j, i) => {
      const ref = imported.skeleton.joints[i];
      for (let c = 0; c < 3; c++) expect(j.translation[c]).toBeCloseTo(ref.translation[c], 9);
      for (let c = 0; c < 4; c++) expect(Math.abs(j.rotation[c])).toBeCloseTo(Math.abs(ref.rotation[c]), 9);
    });
  });

  it('folds a node between the scene and the root bone into the root, as glTF 2.0 §3.7.3 composes transforms', () => {
    // A root bone under an armature node turned 90° about +Y and moved 1 m along +X: the root's rest is both at once.
    const s = Math.SQRT1_2;
    const armature = { name: 'Armature', parent: null, position: { x: 1, y: 0, z: 0 }, quaternion: { x: 0, y: s, z: 0, w: s }, scale: { x: 1, y: 1, z: 1 } };
    const scene = { name: '', parent: null, position: { x: 0, y: 0, z: 0 }, quaternion: { x: 0, y: 0, z: 0, w: 1 }, scale: { x: 1, y: 1, z: 1 } };
    armature.parent = scene as never;
    const hips = { name: 'hips', parent: armature, position: { x: 0, y: 0, z: 2 }, quaternion: { x: 0, y: 0, z: 0, w: 1 }, scale: { x: 1, y: 1, z: 1 } };
    const knee = { name: 'knee', parent: hips, position: { x: 0, y: -0.5, z: 0 }, quaternion: { x: 0, y: 0, z: 0, w: 1 }, scale: { x: 1, y: 1, z: 1 } };
    const { joints } = skeletonFromBones([hips, knee]);
    // R_y(90°) takes (0, 0, 2) to (2, 0, 0); plus the armature's 1 m along +X.
    expect(joints[0].translation[0]).toBeCloseTo(3, 12);
    expect(joints[0].translation[2]).toBeCloseTo(0, 12);
    expect(joints[0].rotation[1]).toBeCloseTo(s, 12);
    expect(joints[0].parent).toBe(-1);
    expect(joints[1]).toEqual({ name: 'knee', parent: 0, translation: [0, -0.5, 0], rotation: [0, 0, 0, 1], scale: [1, 1, 1] });
  });
});

describe('characterMatrix', () => {
  it('puts each hip joint’s rest position where the runtime’s solver has the hip, step after step', async () => {
    const files = await exampleFiles();
    const skeleton = skeletonFromGltf(files['wicket.glb']);
    const bound = bindLegProfile(loadLegProfile(files['wicket.leg-profile.json']), skeleton);
    const legs = createLegRuntime(bound, courseGround(files['scrapyard.course.json']));
    const rest = jointWorldPositions(skeleton);
    const m = new Float64Array(16);
    const hip = new Float64Array(16);
    let checked = 0;
    let tilted = 0;
    // Far enough to cross the rubble, where the body pitches and rolls: a matrix transposed or turned the wrong way shows.
    for (let f = 0; f < 480; f++) {
      legs.step();
      const q = legs.bodyRotation();
      tilted = Math.max(tilted, Math.hypot(q[0], q[2]));
      legs.characterMatrix(m);
      for (let i = 0; i < legs.legNames.length; i++) {
        const j = legs.jointIndices(i)[0];
        const p = rest.subarray(3 * j, 3 * j + 3);
        legs.jointWorldMatrix(i, 0, hip);
        // Column-major 4×4 times the rest point (x, y, z, 1).
        for (let r = 0; r < 3; r++) expect(m[r] * p[0] + m[4 + r] * p[1] + m[8 + r] * p[2] + m[12 + r]).toBeCloseTo(hip[12 + r], 9);
        checked++;
      }
    }
    expect(checked).toBe(960);
    expect(tilted).toBeGreaterThan(0.005);
  });

  it('walks on flat ground from the package’s flatGround', async () => {
    const files = await exampleFiles();
    const legs = createLegRuntime(bindLegProfile(loadLegProfile(files['wicket.leg-profile.json']), skeletonFromGltf(files['wicket.glb'])), flatGround(20));
    const start = legs.bodyPosition()[2];
    for (let f = 0; f < 120; f++) legs.update(1 / 60);
    expect(legs.bodyPosition()[2]).toBeGreaterThan(start + 0.1);
  });
});
