/** The rig mapping by joint names (what a profile carries) to and from joint indices (what a skeleton uses). */
import type { LegMapping } from '../rig/leg-mapping';
import type { ProfileRig } from './schema';

export class LegProfileBindError extends Error {
  constructor(
    message: string,
    /** Every joint name the profile needs and the skeleton lacks, as "leg: joint". */
    readonly missing: string[] = [],
  ) {
    super(message);
    this.name = 'LegProfileBindError';
  }
}

interface NamedJoints {
  joints: readonly { name: string }[];
}

/** The character's legs with each joint index replaced by its skeleton name, and the unit fix a game applies to its skeleton. */
export function profileRigOf(skeleton: NamedJoints, legs: readonly LegMapping[], unitScale = 1): ProfileRig {
  const nameOf = (j: number) => {
    const joint = skeleton.joints[j];
    if (!joint) throw new LegProfileBindError(`the skeleton has no joint ${j}`);
    return joint.name;
  };
  return {
    unitScale,
    legs: legs.map((leg) => ({
      name: leg.name,
      side: leg.side,
      joints: leg.joints.map((j) => ({ joint: nameOf(j.joint), dof: j.dof, axes: j.axes.map((a) => [a[0], a[1], a[2]]), limits: j.limits.map((l) => ({ min: l.min, max: l.max })) })),
      end: nameOf(leg.end),
    })),
  };
}

/**
 * The profile's legs on a game's skeleton, joints found by name. Throws one LegProfileBindError that names every
 * missing joint (and every name the skeleton uses twice, which cannot be bound unambiguously).
 */
export function legMappingsFor(skeleton: NamedJoints, rig: ProfileRig): LegMapping[] {
  const index = new Map<string, number>();
  const twice = new Set<string>();
  skeleton.joints.forEach((j, i) => {
    if (index.has(j.name)) twice.add(j.name);
    else index.set(j.name, i);
  });
  const missing: string[] = [];
  const ambiguous: string[] = [];
  const find = (leg: string, name: string) => {
    if (twice.has(name)) ambiguous.push(`${leg}: "${name}"`);
    const i = index.get(name);
    if (i === undefined) missing.push(`${leg}: "${name}"`);
    return i ?? -1;
  };
  const legs = rig.legs.map((leg) => ({
    name: leg.name,
    side: leg.side,
    joints: leg.joints.map((j) => ({ joint: find(leg.name, j.joint), dof: j.dof, axes: j.axes, limits: j.limits })),
    end: find(leg.name, leg.end),
  }));
  if (missing.length || ambiguous.length) {
    const parts: string[] = [];
    if (missing.length) parts.push(`the skeleton has no joint named ${missing.join(', ')}`);
    if (ambiguous.length) parts.push(`the skeleton has more than one joint named ${ambiguous.join(', ')}`);
    throw new LegProfileBindError(`cannot bind the leg profile: ${parts.join('; ')}`, missing);
  }
  return legs;
}
