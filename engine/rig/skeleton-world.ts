/**
 * Rest-pose world transforms of a skeleton, composed the way the glTF 2.0 specification
 * defines node transforms (§3.5.3 "Transformations"): local = T · R · S, world = parent world · local.
 */
import { mat4 } from 'gl-matrix';
import type { Skeleton } from './types';

/** Joint indices ordered parents before children; throws on a cycle or a parent index out of range. */
export function jointOrder(skeleton: Skeleton): Int32Array {
  const n = skeleton.joints.length;
  const order = new Int32Array(n);
  const state = new Uint8Array(n); // 0 unseen, 1 on the current path, 2 placed
  const path: number[] = [];
  let placed = 0;
  for (let start = 0; start < n; start++) {
    let j = start;
    path.length = 0;
    while (j >= 0 && state[j] === 0) {
      state[j] = 1;
      path.push(j);
      const parent = skeleton.joints[j].parent;
      if (parent >= n || parent < -1) throw new Error(`Joint "${skeleton.joints[j].name}" names a parent that does not exist.`);
      j = parent;
    }
    if (j >= 0 && state[j] === 1) throw new Error(`The joints around "${skeleton.joints[j].name}" form a cycle.`);
    for (let k = path.length - 1; k >= 0; k--) {
      state[path[k]] = 2;
      order[placed++] = path[k];
    }
  }
  return order;
}

/** Column-major 4×4 rest world matrix of every joint, 16 numbers per joint. */
export function restWorldMatrices(skeleton: Skeleton): Float64Array {
  const n = skeleton.joints.length;
  const out = new Float64Array(16 * n);
  const local = new Float64Array(16);
  for (const j of jointOrder(skeleton)) {
    const joint = skeleton.joints[j];
    mat4.fromRotationTranslationScale(local, joint.rotation, joint.translation, joint.scale);
    const world = out.subarray(16 * j, 16 * j + 16);
    if (joint.parent < 0) world.set(local);
    else mat4.multiply(world, out.subarray(16 * joint.parent, 16 * joint.parent + 16), local);
  }
  return out;
}

/** Rest world position of every joint, x y z per joint, metres. */
export function jointWorldPositions(skeleton: Skeleton, matrices: Float64Array = restWorldMatrices(skeleton)): Float64Array {
  const n = skeleton.joints.length;
  const out = new Float64Array(3 * n);
  for (let j = 0; j < n; j++) {
    out[3 * j] = matrices[16 * j + 12];
    out[3 * j + 1] = matrices[16 * j + 13];
    out[3 * j + 2] = matrices[16 * j + 14];
  }
  return out;
}

/** Children of each joint, in joint order. */
export function jointChildren(skeleton: Skeleton): number[][] {
  const children: number[][] = skeleton.joints.map(() => []);
  skeleton.joints.forEach((joint, j) => {
    if (joint.parent >= 0) children[joint.parent].push(j);
  });
  return children;
}

/** Whether `descendant` lies below `ancestor` (strictly) in the hierarchy. */
export function isDescendant(skeleton: Skeleton, descendant: number, ancestor: number): boolean {
  let j = skeleton.joints[descendant]?.parent ?? -1;
  for (let guard = 0; j >= 0 && guard <= skeleton.joints.length; guard++) {
    if (j === ancestor) return true;
    j = skeleton.joints[j].parent;
  }
  return false;
}

/** Distance between two joints' rest positions. */
export function jointDistance(positions: ArrayLike<number>, a: number, b: number): number {
  const dx = positions[3 * a] - positions[3 * b];
  const dy = positions[3 * a + 1] - positions[3 * b + 1];
  const dz = positions[3 * a + 2] - positions[3 * b + 2];
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/** Segment lengths along a path of joints, and their sum. */
export function chainLengths(positions: ArrayLike<number>, path: readonly number[]): { segments: number[]; total: number } {
  const segments: number[] = [];
  for (let i = 1; i < path.length; i++) segments.push(jointDistance(positions, path[i - 1], path[i]));
  return { segments, total: segments.reduce((a, b) => a + b, 0) };
}
