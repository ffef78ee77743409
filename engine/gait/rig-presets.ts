/**
 * Preset rigs built in code from the preset legs (proportions our own):
 * a biped, a quadruped and a hexapod, used by tests, benchmarks and the demo.
 * Left legs are the presets as built (+X is the character's left), right legs
 * their mirror images. Leg order matches the gait patterns (see patterns.ts).
 */
import { digitigradeLeg, humanLeg, insectLeg, mirrorChain } from '../rig/presets';
import type { LegChain } from '../rig/types';
import type { Rig, RigLeg } from './rig';

const IDENTITY: [number, number, number, number] = [0, 0, 0, 1];

function leg(name: string, chain: LegChain, x: number, z: number, footX: number, footZ: number): RigLeg {
  return { name, chain: { ...chain, name }, hip: [x, 0, z], hipRotation: [...IDENTITY], neutralFoot: [footX, footZ] };
}

function pair(side: string, chain: LegChain, x: number, z: number, footX: number, footZ: number): [RigLeg, RigLeg] {
  return [leg(`left-${side}`, chain, x, z, footX, footZ), leg(`right-${side}`, mirrorChain(chain), -x, z, -footX, footZ)];
}

/** Two human-type legs, 1.07 m reach, hips 0.9 m up. */
export function bipedRig(): Rig {
  const chain = humanLeg({ thigh: 0.5, shin: 0.48 });
  const l = leg('left', chain, 0.1, 0, 0.1, 0);
  const r = leg('right', mirrorChain(chain), -0.1, 0, -0.1, 0);
  return { name: 'biped', legs: [l, r], hipHeight: 0.9 };
}

/** Four digitigrade legs on a 1 m body, hips 0.72 m up. */
export function quadrupedRig(): Rig {
  const chain = digitigradeLeg({ scale: 1.5 });
  return {
    name: 'quadruped',
    legs: [...pair('fore', chain, 0.2, 0.5, 0.2, 0.5), ...pair('hind', chain, 0.2, -0.5, 0.2, -0.5)],
    hipHeight: 0.72,
  };
}

/** Six insect legs, three a side 0.35 m apart, feet spread 0.36 m out from the hips, hips 0.18 m up. */
export function hexapodRig(): Rig {
  const chain = insectLeg({ scale: 2 });
  const hipX = 0.12;
  const spread = 0.36;
  return {
    name: 'hexapod',
    legs: [
      ...pair('front', chain, hipX, 0.35, hipX + spread, 0.45),
      ...pair('middle', chain, hipX, 0, hipX + spread, 0),
      ...pair('rear', chain, hipX, -0.35, hipX + spread, -0.45),
    ],
    hipHeight: 0.18,
  };
}

export const PRESET_RIG_NAMES = ['biped', 'quadruped', 'hexapod'] as const;
export type PresetRigName = (typeof PRESET_RIG_NAMES)[number];

export function presetRig(name: PresetRigName): Rig {
  switch (name) {
    case 'biped':
      return bipedRig();
    case 'quadruped':
      return quadrupedRig();
    case 'hexapod':
      return hexapodRig();
    default:
      throw new Error(`unknown preset rig: ${String(name)} (expected one of ${PRESET_RIG_NAMES.join(', ')})`);
  }
}

/** The same rig `factor` times its size (lengths scale, angles keep): how a character authored at another size arrives. */
export function scaledRig(rig: Rig, factor: number): Rig {
  const v = (a: readonly number[]) => [a[0] * factor, a[1] * factor, a[2] * factor] as [number, number, number];
  return {
    ...rig,
    name: `${rig.name} ×${factor}`,
    hipHeight: rig.hipHeight * factor,
    legs: rig.legs.map((l) => ({
      ...l,
      hip: v(l.hip),
      neutralFoot: [l.neutralFoot[0] * factor, l.neutralFoot[1] * factor],
      chain: {
        ...l.chain,
        reach: l.chain.reach * factor,
        sole: v(l.chain.sole),
        toe: l.chain.toe ? { ...l.chain.toe, offset: v(l.chain.toe.offset) } : undefined,
        joints: l.chain.joints.map((j) => ({
          ...j,
          offset: v(j.offset),
          limits: j.kind === 'slider' && j.limits ? j.limits.map((x) => ({ min: x.min * factor, max: x.max * factor })) : j.limits,
        })),
      },
    })),
  };
}
