/**
 * DOF kinds and default limits for the joints of a detected leg, from the rest pose alone.
 * Axes are in the character's rest space (+Y up, glTF 2.0 §3.4); angles in radians relative to rest.
 */
import type { LegDofKind, LegJoint, Vec3 } from './leg-mapping';

const DEG = Math.PI / 180;

/**
 * Default ranges. Human joint ranges of motion, rounded (common practice, from memory):
 * hip flexion about 120° (the swing cone's half-angle: a fore leg folding forward over a step needs it all;
 * 90° clamped it mid-swing and the clamp jumped) with ±35° twist, knee flexion to about 150°, ankle plantarflexion 45° /
 * dorsiflexion 20°, inversion/eversion about 20°, toe ±40°.
 */
export const DEFAULT_LIMITS = {
  hipSwing: 120 * DEG,
  hipTwist: 35 * DEG,
  /**
   * A sprawled hip (its first bone more than 45° from straight down: insect and lizard legs) turns the leg
   * fore and aft about the vertical, and part of that turn is a twist about the bone itself; ±35° left such
   * legs stuck at the limit mid-swing on ramps and stairs. Measured on the demo hexapod (common practice, no source).
   */
  sprawledHipTwist: 60 * DEG,
  kneeFlexMax: 150 * DEG,
  ankleFlex: { min: -20 * DEG, max: 45 * DEG },
  /**
   * An ankle whose foot segment ends the chain (the sole point is the toe) must keep that whole
   * segment flat while the shank swings through the stance: about ±25° of shank swing at a
   * walking stride plus about ±30° taken up from a bent knee (worked from the geometry of a leg at
   * 88 % of its reach over a stance of 0.43 hip heights either side; common practice, no source).
   */
  toeEndedAnkleFlex: { min: -60 * DEG, max: 60 * DEG },
  ankleRoll: 20 * DEG,
  toe: 40 * DEG,
  /** Slider stroke either side of rest, metres. */
  slider: 0.1,
} as const;

const UP: Vec3 = [0, 1, 0];
const LATERAL: Vec3 = [1, 0, 0];

function sub(p: ArrayLike<number>, a: number, b: number): Vec3 {
  return [p[3 * a] - p[3 * b], p[3 * a + 1] - p[3 * b + 1], p[3 * a + 2] - p[3 * b + 2]];
}
function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}
function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}
function norm(a: Vec3): number {
  return Math.sqrt(dot(a, a));
}
function unit(a: Vec3, fallback: Vec3): Vec3 {
  const n = norm(a);
  return n > 1e-9 ? [a[0] / n, a[1] / n, a[2] / n] : [...fallback];
}

/** Whether the segment from `a` to `b` runs closer to horizontal than to vertical (a foot or toe). */
export function segmentIsFlat(positions: ArrayLike<number>, a: number, b: number): boolean {
  const d = sub(positions, b, a);
  const n = norm(d);
  return n > 1e-9 && Math.abs(d[1]) / n < 0.55;
}

/**
 * Where the ankle is on a chain (joint path hip → end): the first joint from the knee on whose
 * next segment is flat and which sits low (below 40% of the hip's height above the lowest point).
 * −1 when the leg has no foot segment (insect and peg legs).
 */
export function findAnkle(positions: ArrayLike<number>, path: readonly number[]): number {
  const ground = Math.min(...path.map((j) => positions[3 * j + 1]));
  const hipHeight = positions[3 * path[0] + 1] - ground;
  for (let k = 1; k < path.length - 1; k++) {
    const low = positions[3 * path[k] + 1] - ground <= 0.4 * hipHeight;
    if (low && segmentIsFlat(positions, path[k], path[k + 1])) return k;
  }
  return -1;
}

/** The kind detection proposes for moving joint k of a path (path includes the end joint). */
export function proposedDofKind(k: number, ankle: number): LegDofKind {
  if (k === 0) return 'ball';
  if (k === ankle) return 'universal';
  return 'hinge';
}

/**
 * Bend axis at joint k: normal of the plane through the joint, its parent and its child, oriented
 * so a positive angle bends further. Straight legs fall back to the character's lateral axis (+X).
 * Also returns the rest bend angle.
 */
export function bendAxis(positions: ArrayLike<number>, path: readonly number[], k: number): { axis: Vec3; bend: number } {
  const before = k > 0 ? sub(positions, path[k], path[k - 1]) : ([0, -1, 0] as Vec3);
  const after = sub(positions, path[k + 1], path[k]);
  const c = cross(before, after);
  const nb = norm(before);
  const na = norm(after);
  if (nb < 1e-9 || na < 1e-9 || norm(c) < 1e-3 * nb * na) return { axis: [...LATERAL], bend: 0 };
  const bend = Math.acos(Math.max(-1, Math.min(1, dot(before, after) / (nb * na))));
  return { axis: unit(c, LATERAL), bend };
}

/** Lateral axis of a foot segment: horizontal and across the foot (up × forward). */
function footAxes(positions: ArrayLike<number>, path: readonly number[], k: number): [Vec3, Vec3] {
  const d = sub(positions, path[k + 1], path[k]);
  const forward = unit([d[0], 0, d[2]], [0, 0, 1]);
  return [unit(cross(UP, forward), LATERAL), forward];
}

/** Whether the segment after joint k points more than 45° away from straight down. */
function isSprawled(positions: ArrayLike<number>, path: readonly number[], k: number): boolean {
  const d = sub(positions, path[k + 1], path[k]);
  const n = norm(d);
  return n > 1e-9 && -d[1] / n < Math.SQRT1_2;
}

/** A moving joint of the given kind with default axes and limits, for joint k of a path hip → end. */
export function defaultLegJoint(positions: ArrayLike<number>, path: readonly number[], k: number, kind: LegDofKind): LegJoint {
  const joint = path[k];
  const ankle = findAnkle(positions, path);
  switch (kind) {
    case 'ball': {
      const twist = isSprawled(positions, path, k) ? DEFAULT_LIMITS.sprawledHipTwist : DEFAULT_LIMITS.hipTwist;
      return { joint, dof: 'ball', axes: [], limits: [{ min: 0, max: DEFAULT_LIMITS.hipSwing }, { min: -twist, max: twist }] };
    }
    case 'universal': {
      const [lateral, forward] = footAxes(positions, path, k);
      const toeEnded = k === path.length - 2;
      const flex = toeEnded ? DEFAULT_LIMITS.toeEndedAnkleFlex : DEFAULT_LIMITS.ankleFlex;
      return {
        joint,
        dof: 'universal',
        axes: [lateral, forward],
        limits: [{ ...flex }, { min: -DEFAULT_LIMITS.ankleRoll, max: DEFAULT_LIMITS.ankleRoll }],
      };
    }
    case 'slider': {
      const d = unit(sub(positions, path[k + 1], path[k]), [0, -1, 0]);
      return { joint, dof: 'slider', axes: [d], limits: [{ min: -DEFAULT_LIMITS.slider, max: DEFAULT_LIMITS.slider }] };
    }
    case 'hinge': {
      if (ankle >= 0 && k > ankle) {
        const [lateral] = footAxes(positions, path, k);
        return { joint, dof: 'hinge', axes: [lateral], limits: [{ min: -DEFAULT_LIMITS.toe, max: DEFAULT_LIMITS.toe }] };
      }
      const { axis, bend } = bendAxis(positions, path, k);
      // From straight (−bend) to the flexion limit, never less than a little room either way.
      return { joint, dof: 'hinge', axes: [axis], limits: [{ min: -bend, max: Math.max(0.1, DEFAULT_LIMITS.kneeFlexMax - bend) }] };
    }
  }
}

/** The joints detection proposes for a path hip → end: hip ball, knee hinges about their bend axes, ankle universal, toe hinges. */
export function proposedLegJoints(positions: ArrayLike<number>, path: readonly number[]): LegJoint[] {
  const ankle = findAnkle(positions, path);
  const joints: LegJoint[] = [];
  for (let k = 0; k < path.length - 1; k++) joints.push(defaultLegJoint(positions, path, k, proposedDofKind(k, ankle)));
  return joints;
}
