/**
 * The character's own skinned mesh (a glTF scene from three's GLTFLoader) posed from a trial replay.
 *
 * The scene hangs under a carrier that places the character's rest space on the walking body: a rest point x
 * lands at P + B·(x − O), with P and B the body's position and rotation and O the body origin in rest space
 * (engine/gait/character-rig.ts), so the carrier sits at P − B·O turned by B. Joints outside the legs keep
 * their rest pose. A mapped leg joint m turns by its own solved rotation D_m, given in rest-aligned axes; in its
 * parent's frame that is
 *   local_m = (Rw_parent)⁻¹ · D_m · Rw_m
 * with Rw the rest rotations in the scene's space (glTF 2.0 §3.5.3: world = parent · local), so joints between
 * mapped ones (and the end joint) ride along at rest. Nothing is allocated per frame.
 *
 * The rig is in metres with the character's unit fix applied (a file in centimetres is scaled by 0.01), the mesh in
 * the file's own units: the scene is scaled by the ratio of the rig's lengths to the same lengths between the
 * bones (segments inside each leg, and hip to hip), which is the unit fix, read back without being told.
 */
import * as THREE from 'three';
import type { Rig } from '../../engine/gait/rig';
import type { WalkReplay } from './walk-replay';

export interface PosedCharacter {
  /** Add this to the scene. */
  carrier: THREE.Group;
  /** Pose sample k of the replay (rounded and clamped). */
  pose(replay: WalkReplay, k: number): void;
  dispose(): void;
}

export type CharacterBinding = { ok: true; character: PosedCharacter } | { ok: false; reason: string };

interface BoundJoint {
  bone: THREE.Object3D;
  slot: number;
  /** (Rw_parent)⁻¹ and Rw_m. */
  parentRestInverse: THREE.Quaternion;
  rest: THREE.Quaternion;
}

/** The skinned mesh whose skin lists the rig's joints: the one with the most bones (the importer reads the first skin it can walk). */
function skinOf(scene: THREE.Object3D): THREE.SkinnedMesh | null {
  let best: THREE.SkinnedMesh | null = null;
  scene.traverse((o) => {
    const m = o as THREE.SkinnedMesh;
    if (m.isSkinnedMesh && (!best || m.skeleton.bones.length > best.skeleton.bones.length)) best = m;
  });
  return best;
}

/**
 * Bind a loaded glTF scene to a rig whose chain joints name their skeleton joints (skin joint indices).
 * Refuses, with a reason a user can act on, when there is no skinned mesh or its skin does not hold the rig's joints.
 */
export function bindCharacter(scene: THREE.Object3D, rig: Rig, replayJointOffset: number[]): CharacterBinding {
  const skinned = skinOf(scene);
  if (!skinned) return { ok: false, reason: 'This character has joints but no skinned mesh, so its walk is drawn as a skeleton.' };
  const bones = skinned.skeleton.bones;
  scene.updateMatrixWorld(true);
  const sceneInverse = new THREE.Matrix4().copy(scene.matrixWorld).invert();
  const restInScene = (o: THREE.Object3D) => {
    const m = new THREE.Matrix4().multiplyMatrices(sceneInverse, o.matrixWorld);
    const p = new THREE.Vector3();
    const q = new THREE.Quaternion();
    m.decompose(p, q, new THREE.Vector3());
    return { p, q };
  };

  const joints: BoundJoint[] = [];
  const hipsInScene: THREE.Vector3[] = [];
  let rigLength = 0;
  let sceneLength = 0;
  for (let i = 0; i < rig.legs.length; i++) {
    const leg = rig.legs[i];
    let previous: THREE.Vector3 | null = null;
    for (let j = 0; j < leg.chain.joints.length; j++) {
      const cj = leg.chain.joints[j];
      const bone = cj.skeletonJoint !== undefined ? bones[cj.skeletonJoint] : undefined;
      if (!bone) return { ok: false, reason: `The mesh's skin does not hold the leg joint "${cj.name}", so the walk is drawn as a skeleton.` };
      if (cj.kind === 'slider') return { ok: false, reason: `The leg joint "${cj.name}" slides; the mesh view poses turning joints only, so the walk is drawn as a skeleton.` };
      const rest = restInScene(bone);
      const parent = bone.parent ? restInScene(bone.parent).q : new THREE.Quaternion();
      if (j === 0) hipsInScene.push(rest.p);
      if (previous) {
        rigLength += Math.hypot(cj.offset[0], cj.offset[1], cj.offset[2]);
        sceneLength += rest.p.distanceTo(previous);
      }
      previous = rest.p;
      joints.push({ bone, slot: replayJointOffset[i] + j, parentRestInverse: parent.invert(), rest: rest.q });
    }
  }
  for (let i = 1; i < rig.legs.length; i++) {
    rigLength += new THREE.Vector3(...rig.legs[i].hip).distanceTo(new THREE.Vector3(...rig.legs[0].hip));
    sceneLength += hipsInScene[i].distanceTo(hipsInScene[0]);
  }
  const ratio = rigLength > 0 && sceneLength > 0 ? rigLength / sceneLength : 1;
  // Within rounding of 1 the file is in metres already: leave the scene as it is.
  const unitScale = Math.abs(ratio - 1) > 1e-6 ? ratio : 1;
  scene.scale.multiplyScalar(unitScale);
  // O: where the body origin sits in rest space, metres (each hip socket minus its offset on the body, averaged).
  const origin = new THREE.Vector3();
  rig.legs.forEach((leg, i) => origin.add(hipsInScene[i].clone().multiplyScalar(unitScale).sub(new THREE.Vector3(...leg.hip))));
  origin.multiplyScalar(1 / rig.legs.length);

  const carrier = new THREE.Group();
  carrier.name = 'character';
  carrier.add(scene);
  // The walk moves bones every frame; the skinned mesh's bounds at rest would cull it.
  scene.traverse((o) => (o.frustumCulled = false));

  const d = new THREE.Quaternion();
  const b = new THREE.Quaternion();
  const shift = new THREE.Vector3();
  return {
    ok: true,
    character: {
      carrier,
      pose(replay, k) {
        if (replay.length === 0) return;
        const s = Math.max(0, Math.min(replay.length - 1, Math.round(k)));
        const body = replay.body;
        const o = 7 * s;
        b.set(body[o + 3], body[o + 4], body[o + 5], body[o + 6]);
        shift.copy(origin).applyQuaternion(b);
        carrier.position.set(body[o] - shift.x, body[o + 1] - shift.y, body[o + 2] - shift.z);
        carrier.quaternion.copy(b);
        const base = replay.joints * s;
        for (const jt of joints) {
          const a = 4 * (base + jt.slot);
          d.set(replay.local[a], replay.local[a + 1], replay.local[a + 2], replay.local[a + 3]);
          jt.bone.quaternion.copy(jt.parentRestInverse).multiply(d).multiply(jt.rest);
        }
      },
      dispose() {
        scene.traverse((o) => {
          const m = o as THREE.Mesh;
          m.geometry?.dispose?.();
          const mats = Array.isArray(m.material) ? m.material : m.material ? [m.material] : [];
          for (const mat of mats) mat.dispose();
        });
      },
    },
  };
}
