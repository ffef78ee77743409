/**
 * Builds a skinned glTF 2.0 character from a simple design: bones at rest world positions and
 * boxes along bone segments, each box bound rigidly to one bone. Bones keep the identity rotation,
 * so each inverse bind matrix is the translation to the bone's rest position (glTF 2.0 §3.7.3.3).
 */
import type { Document, Node } from '@gltf-transform/core';
import { gltfCore, memoryNodeIO } from '../../server/services/gltf-import-library';

export type V3 = [number, number, number];

export interface BoneSpec {
  name: string;
  parent: string | null;
  /** Rest world position of the joint, metres, +Y up, front towards +Z. */
  at: V3;
}

export type Finish = 'shell' | 'frame' | 'accent' | 'dark';

/** A box from `from` to `to` (its long axis), `width` across and `depth` the other way, bound to `bone`. */
export interface PartSpec {
  bone: string;
  from: V3;
  to: V3;
  width: number;
  depth?: number;
  finish: Finish;
}

export interface RigDesign {
  name: string;
  bones: BoneSpec[];
  parts: PartSpec[];
}

/** Treadle's palette (constants/theme.ts) as linear-light base colours, since glTF's baseColorFactor is linear. */
const FINISH_SRGB: Record<Finish, string> = { shell: '#ECE6D8', frame: '#5A6670', accent: '#E4572E', dark: '#1E252B' };

function srgbToLinear(hex: string): [number, number, number, number] {
  const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
  // IEC 61966-2-1 sRGB transfer function, inverted.
  const lin = c.map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return [lin[0], lin[1], lin[2], 1];
}

const sub = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const cross = (a: V3, b: V3): V3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const scale = (a: V3, s: number): V3 => [a[0] * s, a[1] * s, a[2] * s];
const add = (...vs: V3[]): V3 => vs.reduce((s, v) => [s[0] + v[0], s[1] + v[1], s[2] + v[2]], [0, 0, 0] as V3);
const normalize = (a: V3): V3 => scale(a, 1 / Math.hypot(a[0], a[1], a[2]));

interface Geometry {
  positions: number[];
  normals: number[];
  joints: number[];
  weights: number[];
  indices: number[];
}

/** Appends an oriented box: 24 vertices (flat normals per face), 12 triangles, wound counter-clockwise outward. */
function appendBox(g: Geometry, part: PartSpec, bone: number): void {
  const axis = sub(part.to, part.from);
  const a = normalize(axis);
  const ref: V3 = Math.abs(a[1]) < 0.9 ? [0, 1, 0] : [1, 0, 0];
  const u = normalize(cross(ref, a));
  const v = cross(a, u);
  const hu = scale(u, part.width / 2);
  const hv = scale(v, (part.depth ?? part.width) / 2);
  const corner = (end: 0 | 1, su: number, sv: number) => add(end ? part.to : part.from, scale(hu, su), scale(hv, sv));
  const faces: { n: V3; quad: V3[] }[] = [
    { n: scale(a, -1), quad: [corner(0, -1, -1), corner(0, -1, 1), corner(0, 1, 1), corner(0, 1, -1)] },
    { n: a, quad: [corner(1, -1, -1), corner(1, 1, -1), corner(1, 1, 1), corner(1, -1, 1)] },
    { n: u, quad: [corner(0, 1, -1), corner(0, 1, 1), corner(1, 1, 1), corner(1, 1, -1)] },
    { n: scale(u, -1), quad: [corner(0, -1, -1), corner(1, -1, -1), corner(1, -1, 1), corner(0, -1, 1)] },
    { n: v, quad: [corner(0, -1, 1), corner(1, -1, 1), corner(1, 1, 1), corner(0, 1, 1)] },
    { n: scale(v, -1), quad: [corner(0, -1, -1), corner(0, 1, -1), corner(1, 1, -1), corner(1, -1, -1)] },
  ];
  for (const { n, quad } of faces) {
    const base = g.positions.length / 3;
    // Keep the winding counter-clockwise seen from outside, whatever the frame's handedness.
    const e1 = sub(quad[1], quad[0]);
    const e2 = sub(quad[2], quad[0]);
    const c = cross(e1, e2);
    const flip = c[0] * n[0] + c[1] * n[1] + c[2] * n[2] < 0;
    for (const p of quad) {
      g.positions.push(...p);
      g.normals.push(...normalize(n));
      g.joints.push(bone, 0, 0, 0);
      g.weights.push(1, 0, 0, 0);
    }
    const tri = flip ? [0, 2, 1, 0, 3, 2] : [0, 1, 2, 0, 2, 3];
    g.indices.push(...tri.map((i) => base + i));
  }
}

/** The design as a glTF document: one skinned mesh (a primitive per finish) and its skeleton. */
export function buildCharacterDocument(design: RigDesign): Document {
  const doc: Document = new (gltfCore().Document)();
  doc.getRoot().getAsset().generator = 'Treadle demo rig builder';
  const buffer = doc.createBuffer();
  const index = new Map(design.bones.map((b, i) => [b.name, i]));
  if (index.size !== design.bones.length) throw new Error(`${design.name}: bone names repeat.`);

  const nodes: Node[] = design.bones.map((bone) => {
    const parent = bone.parent === null ? null : design.bones[index.get(bone.parent) ?? -1];
    if (bone.parent !== null && !parent) throw new Error(`${design.name}: bone ${bone.name} names a missing parent ${bone.parent}.`);
    return doc.createNode(bone.name).setTranslation(parent ? sub(bone.at, parent.at) : bone.at);
  });
  design.bones.forEach((bone, i) => {
    if (bone.parent !== null) nodes[index.get(bone.parent)!].addChild(nodes[i]);
  });

  const roots = design.bones.filter((b) => b.parent === null);
  if (roots.length !== 1) throw new Error(`${design.name}: a design has exactly one root bone.`);
  const inverseBind = new Float32Array(16 * design.bones.length);
  design.bones.forEach((bone, i) => {
    inverseBind.set([1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, -bone.at[0], -bone.at[1], -bone.at[2], 1], 16 * i);
  });
  const skin = doc
    .createSkin(`${design.name} skeleton`)
    .setSkeleton(nodes[index.get(roots[0].name)!])
    .setInverseBindMatrices(doc.createAccessor('inverseBindMatrices').setType('MAT4').setArray(inverseBind).setBuffer(buffer));
  nodes.forEach((n) => skin.addJoint(n));

  const mesh = doc.createMesh(`${design.name} body`);
  for (const finish of ['shell', 'frame', 'accent', 'dark'] as const) {
    const parts = design.parts.filter((p) => p.finish === finish);
    if (!parts.length) continue;
    const g: Geometry = { positions: [], normals: [], joints: [], weights: [], indices: [] };
    for (const part of parts) {
      const bone = index.get(part.bone);
      if (bone === undefined) throw new Error(`${design.name}: a part names a missing bone ${part.bone}.`);
      appendBox(g, part, bone);
    }
    const material = doc.createMaterial(finish).setBaseColorFactor(srgbToLinear(FINISH_SRGB[finish])).setMetallicFactor(0.1).setRoughnessFactor(0.7);
    const accessor = (name: string, type: 'VEC3' | 'VEC4' | 'SCALAR', array: Float32Array<ArrayBuffer> | Uint16Array<ArrayBuffer> | Uint32Array<ArrayBuffer>) =>
      doc.createAccessor(`${finish} ${name}`).setType(type).setArray(array).setBuffer(buffer);
    const vertexCount = g.positions.length / 3;
    const primitive = doc
      .createPrimitive()
      .setMaterial(material)
      .setAttribute('POSITION', accessor('positions', 'VEC3', new Float32Array(g.positions)))
      .setAttribute('NORMAL', accessor('normals', 'VEC3', new Float32Array(g.normals)))
      .setAttribute('JOINTS_0', accessor('joints', 'VEC4', new Uint16Array(g.joints)))
      .setAttribute('WEIGHTS_0', accessor('weights', 'VEC4', new Float32Array(g.weights)))
      .setIndices(accessor('indices', 'SCALAR', vertexCount > 65535 ? new Uint32Array(g.indices) : new Uint16Array(g.indices)));
    mesh.addPrimitive(primitive);
  }

  const body = doc.createNode(`${design.name} body`).setMesh(mesh).setSkin(skin);
  doc.createScene(design.name).addChild(body).addChild(nodes[index.get(roots[0].name)!]);
  doc.getRoot().setDefaultScene(doc.getRoot().listScenes()[0]);
  return doc;
}

/** The design as a .glb file. */
export async function buildCharacterGlb(design: RigDesign): Promise<Uint8Array> {
  return memoryNodeIO().writeBinary(buildCharacterDocument(design));
}

/** A bone segment box from one bone to another (or to a point), bound to the first. */
export function limb(bones: BoneSpec[], from: string, to: string | V3, width: number, finish: Finish, depth?: number): PartSpec {
  const at = (name: string) => {
    const b = bones.find((x) => x.name === name);
    if (!b) throw new Error(`No bone ${name}.`);
    return b.at;
  };
  return { bone: from, from: at(from), to: typeof to === 'string' ? at(to) : to, width, depth, finish };
}

/** Mirrors a left-side bone list (names ending in the given left tag, x > 0) to the right. */
export function mirrorBones(bones: BoneSpec[], left: string, right: string): BoneSpec[] {
  const swap = (name: string | null) => (name && name.endsWith(left) ? name.slice(0, -left.length) + right : name);
  return bones.map((b) => ({ name: swap(b.name)!, parent: swap(b.parent), at: [-b.at[0], b.at[1], b.at[2]] }));
}
