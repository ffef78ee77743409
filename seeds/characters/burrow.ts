/** Burrow: the four-legged pack mech, about 1.2 m tall and 1.6 m long, carrying crates and dragging a power cable. */
import { limb, mirrorBones, type BoneSpec, type PartSpec, type RigDesign } from './rig-builder';

const leftLegs: BoneSpec[] = [
  { name: 'upper_FL', parent: 'withers', at: [0.22, 0.84, 0.45] },
  { name: 'lower_FL', parent: 'upper_FL', at: [0.24, 0.5, 0.53] },
  { name: 'pastern_FL', parent: 'lower_FL', at: [0.24, 0.18, 0.44] },
  { name: 'hoof_FL', parent: 'pastern_FL', at: [0.24, 0, 0.48] },
  { name: 'upper_HL', parent: 'croup', at: [0.22, 0.84, -0.45] },
  { name: 'lower_HL', parent: 'upper_HL', at: [0.24, 0.52, -0.56] },
  { name: 'pastern_HL', parent: 'lower_HL', at: [0.24, 0.2, -0.46] },
  { name: 'hoof_HL', parent: 'pastern_HL', at: [0.24, 0, -0.5] },
];

const bones: BoneSpec[] = [
  { name: 'hull', parent: null, at: [0, 0.88, 0] },
  { name: 'withers', parent: 'hull', at: [0, 0.9, 0.45] },
  { name: 'croup', parent: 'hull', at: [0, 0.88, -0.45] },
  { name: 'neck', parent: 'withers', at: [0, 1.0, 0.62] },
  { name: 'sensor', parent: 'neck', at: [0, 1.12, 0.8] },
  { name: 'cable_1', parent: 'croup', at: [0, 0.8, -0.62] },
  { name: 'cable_2', parent: 'cable_1', at: [0, 0.6, -0.76] },
  { name: 'cable_3', parent: 'cable_2', at: [0, 0.34, -0.84] },
  { name: 'cable_4', parent: 'cable_3', at: [0, 0.12, -0.9] },
  ...leftLegs,
  ...mirrorBones(leftLegs, 'L', 'R'),
];

function leg(row: 'F' | 'H', s: 'L' | 'R'): PartSpec[] {
  const k = `${row}${s}`;
  const hoof = bones.find((b) => b.name === `hoof_${k}`)!.at;
  return [
    limb(bones, `upper_${k}`, `lower_${k}`, 0.13, 'frame'),
    limb(bones, `lower_${k}`, `pastern_${k}`, 0.1, 'shell'),
    limb(bones, `pastern_${k}`, `hoof_${k}`, 0.08, 'frame'),
    { bone: `pastern_${k}`, from: [hoof[0], 0.06, hoof[2]], to: [hoof[0], 0, hoof[2]], width: 0.14, finish: 'dark' },
  ];
}

export const burrow: RigDesign = {
  name: 'Burrow',
  bones,
  parts: [
    { bone: 'hull', from: [0, 0.78, -0.6], to: [0, 0.78, 0.6], width: 0.5, depth: 0.26, finish: 'shell' },
    { bone: 'hull', from: [0, 0.92, -0.5], to: [0, 0.92, 0.1], width: 0.56, depth: 0.3, finish: 'accent' },
    { bone: 'hull', from: [0, 0.92, 0.14], to: [0, 0.92, 0.5], width: 0.5, depth: 0.22, finish: 'frame' },
    limb(bones, 'neck', 'sensor', 0.1, 'frame'),
    { bone: 'sensor', from: [0, 1.12, 0.74], to: [0, 1.12, 0.92], width: 0.22, depth: 0.14, finish: 'dark' },
    limb(bones, 'cable_1', 'cable_2', 0.04, 'dark'),
    limb(bones, 'cable_2', 'cable_3', 0.04, 'dark'),
    limb(bones, 'cable_3', 'cable_4', 0.04, 'dark'),
    ...leg('F', 'L'),
    ...leg('F', 'R'),
    ...leg('H', 'L'),
    ...leg('H', 'R'),
  ],
};
