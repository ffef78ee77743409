/**
 * A walking Rig from an imported character: its rest skeleton and the legs
 * the user confirmed (LegMapping[], engine/rig/leg-mapping.ts).
 *
 * Leg chains keep the character's rest (bind) space axes: every chain joint
 * gets the identity rest rotation and its offset is the rest world position
 * difference to the previous joint, so the mapping's axes (given in rest
 * space) are used as they are, and forward kinematics at DOF values 0
 * reproduces the skeleton's rest world positions exactly. The sole point is
 * the mapping's end joint.
 *
 * The body frame (engine/gait/rig.ts) has its origin at the mean of the hip
 * sockets (height and along the walk) on the character's mirror plane, axes
 * as glTF (+Y up, +Z forward). hipHeight is the height of that origin above
 * the lowest sole at rest. Legs are ordered as the gait patterns expect:
 * rows front to back, left before right in a row.
 *
 * Used by the trial workers, the live preview and the leg-profile runtime.
 */
import type { LegJoint, LegMapping } from '../rig/leg-mapping';
import { jointWorldPositions } from '../rig/skeleton-world';
import type { ChainJoint, LegChain, Skeleton } from '../rig/types';
import { checkRig, type Rig, type RigLeg } from './rig';

export class CharacterRigError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CharacterRigError';
  }
}

export interface CharacterRigOptions {
  /** Rig name (defaults to "character"). */
  name?: string;
  /** The character faces −Z (against glTF): the rig is turned half a turn about +Y. */
  facesMinusZ?: boolean;
}

type V3 = [number, number, number];
const IDENTITY: [number, number, number, number] = [0, 0, 0, 1];

/** Hips within this share of the body length are one row (common practice, no source). */
const ROW_TOLERANCE = 0.1;

function sub(a: V3, b: V3): V3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
function len(a: V3): number {
  return Math.hypot(a[0], a[1], a[2]);
}
function unit(a: readonly number[], what: string): V3 {
  const n = Math.hypot(a[0], a[1], a[2]);
  if (!(n > 1e-9)) throw new CharacterRigError(`${what}: the axis has zero length`);
  return [a[0] / n, a[1] / n, a[2] / n];
}

/** Rest world positions of the skeleton, turned when the character faces −Z. */
function restPositions(skeleton: Skeleton, facesMinusZ: boolean): V3[] {
  const p = jointWorldPositions(skeleton);
  const out: V3[] = [];
  for (let j = 0; j < skeleton.joints.length; j++) {
    const x = p[3 * j];
    const z = p[3 * j + 2];
    out.push(facesMinusZ ? [-x, p[3 * j + 1], -z] : [x, p[3 * j + 1], z]);
  }
  return out;
}

/** Mirror plane (middle of the hips' and soles' x extent), mean hip height, mean hip position along the walk. */
function bodyOrigin(hips: V3[], soles: V3[]): V3 {
  const xs = [...hips, ...soles].map((p) => p[0]);
  const mean = (a: number) => hips.reduce((s, p) => s + p[a], 0) / hips.length;
  return [(Math.min(...xs) + Math.max(...xs)) / 2, mean(1), mean(2)];
}

/** The chain joints from the root skeleton joint up to `joint`, root first. */
function ancestry(skeleton: Skeleton, joint: number): number[] {
  const path: number[] = [];
  for (let j = joint; j >= 0 && path.length <= skeleton.joints.length; j = skeleton.joints[j].parent) path.unshift(j);
  return path;
}

function chainJoint(skeleton: Skeleton, lj: LegJoint, offset: V3, boneDir: V3, turn: (v: readonly number[]) => V3, where: string): ChainJoint {
  const name = skeleton.joints[lj.joint].name;
  const base = { name, offset, rest: [...IDENTITY] as [number, number, number, number], skeletonJoint: lj.joint };
  switch (lj.dof) {
    case 'ball': {
      const [swing, twist] = lj.limits;
      return {
        ...base,
        kind: 'ball',
        axes: [],
        ball: swing && twist ? { twistAxis: boneDir, swing: swing.max, twistMin: twist.min, twistMax: twist.max } : undefined,
      };
    }
    case 'hinge':
    case 'slider':
    case 'universal': {
      const n = lj.dof === 'universal' ? 2 : 1;
      if (lj.axes.length !== n) throw new CharacterRigError(`${where}: a ${lj.dof} joint needs ${n} axes, got ${lj.axes.length}`);
      const axes = lj.axes.map((a, k) => unit(turn(a), `${where}.axes[${k}]`));
      const limits = lj.limits.length === n ? lj.limits.map((l) => ({ min: l.min, max: l.max })) : undefined;
      return { ...base, kind: lj.dof, axes, limits };
    }
  }
}

/** Where the knee bends toward, in the hip frame: the first hinge's offset from the hip–sole line. */
function kneeDirectionOf(points: V3[], kneeIndex: number): V3 {
  const hip = points[0];
  const sole = points[points.length - 1];
  const line = sub(sole, hip);
  const l2 = line[0] ** 2 + line[1] ** 2 + line[2] ** 2;
  const k = sub(points[kneeIndex], hip);
  const t = l2 > 0 ? (k[0] * line[0] + k[1] * line[1] + k[2] * line[2]) / l2 : 0;
  const off: V3 = [k[0] - t * line[0], k[1] - t * line[1], k[2] - t * line[2]];
  return len(off) > 1e-6 ? unit(off, 'knee') : [0, 0, 1];
}

/**
 * Build the walking rig of a character. Throws a CharacterRigError naming the
 * leg and joint when a mapping does not fit the skeleton (joint out of range,
 * joints not one path from hip to end, a zero-length segment).
 */
export function rigFromCharacter(skeleton: Skeleton, legs: readonly LegMapping[], options: CharacterRigOptions = {}): Rig {
  const n = skeleton.joints.length;
  if (legs.length === 0) throw new CharacterRigError('the character has no mapped legs');
  const facesMinusZ = options.facesMinusZ ?? false;
  const turn = (v: readonly number[]): V3 => (facesMinusZ ? [-v[0], v[1], -v[2]] : [v[0], v[1], v[2]]);
  const world = restPositions(skeleton, facesMinusZ);

  interface Built {
    mapping: LegMapping;
    points: V3[];
    chain: LegChain;
  }
  const built: Built[] = legs.map((mapping, li) => {
    const where = `legs[${li}] (${mapping.name})`;
    const indices = [...mapping.joints.map((j) => j.joint), mapping.end];
    indices.forEach((j, k) => {
      if (!Number.isInteger(j) || j < 0 || j >= n) throw new CharacterRigError(`${where}: joint ${j} (position ${k}) is not in the skeleton of ${n} joints`);
    });
    // Each mapped joint must lie below the one before it, so the chain is one path hip → end.
    const path = ancestry(skeleton, mapping.end);
    let last = -1;
    for (const j of indices) {
      const at = path.indexOf(j);
      if (at <= last) throw new CharacterRigError(`${where}: joint "${skeleton.joints[j].name}" is not below the joint before it on the way to the end joint`);
      last = at;
    }
    const points = indices.map((j) => world[j]);
    const joints = mapping.joints.map((lj, k) => {
      const offset = k === 0 ? ([0, 0, 0] as V3) : sub(points[k], points[k - 1]);
      const bone = sub(points[k + 1], points[k]);
      if (!(len(bone) > 1e-9)) throw new CharacterRigError(`${where}: joints "${skeleton.joints[indices[k]].name}" and "${skeleton.joints[indices[k + 1]].name}" are at the same place`);
      return chainJoint(skeleton, lj, offset, unit(bone, where), turn, `${where}.joints[${k}]`);
    });
    const sole = sub(points[points.length - 1], points[points.length - 2]);
    let reach = 0;
    for (let k = 1; k < points.length; k++) reach += len(sub(points[k], points[k - 1]));
    const kneeIndex = joints.findIndex((j) => j.kind === 'hinge');
    const chain: LegChain = {
      name: mapping.name,
      kind: 'custom',
      joints,
      sole,
      soleNormal: [0, 1, 0],
      knee: kneeIndex >= 0 ? kneeIndex : undefined,
      kneeDirection: kneeIndex >= 0 ? kneeDirectionOf(points, kneeIndex) : undefined,
      reach,
    };
    return { mapping, points, chain };
  });

  const hips = built.map((b) => b.points[0]);
  const soles = built.map((b) => b.points[b.points.length - 1]);
  const origin = bodyOrigin(hips, soles);
  const ground = Math.min(...soles.map((p) => p[1]));
  const hipHeight = origin[1] - ground;
  if (!(hipHeight > 0)) throw new CharacterRigError(`the hips are not above the feet at rest (hip height ${hipHeight.toFixed(3)} m)`);

  const zs = hips.map((p) => p[2]);
  const bodyLength = Math.max(Math.max(...zs) - Math.min(...zs), hipHeight);
  const order = built.map((_, i) => i);
  order.sort((a, b) => {
    const dz = hips[b][2] - hips[a][2];
    if (Math.abs(dz) > ROW_TOLERANCE * bodyLength) return dz;
    return hips[b][0] - hips[a][0] || a - b; // +X is the character's left
  });

  const rigLegs: RigLeg[] = order.map((i) => {
    const { mapping, chain } = built[i];
    const hip = sub(hips[i], origin);
    const foot = sub(soles[i], origin);
    return { name: mapping.name, chain, hip, hipRotation: [...IDENTITY], neutralFoot: [foot[0], foot[2]] };
  });
  const rig: Rig = { name: options.name ?? 'character', legs: rigLegs, hipHeight };
  try {
    checkRig(rig);
  } catch (err) {
    throw new CharacterRigError((err as Error).message);
  }
  return rig;
}

/** Where the body origin sits in the character's rest space (for placing the character's mesh over a rig). */
export function rigOriginOf(skeleton: Skeleton, legs: readonly LegMapping[], options: CharacterRigOptions = {}): [number, number, number] {
  const world = restPositions(skeleton, options.facesMinusZ ?? false);
  return bodyOrigin(
    legs.map((l) => world[l.joints[0].joint]),
    legs.map((l) => world[l.end]),
  );
}
