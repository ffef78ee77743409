/** Skitter: the six-legged scrap crawler, about 0.35 m tall at the back, legs splayed wide, two feelers up front. */
import { limb, mirrorBones, type BoneSpec, type PartSpec, type RigDesign } from './rig-builder';

const ROWS = [
  { n: 1, z: 0.16, splay: 0.06 },
  { n: 2, z: 0, splay: 0 },
  { n: 3, z: -0.16, splay: -0.06 },
];

const leftLegs: BoneSpec[] = ROWS.flatMap(({ n, z, splay }) => [
  { name: `coxa_L${n}`, parent: 'thorax', at: [0.1, 0.3, z] as [number, number, number] },
  { name: `femur_L${n}`, parent: `coxa_L${n}`, at: [0.2, 0.36, z + splay] as [number, number, number] },
  { name: `tibia_L${n}`, parent: `femur_L${n}`, at: [0.36, 0.32, z + 1.6 * splay] as [number, number, number] },
  { name: `tarsus_L${n}`, parent: `tibia_L${n}`, at: [0.46, 0, z + 2.2 * splay] as [number, number, number] },
]);

const mirror = (list: BoneSpec[]) =>
  list.map((b) => ({ name: b.name.replace('_L', '_R'), parent: b.parent && b.parent.replace('_L', '_R'), at: [-b.at[0], b.at[1], b.at[2]] as [number, number, number] }));

const bones: BoneSpec[] = [
  { name: 'thorax', parent: null, at: [0, 0.3, 0] },
  { name: 'head', parent: 'thorax', at: [0, 0.31, 0.28] },
  { name: 'feeler_L', parent: 'head', at: [0.07, 0.5, 0.48] },
  { name: 'abdomen', parent: 'thorax', at: [0, 0.33, -0.28] },
  ...leftLegs,
  ...mirror(leftLegs),
];
bones.splice(3, 0, ...mirrorBones(bones.filter((b) => b.name === 'feeler_L'), '_L', '_R'));

function leg(s: 'L' | 'R', n: number): PartSpec[] {
  return [
    limb(bones, `coxa_${s}${n}`, `femur_${s}${n}`, 0.05, 'frame'),
    limb(bones, `femur_${s}${n}`, `tibia_${s}${n}`, 0.045, 'shell'),
    limb(bones, `tibia_${s}${n}`, `tarsus_${s}${n}`, 0.035, 'dark'),
  ];
}

export const skitter: RigDesign = {
  name: 'Skitter',
  bones,
  parts: [
    { bone: 'thorax', from: [0, 0.3, -0.14], to: [0, 0.3, 0.2], width: 0.24, depth: 0.14, finish: 'shell' },
    { bone: 'head', from: [0, 0.31, 0.2], to: [0, 0.31, 0.36], width: 0.16, depth: 0.1, finish: 'frame' },
    { bone: 'abdomen', from: [0, 0.33, -0.14], to: [0, 0.35, -0.44], width: 0.3, depth: 0.18, finish: 'frame' },
    limb(bones, 'head', 'feeler_L', 0.015, 'dark'),
    limb(bones, 'head', 'feeler_R', 0.015, 'dark'),
    ...ROWS.flatMap(({ n }) => [...leg('L', n), ...leg('R', n)]),
  ],
};
