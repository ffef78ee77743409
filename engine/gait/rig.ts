/**
 * A walking rig: leg chains placed on a body. The body frame has its origin
 * at hip level in the middle of the body, +Z forward, +Y up, +X to the
 * character's left (glTF conventions). The body walks along world +Z.
 */
import type { LegChain } from '../rig/types';

export interface RigLeg {
  /** Unique within the rig, e.g. 'left-fore'. */
  name: string;
  chain: LegChain;
  /** Hip socket (chain root) position in the body frame, metres. */
  hip: [number, number, number];
  /** Hip socket rotation in the body frame, [x, y, z, w]. */
  hipRotation: [number, number, number, number];
  /** Where the foot stands at the neutral pose, body-frame (x, z), metres. */
  neutralFoot: [number, number];
}

export interface Rig {
  name: string;
  legs: RigLeg[];
  /** Height of the body origin (hip level) above flat ground at the neutral stance, metres. */
  hipHeight: number;
}

/** Throws an Error naming what is wrong with a rig built outside the presets. */
export function checkRig(rig: Rig): void {
  if (rig.legs.length === 0) throw new Error(`rig ${rig.name}: needs at least one leg`);
  if (!(rig.hipHeight > 0)) throw new Error(`rig ${rig.name}: hipHeight must be positive, got ${rig.hipHeight}`);
  const seen = new Set<string>();
  for (const leg of rig.legs) {
    if (seen.has(leg.name)) throw new Error(`rig ${rig.name}: two legs are named ${leg.name}`);
    seen.add(leg.name);
    if (leg.chain.joints.length === 0) throw new Error(`rig ${rig.name}: leg ${leg.name} has no joints`);
    const q = leg.hipRotation;
    if (Math.abs(Math.hypot(q[0], q[1], q[2], q[3]) - 1) > 1e-6) {
      throw new Error(`rig ${rig.name}: leg ${leg.name} hipRotation must be a unit quaternion`);
    }
  }
}
