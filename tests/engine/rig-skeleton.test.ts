import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import { importGltf } from '../../server/services/gltf-import';
import { jointOrder, restWorldMatrices, jointWorldPositions } from '../../engine/rig/skeleton-world';
import { guessUnit, scaledSkeleton, skeletonHeight, unitScaleWarning } from '../../engine/rig/skeleton-scale';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { DEMO_DESIGNS } from '../../seeds/characters';
import { anonymised, file, twistedRigGlb, wicket } from '../fixtures/gltf/build-fixtures';
import type { Skeleton } from '../../engine/rig/types';

// Generous ceiling for loading the glTF libraries on a busy machine; no test asserts time.
jest.setTimeout(60_000);

/** three.js's GLTFLoader (the reference loader) on the same bytes: the world matrix of each skin joint. */
async function threeJointWorlds(glb: Uint8Array): Promise<THREE.Matrix4[]> {
  const loader = new GLTFLoader();
  const data = glb.buffer.slice(glb.byteOffset, glb.byteOffset + glb.byteLength) as ArrayBuffer;
  const gltf = await loader.parseAsync(data, '');
  gltf.scene.updateMatrixWorld(true);
  const jointNodes: number[] = gltf.parser.json.skins[0].joints;
  const objects = await Promise.all(jointNodes.map((n) => gltf.parser.getDependency('node', n) as Promise<THREE.Object3D>));
  return objects.map((o) => o.matrixWorld.clone());
}

async function expectMatchesThree(glb: Uint8Array) {
  const imported = await importGltf([file('rig.glb', glb)]);
  const ours = restWorldMatrices(imported.skeleton);
  const theirs = await threeJointWorlds(glb);
  expect(theirs).toHaveLength(imported.skeleton.joints.length);
  let worst = 0;
  theirs.forEach((m, j) => {
    for (let k = 0; k < 16; k++) worst = Math.max(worst, Math.abs(m.elements[k] - ours[16 * j + k]));
    const p = new THREE.Vector3().setFromMatrixPosition(m);
    expect(imported.positions[3 * j]).toBeCloseTo(p.x, 6);
    expect(imported.positions[3 * j + 1]).toBeCloseTo(p.y, 6);
    expect(imported.positions[3 * j + 2]).toBeCloseTo(p.z, 6);
  });
  // Reference: three.js Object3D.matrixWorld, which composes T·R·S per node as glTF 2.0 §3.5.3 defines.
  expect(worst).toBeLessThan(1e-6);
}

describe('skeleton world transforms against three.js', () => {
  it.each(DEMO_DESIGNS.map((d) => [d.name, d] as const))('match for %s within 1e-6', async (_name, design) => {
    await expectMatchesThree(await buildCharacterGlb(design));
  });

  it('match for a rig with rotated, scaled bones under a rotated, ×100-scaled armature node (not a joint)', async () => {
    await expectMatchesThree(await twistedRigGlb());
  });

  it('match when the skin lists children before their parents', async () => {
    await expectMatchesThree(await buildCharacterGlb(anonymised(wicket, 3).design));
  });
});

describe('jointOrder', () => {
  const joint = (name: string, parent: number) => ({ name, parent, translation: [0, 1, 0] as [number, number, number], rotation: [0, 0, 0, 1] as [number, number, number, number], scale: [1, 1, 1] as [number, number, number] });

  it('puts parents before children whatever the listing order', () => {
    const skeleton: Skeleton = { joints: [joint('c', 2), joint('root', -1), joint('b', 1)] };
    const order = Array.from(jointOrder(skeleton));
    expect(order.indexOf(1)).toBeLessThan(order.indexOf(2));
    expect(order.indexOf(2)).toBeLessThan(order.indexOf(0));
    // Each joint one metre above its parent: c is at y = 3.
    expect(jointWorldPositions(skeleton)[1]).toBeCloseTo(3, 12);
  });

  it('refuses a cycle, naming a joint on it', () => {
    expect(() => jointOrder({ joints: [joint('a', 1), joint('b', 0)] })).toThrow(/cycle/);
  });
});

describe('unit scale', () => {
  it('is quiet for mouse-to-house sizes and names the likely unit otherwise', () => {
    expect(unitScaleWarning(1.8)).toBeNull();
    expect(unitScaleWarning(0.3)).toBeNull();
    expect(unitScaleWarning(9)).toBeNull();
    // 180 "metres" is a 1.8 m person exported in centimetres; 1800 is millimetres (factors 10⁻² and 10⁻³: SI prefixes).
    expect(unitScaleWarning(180)).toMatch(/this looks like centimetres \(it would be 1\.80 m\).*Scale it by 0\.01/);
    expect(unitScaleWarning(1800)).toMatch(/this looks like millimetres \(it would be 1\.80 m\).*Scale it by 0\.001/);
    // 61 "metres" is a fox-sized 0.61 m walker in centimetres.
    expect(guessUnit(61)).toEqual({ unit: 'centimetres', factor: 0.01, certainty: 'likely', metres: 0.61 });
    // 25 m could be a giant walker in metres or a 25 cm creature: the fix is offered, not urged.
    expect(guessUnit(25)).toMatchObject({ unit: 'centimetres', certainty: 'possible' });
    expect(unitScaleWarning(25)).toMatch(/If it was authored in centimetres, it is 0\.250 m/);
    expect(unitScaleWarning(0.018)).toMatch(/scaled down/);
  });

  it('scales a skeleton about the origin exactly: every joint world matrix becomes S(k) times its own', async () => {
    // Reference: glTF 2.0 §3.5.3, a parent node scaling by k multiplies every descendant's world matrix by S(k) on the left
    // (the translation row too); the bottom row stays (0, 0, 0, 1).
    const imported = await importGltf([file('twisted.glb', await twistedRigGlb())]);
    const before = restWorldMatrices(imported.skeleton);
    const after = restWorldMatrices(scaledSkeleton(imported.skeleton, 0.01));
    let worst = 0;
    for (let j = 0; j < imported.skeleton.joints.length; j++) {
      for (let c = 0; c < 4; c++) for (let r = 0; r < 3; r++) worst = Math.max(worst, Math.abs(after[16 * j + 4 * c + r] - 0.01 * before[16 * j + 4 * c + r]));
    }
    expect(worst).toBeLessThan(1e-12);
    expect(scaledSkeleton(imported.skeleton, 1)).toBe(imported.skeleton);
  });

  it('measures the skeleton from its lowest to its highest joint', async () => {
    const imported = await importGltf([file('wicket.glb', await buildCharacterGlb(wicket))]);
    const ys = wicket.bones.map((b) => b.at[1]);
    expect(skeletonHeight(imported.positions)).toBeCloseTo(Math.max(...ys) - Math.min(...ys), 6);
  });
});
