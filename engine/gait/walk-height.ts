/**
 * The neutral body height of a walking rig: the rig's own standing height,
 * lowered where needed so that at the ends of a stance (the foot half a
 * stance travel ahead of or behind the hip) every leg is at NEUTRAL_REACH of
 * its reach. Characters modelled with straight legs at rest then walk with
 * bent knees instead of at full extension, where every step would snap.
 * A leg that cannot change its length (one segment turning at the hip) has
 * no bend to keep: the body rides where it stands at full length over its
 * neutral spot, the only height at which its foot meets the ground there.
 */
import type { GaitParams } from './gait-params';
import { NEUTRAL_REACH } from './reach';
import type { LegChain } from '../rig/types';
import type { Rig } from './rig';

/** A leg of one joint that is not a slider: its foot keeps one distance from the hip (it cannot fold). */
export function fixedLengthLeg(chain: LegChain): boolean {
  return chain.joints.length === 1 && chain.joints[0].kind !== 'slider';
}

/** Never crouch below this share of reach straight down (a leg folded past it is out of its useful range). */
const LOWEST_SHARE = 0.55;

export function neutralWalkHeight(rig: Rig, gait: Pick<GaitParams, 'stride' | 'dutyFactor'>): number {
  let h = rig.hipHeight;
  const half = (gait.dutyFactor * gait.stride) / 2;
  for (const leg of rig.legs) {
    if (fixedLengthLeg(leg.chain)) {
      const dx = leg.neutralFoot[0] - leg.hip[0];
      const dz = leg.neutralFoot[1] - leg.hip[2];
      h = Math.min(h, Math.sqrt(Math.max(leg.chain.reach ** 2 - dx * dx - dz * dz, 0)) - leg.hip[1]);
      continue;
    }
    const r = NEUTRAL_REACH * leg.chain.reach;
    const dx = leg.neutralFoot[0] - leg.hip[0];
    const dz = Math.abs(leg.neutralFoot[1] - leg.hip[2]) + half;
    const drop = Math.sqrt(Math.max(r * r - dx * dx - dz * dz, (LOWEST_SHARE * leg.chain.reach) ** 2));
    h = Math.min(h, drop - leg.hip[1]);
  }
  return h;
}
