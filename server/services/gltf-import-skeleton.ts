/**
 * The skeleton of a glTF skin: its joints, each joint's parent (the nearest ancestor node that is
 * also a joint), rest transforms and inverse bind matrices (glTF 2.0 §3.7.3 "Skins"). Nodes between
 * two joints, or above the root joints, are folded into the child's rest transform so world
 * positions come out as the file defines them.
 */
import { mat4, quat, vec3 } from 'gl-matrix';
import type { Document, Node } from '@gltf-transform/core';
import type { Skeleton, SkeletonJoint } from '../../engine/rig/types';
import { refuse } from './gltf-import-refusals';

export interface ImportedSkeleton {
  skeleton: Skeleton;
  /** 16 numbers per joint, column-major; identity where the file gives none. */
  inverseBindMatrices: Float64Array;
  /** The nodes between the scene and the first root joint (outermost first) and their composed matrix, column-major. */
  above: { names: string[]; matrix: Float64Array };
}

function trsOf(node: Node): Pick<SkeletonJoint, 'translation' | 'rotation' | 'scale'> {
  return {
    translation: [...node.getTranslation()] as SkeletonJoint['translation'],
    rotation: [...node.getRotation()] as SkeletonJoint['rotation'],
    scale: [...node.getScale()] as SkeletonJoint['scale'],
  };
}

/** gl-matrix allocates Float32Array by default; the importer keeps full double precision. */
function identity(): mat4 {
  return mat4.identity(new Float64Array(16) as unknown as mat4);
}

function decompose(m: mat4): Pick<SkeletonJoint, 'translation' | 'rotation' | 'scale'> {
  const t = new Float64Array(3) as unknown as vec3;
  const s = new Float64Array(3) as unknown as vec3;
  const r = new Float64Array(4) as unknown as quat;
  mat4.getTranslation(t, m);
  mat4.getScaling(s, m);
  mat4.getRotation(r, m);
  quat.normalize(r, r);
  return { translation: [t[0], t[1], t[2]], rotation: [r[0], r[1], r[2], r[3]], scale: [s[0], s[1], s[2]] };
}

function finite(values: ArrayLike<number>): boolean {
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) return false;
  return true;
}

export function importSkeleton(doc: Document, skinIndex: number): ImportedSkeleton {
  const skin = doc.getRoot().listSkins()[skinIndex];
  const nodes = skin.listJoints();
  if (!nodes.length) throw refuse('no_joints', 'The skin lists no joints. Export the armature with the mesh bound to it.');
  const index = new Map(nodes.map((n, i) => [n, i]));
  if (index.size !== nodes.length) throw refuse('bad_hierarchy', 'The skin lists the same joint twice.');

  const joints: SkeletonJoint[] = nodes.map((node, i) => {
    const name = node.getName() || `joint ${i}`;
    let parent = node.getParentNode();
    let between: mat4 | null = null;
    while (parent && !index.has(parent)) {
      between = mat4.multiply(identity(), parent.getMatrix() as unknown as mat4, between ?? identity());
      parent = parent.getParentNode();
    }
    const rest = between ? decompose(mat4.multiply(identity(), between, node.getMatrix() as unknown as mat4)) : trsOf(node);
    if (!finite([...rest.translation, ...rest.rotation, ...rest.scale])) {
      throw refuse('bad_transform', `Joint "${name}" has a rest transform that is not finite (NaN or infinite). Re-export the character.`);
    }
    return { name, parent: parent ? index.get(parent)! : -1, ...rest };
  });

  const inverseBindMatrices = new Float64Array(16 * nodes.length);
  const accessor = skin.getInverseBindMatrices();
  const array = accessor?.getArray();
  if (array) {
    if (accessor!.getType() !== 'MAT4' || array.length < 16 * nodes.length) {
      throw refuse('broken_buffer', `The skin's inverse bind matrices hold ${Math.floor(array.length / 16)} matrices for ${nodes.length} joints.`);
    }
    inverseBindMatrices.set(array.subarray(0, 16 * nodes.length));
    for (let j = 0; j < nodes.length; j++) {
      if (!finite(inverseBindMatrices.subarray(16 * j, 16 * j + 16))) {
        throw refuse('bad_transform', `The inverse bind matrix of joint "${joints[j].name}" holds NaN or infinite values. Re-export the character.`);
      }
    }
  } else {
    for (let j = 0; j < nodes.length; j++) inverseBindMatrices.set(identity() as unknown as Float64Array, 16 * j);
  }
  return { skeleton: { joints }, inverseBindMatrices, above: aboveRoot(nodes, index) };
}

function aboveRoot(nodes: Node[], index: Map<Node, number>): ImportedSkeleton['above'] {
  const root = nodes.find((n) => {
    for (let p = n.getParentNode(); p; p = p.getParentNode()) if (index.has(p)) return false;
    return true;
  });
  const chain: Node[] = [];
  for (let p = root?.getParentNode() ?? null; p; p = p.getParentNode()) chain.unshift(p);
  const matrix = identity();
  for (const p of chain) mat4.multiply(matrix, matrix, p.getMatrix() as unknown as mat4);
  return { names: chain.map((p, i) => p.getName() || `node ${i}`), matrix: matrix as unknown as Float64Array };
}
