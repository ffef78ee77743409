/** Wicket: the courier robot, a biped about 1.4 m tall with a parcel pack on its back. */
import { limb, mirrorBones, type BoneSpec, type PartSpec, type RigDesign } from './rig-builder';

const leftLimbs: BoneSpec[] = [
  { name: 'thigh_L', parent: 'pelvis', at: [0.12, 0.68, 0] },
  { name: 'shin_L', parent: 'thigh_L', at: [0.12, 0.38, 0.04] },
  { name: 'foot_L', parent: 'shin_L', at: [0.12, 0.09, 0] },
  { name: 'toe_L', parent: 'foot_L', at: [0.12, 0.03, 0.13] },
  { name: 'upperarm_L', parent: 'chest', at: [0.24, 1.12, 0] },
  { name: 'forearm_L', parent: 'upperarm_L', at: [0.28, 0.88, 0.02] },
  { name: 'hand_L', parent: 'forearm_L', at: [0.3, 0.66, 0.06] },
];

const bones: BoneSpec[] = [
  { name: 'pelvis', parent: null, at: [0, 0.72, 0] },
  { name: 'spine', parent: 'pelvis', at: [0, 0.86, 0] },
  { name: 'chest', parent: 'spine', at: [0, 1.04, 0] },
  { name: 'neck', parent: 'chest', at: [0, 1.2, 0] },
  { name: 'head', parent: 'neck', at: [0, 1.26, 0.01] },
  { name: 'antenna', parent: 'head', at: [0.07, 1.44, -0.03] },
  ...leftLimbs,
  ...mirrorBones(leftLimbs, '_L', '_R'),
];

function side(s: 'L' | 'R'): PartSpec[] {
  const x = s === 'L' ? 1 : -1;
  return [
    limb(bones, `thigh_${s}`, `shin_${s}`, 0.11, 'frame'),
    limb(bones, `shin_${s}`, `foot_${s}`, 0.09, 'shell'),
    { bone: `foot_${s}`, from: [0.12 * x, 0.05, -0.05], to: [0.12 * x, 0.03, 0.16], width: 0.1, depth: 0.06, finish: 'dark' },
    limb(bones, `upperarm_${s}`, `forearm_${s}`, 0.07, 'frame'),
    limb(bones, `forearm_${s}`, `hand_${s}`, 0.06, 'shell'),
    { bone: `hand_${s}`, from: [0.3 * x, 0.66, 0.06], to: [0.31 * x, 0.58, 0.07], width: 0.07, finish: 'accent' },
  ];
}

export const wicket: RigDesign = {
  name: 'Wicket',
  bones,
  parts: [
    { bone: 'pelvis', from: [0, 0.66, 0], to: [0, 0.8, 0], width: 0.3, depth: 0.18, finish: 'frame' },
    { bone: 'spine', from: [0, 0.8, 0], to: [0, 1.0, 0], width: 0.26, depth: 0.18, finish: 'shell' },
    { bone: 'chest', from: [0, 0.98, 0], to: [0, 1.18, 0], width: 0.38, depth: 0.24, finish: 'shell' },
    { bone: 'chest', from: [0, 0.88, -0.14], to: [0, 1.16, -0.14], width: 0.32, depth: 0.16, finish: 'accent' },
    { bone: 'neck', from: [0, 1.17, 0], to: [0, 1.24, 0], width: 0.08, finish: 'dark' },
    { bone: 'head', from: [0, 1.23, 0.01], to: [0, 1.4, 0.01], width: 0.24, depth: 0.2, finish: 'shell' },
    { bone: 'head', from: [0, 1.29, 0.1], to: [0, 1.35, 0.1], width: 0.18, depth: 0.03, finish: 'accent' },
    limb(bones, 'head', 'antenna', 0.015, 'dark'),
    ...side('L'),
    ...side('R'),
  ],
};
