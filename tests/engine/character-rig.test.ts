/**
 * rigFromCharacter on the demo characters (seeds/characters), imported from their real .glb files:
 * forward kinematics of the rest pose must put every joint and sole where the skeleton's own rest
 * transforms say, with the skeleton composed independently as a three.js Object3D hierarchy
 * (three.js, a general-purpose 3D library from npm, as the reference for world matrices; glTF 2.0 §3.5.3
 * node transforms local = T·R·S, world = parent·local).
 */
import * as THREE from 'three';
import { createWorkspace, forwardKinematics, setRootTransform } from '../../engine/ik';
import { CharacterRigError, rigFromCharacter, rigOriginOf } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { runTrial } from '../../engine/gait/trial';
import { flatCourse } from '../../engine/course';
import type { Skeleton } from '../../engine/rig/types';
import { importGltf } from '../../server/services/gltf-import';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { DEMO_DESIGNS } from '../../seeds/characters';
import type { LegMapping } from '../../schemas/characters';

interface Demo {
  name: string;
  skeleton: Skeleton;
  legs: LegMapping[];
}

const demos: Demo[] = [];

beforeAll(async () => {
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    const imported = await importGltf([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
    demos.push({ name: design.name, skeleton: imported.skeleton, legs: imported.detection.legs.map(mappingOf) });
  }
}, 60_000);

/** World positions of every joint, composed by three.js from the skeleton's local TRS. */
function threeWorldPositions(skeleton: Skeleton): THREE.Vector3[] {
  const objects = skeleton.joints.map((j) => {
    const o = new THREE.Object3D();
    o.position.set(...j.translation);
    o.quaternion.set(...j.rotation);
    o.scale.set(...j.scale);
    return o;
  });
  const scene = new THREE.Object3D();
  skeleton.joints.forEach((j, i) => (j.parent < 0 ? scene : objects[j.parent]).add(objects[i]));
  scene.updateMatrixWorld(true);
  return objects.map((o) => o.getWorldPosition(new THREE.Vector3()));
}

describe('rigFromCharacter on the demo characters', () => {
  it('has one rig leg per mapped leg, in gait order (front to back, left before right)', () => {
    const expected: Record<string, number> = { Wicket: 2, Burrow: 4, Skitter: 6 };
    for (const d of demos) {
      const rig = rigFromCharacter(d.skeleton, d.legs, { name: d.name });
      expect(rig.legs).toHaveLength(expected[d.name]);
      // Gait patterns (engine/gait/patterns.ts) index legs [left, right] per row, rows front to back.
      for (let i = 0; i + 1 < rig.legs.length; i += 2) {
        expect(rig.legs[i].hip[0]).toBeGreaterThan(rig.legs[i + 1].hip[0]);
        if (i + 2 < rig.legs.length) expect(rig.legs[i].hip[2]).toBeGreaterThan(rig.legs[i + 2].hip[2]);
      }
    }
  });

  it('forward kinematics of the rest pose puts every joint and sole where three.js composes the skeleton', () => {
    for (const d of demos) {
      const rig = rigFromCharacter(d.skeleton, d.legs, { name: d.name });
      const origin = rigOriginOf(d.skeleton, d.legs);
      const world = threeWorldPositions(d.skeleton);
      for (const leg of rig.legs) {
        const ws = createWorkspace(leg.chain);
        // Every DOF at 0 is the rest pose: the mapping's limits are relative to it (schemas/characters.ts).
        ws.pose.fill(0);
        setRootTransform(ws, [origin[0] + leg.hip[0], origin[1] + leg.hip[1], origin[2] + leg.hip[2]], leg.hipRotation);
        forwardKinematics(ws);
        leg.chain.joints.forEach((j, k) => {
          const ref = world[j.skeletonJoint!];
          expect(ws.jPos[3 * k]).toBeCloseTo(ref.x, 9);
          expect(ws.jPos[3 * k + 1]).toBeCloseTo(ref.y, 9);
          expect(ws.jPos[3 * k + 2]).toBeCloseTo(ref.z, 9);
        });
        const mapping = d.legs.find((l) => l.name === leg.name)!;
        const end = world[mapping.end];
        expect(ws.foot[0]).toBeCloseTo(end.x, 9);
        expect(ws.foot[1]).toBeCloseTo(end.y, 9);
        expect(ws.foot[2]).toBeCloseTo(end.z, 9);
        // The neutral foot is the rest sole in the body frame.
        expect(leg.neutralFoot[0]).toBeCloseTo(end.x - origin[0], 9);
        expect(leg.neutralFoot[1]).toBeCloseTo(end.z - origin[2], 9);
      }
    }
  });

  it('puts the body origin at hip level: hipHeight is the mean hip height above the lowest sole', () => {
    for (const d of demos) {
      const rig = rigFromCharacter(d.skeleton, d.legs);
      const world = threeWorldPositions(d.skeleton);
      const hipY = d.legs.reduce((s, l) => s + world[l.joints[0].joint].y, 0) / d.legs.length;
      const ground = Math.min(...d.legs.map((l) => world[l.end].y));
      expect(rig.hipHeight).toBeCloseTo(hipY - ground, 9);
      // Chain reach is the sum of the rest segment lengths, hip to sole.
      for (const leg of rig.legs) {
        const m = d.legs.find((l) => l.name === leg.name)!;
        const pts = [...m.joints.map((j) => world[j.joint]), world[m.end]];
        let reach = 0;
        for (let k = 1; k < pts.length; k++) reach += pts[k].distanceTo(pts[k - 1]);
        expect(leg.chain.reach).toBeCloseTo(reach, 9);
      }
    }
  });

  it('walks: the engine runs a trial with the character rig and its default leg setup', () => {
    const burrow = demos.find((d) => d.name === 'Burrow')!;
    const rig = rigFromCharacter(burrow.skeleton, burrow.legs, { name: 'Burrow' });
    const result = runTrial(rig, defaultLegSetup(rig), flatCourse(12), { duration: 4 });
    expect(result.metrics.steps).toBeGreaterThan(0);
    expect(result.legNames).toEqual(rig.legs.map((l) => l.name));
  });

  it('names the problem in a mapping that does not fit the skeleton', () => {
    const burrow = demos.find((d) => d.name === 'Burrow')!;
    const broken = burrow.legs.map((l, i) => (i === 0 ? { ...l, end: 999 } : l));
    expect(() => rigFromCharacter(burrow.skeleton, broken)).toThrow(CharacterRigError);
    expect(() => rigFromCharacter(burrow.skeleton, broken)).toThrow(/joint 999 .*not in the skeleton/);
    const reversed = burrow.legs.map((l, i) => (i === 0 ? { ...l, joints: [...l.joints].reverse() } : l));
    expect(() => rigFromCharacter(burrow.skeleton, reversed)).toThrow(/is not below the joint before it/);
    expect(() => rigFromCharacter(burrow.skeleton, [])).toThrow(/no mapped legs/);
  });
});
