/**
 * Checks on the glTF JSON that must hold before the full read: a tree of nodes (glTF 2.0 §3.5.3:
 * "the node hierarchy must be a set of disjoint strict trees"), finite transforms, a skin with joints
 * under the cap, and no required extension we cannot read. Iterative, so a hostile depth cannot blow the stack.
 */
import type { GltfJson } from './gltf-import-container';
import { MAX_JOINTS, MAX_NODE_DEPTH, refuse } from './gltf-import-refusals';

const TRANSFORM_LENGTH = { translation: 3, rotation: 4, scale: 3, matrix: 16 } as const;

function nodeLabel(json: GltfJson, i: number): string {
  const name = json.nodes?.[i]?.name;
  return typeof name === 'string' && name ? `node ${i} ("${name}")` : `node ${i}`;
}

function checkHierarchy(json: GltfJson): void {
  const nodes = Array.isArray(json.nodes) ? json.nodes : [];
  const parent = new Int32Array(nodes.length).fill(-1);
  nodes.forEach((node, i) => {
    const children = node.children ?? [];
    if (!Array.isArray(children)) throw refuse('bad_hierarchy', `${nodeLabel(json, i)} lists its children wrongly.`);
    for (const c of children) {
      if (!Number.isInteger(c) || c < 0 || c >= nodes.length) throw refuse('bad_hierarchy', `${nodeLabel(json, i)} names a child node ${c} that does not exist.`);
      if (c === i) throw refuse('bad_hierarchy', `${nodeLabel(json, i)} is its own child.`);
      if (parent[c] !== -1) throw refuse('bad_hierarchy', `${nodeLabel(json, c)} has two parents; glTF nodes form trees.`);
      parent[c] = i;
    }
  });
  // Depth by walking up with memo; a walk longer than the node count is a cycle.
  const depth = new Int32Array(nodes.length).fill(-1);
  const path: number[] = [];
  for (let start = 0; start < nodes.length; start++) {
    path.length = 0;
    let j = start;
    while (j !== -1 && depth[j] === -1) {
      path.push(j);
      if (path.length > nodes.length) throw refuse('bad_hierarchy', `The nodes around ${nodeLabel(json, start)} form a cycle; glTF nodes form trees.`);
      j = parent[j];
    }
    let d = j === -1 ? 0 : depth[j] + 1;
    for (let k = path.length - 1; k >= 0; k--) depth[path[k]] = d++;
    const deepest = d - 1;
    if (deepest > MAX_NODE_DEPTH) {
      throw refuse('too_deep', `The node hierarchy is more than ${MAX_NODE_DEPTH} levels deep, the most Treadle accepts. A rig this deep is almost certainly broken.`);
    }
  }
}

function checkTransforms(json: GltfJson): void {
  (json.nodes ?? []).forEach((node, i) => {
    for (const key of Object.keys(TRANSFORM_LENGTH) as (keyof typeof TRANSFORM_LENGTH)[]) {
      const value = node[key];
      if (value === undefined) continue;
      if (!Array.isArray(value) || value.length !== TRANSFORM_LENGTH[key]) {
        throw refuse('bad_transform', `${nodeLabel(json, i)} has a ${key} that is not ${TRANSFORM_LENGTH[key]} numbers.`);
      }
      if (!value.every((v) => typeof v === 'number' && Number.isFinite(v))) {
        throw refuse('bad_transform', `${nodeLabel(json, i)} has a ${key} with a value that is not a finite number (NaN, infinite or missing). Re-export the character.`);
      }
    }
  });
}

function checkExtensions(json: GltfJson, supported: ReadonlySet<string>): void {
  const required = Array.isArray(json.extensionsRequired) ? json.extensionsRequired : [];
  const missing = required.filter((e) => typeof e === 'string' && !supported.has(e));
  if (missing.length) {
    throw refuse('unsupported_extension', `The file requires ${missing.join(', ')}, which Treadle cannot read. Re-export without ${missing.length > 1 ? 'them' : 'it'}.`);
  }
}

/** The skin whose joints form the character's skeleton: the one with the most joints. */
export function mainSkinIndex(json: GltfJson): number {
  const skins = Array.isArray(json.skins) ? json.skins : [];
  if (!skins.length) throw refuse('no_skin', 'The file has no skin, so there is no skeleton to find legs on. Export the character with its armature and skinning.');
  let best = -1;
  let most = 0;
  skins.forEach((skin, i) => {
    const count = Array.isArray(skin.joints) ? skin.joints.length : 0;
    if (count > most) {
      most = count;
      best = i;
    }
  });
  if (best < 0) throw refuse('no_joints', 'The file has a skin but it lists no joints. Export the armature with the mesh bound to it.');
  if (most > MAX_JOINTS) throw refuse('too_many_joints', `The skin has ${most} joints; Treadle accepts at most ${MAX_JOINTS}. Export only the body's deforming bones.`);
  return best;
}

/**
 * The skeleton must stand in the scene that shows the character (glTF 2.0 §3.5.1: the scene property names the
 * scene to render; §3.7.3.1: a skin's joints form one hierarchy under its skeleton root). A joint outside it
 * has no place in the world, so its leg could not be placed on the ground. Files without scenes are read as they are.
 */
function checkJointsInScene(json: GltfJson, skinIndex: number): void {
  const scenes = (json.scenes ?? []) as { nodes?: number[] }[];
  if (!scenes.length) return;
  const sceneIndex = typeof json.scene === 'number' ? json.scene : 0;
  const nodes = json.nodes ?? [];
  const inScene = new Uint8Array(nodes.length);
  const stack = [...(scenes[sceneIndex]?.nodes ?? [])];
  while (stack.length) {
    const n = stack.pop()!;
    if (inScene[n]) continue;
    inScene[n] = 1;
    for (const c of (nodes[n]?.children as number[] | undefined) ?? []) stack.push(c);
  }
  const joints = json.skins![skinIndex].joints as number[];
  const outside = joints.filter((j) => !inScene[j]);
  if (outside.length) {
    throw refuse(
      'bad_hierarchy',
      `${outside.length} of the skin's ${joints.length} joints (first ${nodeLabel(json, outside[0])}) are not in scene ${sceneIndex}, the scene that shows the character. Export the armature inside the character's scene.`,
    );
  }
}

export function checkStructure(json: GltfJson, supportedExtensions: ReadonlySet<string>): { skin: number } {
  checkExtensions(json, supportedExtensions);
  checkHierarchy(json);
  checkTransforms(json);
  const skin = mainSkinIndex(json);
  checkJointsInScene(json, skin);
  return { skin };
}
