/**
 * Forward kinematics against three.js Object3D world matrices (three.js, a
 * general-purpose 3D library from npm, as the reference) on seeded
 * random chains of every DOF type.
 */
import * as THREE from 'three';
import {
  createWorkspace,
  footPosition,
  forwardKinematics,
  getPose,
  jointWorldMatrix,
  setPose,
  setRootTransform,
} from '../../../engine/ik';
import { mulberry32 } from '../../../engine/math/random';
import { presetLeg, PRESET_NAMES } from '../../../engine/rig/presets';
import type { LegChain } from '../../../engine/rig/types';
import { randomChain, randomKinds, randomQuat, randomUnit } from './helpers';

/** Build the same chain as a three.js Object3D hierarchy; returns the joint objects and the sole object. */
function buildThree(chain: LegChain, pose: Float64Array, quats: Float64Array, rootPos: number[], rootQuat: number[]) {
  const root = new THREE.Object3D();
  root.position.set(rootPos[0], rootPos[1], rootPos[2]);
  root.quaternion.set(rootQuat[0], rootQuat[1], rootQuat[2], rootQuat[3]);
  let parent: THREE.Object3D = root;
  let d = 0;
  let b = 0;
  const jointObjs: THREE.Object3D[] = [];
  for (const j of chain.joints) {
    const o = new THREE.Object3D();
    o.position.set(j.offset[0], j.offset[1], j.offset[2]);
    const q = new THREE.Quaternion(j.rest[0], j.rest[1], j.rest[2], j.rest[3]);
    let jointObj = o;
    if (j.kind === 'hinge') {
      q.multiply(new THREE.Quaternion().setFromAxisAngle(new THREE.Vector3(...j.axes[0]).normalize(), pose[d]));
      d += 1;
    } else if (j.kind === 'universal') {
      q.multiply(new THREE.Quaternion().setFromAxisAngle(new THREE.Vector3(...j.axes[0]).normalize(), pose[d]));
      q.multiply(new THREE.Quaternion().setFromAxisAngle(new THREE.Vector3(...j.axes[1]).normalize(), pose[d + 1]));
      d += 2;
    } else if (j.kind === 'ball') {
      q.multiply(new THREE.Quaternion(quats[4 * b], quats[4 * b + 1], quats[4 * b + 2], quats[4 * b + 3]));
      b++;
      d += 3;
    } else {
      const a = new THREE.Vector3(...j.axes[0]).normalize().multiplyScalar(pose[d]);
      const slide = new THREE.Object3D();
      slide.position.copy(a);
      o.add(slide);
      jointObj = slide;
      d += 1;
    }
    o.quaternion.copy(q);
    parent.add(o);
    jointObjs.push(jointObj);
    parent = jointObj;
  }
  const sole = new THREE.Object3D();
  sole.position.set(chain.sole[0], chain.sole[1], chain.sole[2]);
  parent.add(sole);
  root.updateMatrixWorld(true);
  return { jointObjs, sole };
}

function compare(chain: LegChain, rng: ReturnType<typeof mulberry32>) {
  const ws = createWorkspace(chain);
  const pose = new Float64Array(ws.nDof);
  for (let i = 0; i < pose.length; i++) pose[i] = rng.range(-1.2, 1.2);
  setPose(ws, pose, false);
  const rp = randomUnit(rng);
  const rq = randomQuat(rng);
  setRootTransform(ws, rp, rq);
  forwardKinematics(ws);
  const { jointObjs, sole } = buildThree(chain, getPose(ws), ws.quat, rp, rq);
  const m = new Float64Array(16);
  jointObjs.forEach((o, j) => {
    jointWorldMatrix(ws, j, m);
    const e = o.matrixWorld.elements;
    for (let k = 0; k < 16; k++) expect(Math.abs(m[k] - e[k])).toBeLessThan(1e-6); // three stores float64 too; 1e-6 for the float32 quaternion paths
  });
  const s = new THREE.Vector3().setFromMatrixPosition(sole.matrixWorld);
  const f = footPosition(ws);
  expect(Math.abs(f[0] - s.x)).toBeLessThan(1e-9);
  expect(Math.abs(f[1] - s.y)).toBeLessThan(1e-9);
  expect(Math.abs(f[2] - s.z)).toBeLessThan(1e-9);
}

describe('forward kinematics vs three.js Object3D world matrices', () => {
  test('seeded random chains of every DOF type', () => {
    const rng = mulberry32(9001);
    for (let t = 0; t < 50; t++) compare(randomChain(rng, randomKinds(rng, 1 + rng.int(6))), rng);
  });
  test.each(PRESET_NAMES.map((n) => [n]))('preset %s', (name) => {
    const rng = mulberry32(name.length * 31);
    for (let t = 0; t < 10; t++) compare(presetLeg(name), rng);
  });
});
