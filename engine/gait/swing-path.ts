/**
 * Swing paths: how a foot travels from liftoff to touchdown. The horizontal
 * motion follows a minimum-jerk profile; the height rises to an apex that
 * clears the highest ground under the path by the step height, and falls back
 * with zero vertical speed at both ends. When the smooth shape would clip the
 * ground (a riser close to either end), the planner makes it boxier: lift
 * first, then move across, then set down. Plans are plain mutable records so
 * a trial reuses one per leg without allocating.
 */
import type { Heightfield } from '../course/heightfield';
import * as groundQueries from '../course/ground';
import type { Ground } from '../course/ground';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { asGround, maxHeightAlong, segmentClearance } = groundQueries;

export interface SwingPlan {
  x0: number;
  y0: number;
  z0: number;
  x1: number;
  y1: number;
  z1: number;
  /** Absolute apex height, metres. */
  apex: number;
  /** 0 = smooth arc, 1 = lift, traverse, set down. */
  boxiness: number;
  /** Smallest clearance of the planned path above the ground between its ends, metres. */
  clearance: number;
}

export function createSwingPlan(): SwingPlan {
  return { x0: 0, y0: 0, z0: 0, x1: 0, y1: 0, z1: 0, apex: 0, boxiness: 0, clearance: 0 };
}

/** Minimum-jerk blend 10t³ − 15t⁴ + 6t⁵ (zero speed and acceleration at both ends). */
export function minimumJerk(t: number): number {
  const c = t < 0 ? 0 : t > 1 ? 1 : t;
  return c * c * c * (10 + c * (-15 + 6 * c));
}

function smoothstep(t: number): number {
  const c = t < 0 ? 0 : t > 1 ? 1 : t;
  return c * c * (3 - 2 * c);
}

/** Fraction of the swing spent rising (and, at the end, setting down). */
function liftFraction(p: SwingPlan): number {
  return 0.5 - 0.25 * p.boxiness;
}

/** Swing progress at which the foot starts coming down. */
export function descentStart(p: SwingPlan): number {
  return 1 - liftFraction(p);
}

/** Foot position at swing progress tau ∈ [0, 1], written into out[o..o+2]. */
export function swingPoint(p: SwingPlan, tau: number, out: Float64Array | number[], o = 0): void {
  const k = p.boxiness;
  const lift = liftFraction(p);
  const hold = 0.25 * k;
  const s = minimumJerk((tau - hold) / (1 - 2 * hold));
  out[o] = p.x0 + (p.x1 - p.x0) * s;
  out[o + 2] = p.z0 + (p.z1 - p.z0) * s;
  if (tau <= lift) out[o + 1] = p.y0 + (p.apex - p.y0) * smoothstep(tau / lift);
  else if (tau >= 1 - lift) out[o + 1] = p.y1 + (p.apex - p.y1) * smoothstep((1 - tau) / lift);
  else out[o + 1] = p.apex;
}

/** Pieces of the polyline used to check a plan against the ground. */
const CHECK_PIECES = 16;
/** The path may touch the ground at its ends; this much dip is numerical noise. */
const CLEARANCE_SLACK = 1e-4;
const BOXINESS_TRIES = [0, 0.5, 1] as const;

const scratchA = new Float64Array(3);
const scratchB = new Float64Array(3);

function pathClearance(hf: Ground, p: SwingPlan): number {
  let least = Infinity;
  swingPoint(p, 0, scratchA);
  for (let i = 1; i <= CHECK_PIECES; i++) {
    swingPoint(p, i / CHECK_PIECES, scratchB);
    const c = segmentClearance(hf, scratchA[0], scratchA[1], scratchA[2], scratchB[0], scratchB[1], scratchB[2]);
    if (c < least) least = c;
    scratchA.set(scratchB);
  }
  return least;
}

/** Horizontal distance from either end within which the sole may be at the ground (it is lifting off or setting down), m. */
const END_ZONE = 0.03;

/** Smallest height above the ground of the path's points away from its ends (the sole over nosings, lips and rims). */
function interiorClearance(hf: Ground, p: SwingPlan): number {
  let least = Infinity;
  const lower = p.y0 < p.y1 ? p.y0 : p.y1;
  for (let i = 1; i < INTERIOR_SAMPLES; i++) {
    swingPoint(p, i / INTERIOR_SAMPLES, scratchA);
    const x = scratchA[0];
    const z = scratchA[2];
    const d0 = Math.hypot(x - p.x0, z - p.z0);
    const d1 = Math.hypot(x - p.x1, z - p.z1);
    if (d0 < END_ZONE || d1 < END_ZONE) continue;
    // Only where the ground stands above the lower end: a nosing, a lip, a bump; not the ground the foot leaves.
    const g = hf.height(x, z);
    if (g <= lower + OBSTACLE_RISE) continue;
    const c = scratchA[1] - g;
    if (c < least) least = c;
  }
  return least;
}
const INTERIOR_SAMPLES = 48;
/** Ground this much above the lower end counts as something to clear, m. */
const OBSTACLE_RISE = 0.005;
/** Apex raises tried when even the boxiest path passes too close to an edge. */
const APEX_RAISES = 3;

/**
 * Plan a swing from (x0, y0, z0) to (x1, y1, z1) whose apex clears the
 * highest ground under it by stepHeight, and whose points away from its ends stay
 * at least minClearance above the ground; returns the plan (filled in place).
 */
export function planSwing(
  ground: Heightfield | Ground,
  p: SwingPlan,
  x0: number,
  y0: number,
  z0: number,
  x1: number,
  y1: number,
  z1: number,
  stepHeight: number,
  minClearance = 0,
): SwingPlan {
  p.x0 = x0;
  p.y0 = y0;
  p.z0 = z0;
  p.x1 = x1;
  p.y1 = y1;
  p.z1 = z1;
  const hf = asGround(ground);
  const highest = maxHeightAlong(hf, x0, z0, x1, z1);
  p.apex = Math.max(highest, y0, y1) + stepHeight;
  // The ends sit on the ground; measure clearance against the lower of the path and the ground there.
  const endSlack = Math.min(0, y0 - hf.height(x0, z0), y1 - hf.height(x1, z1));
  const apex = p.apex;
  for (let raise = 0; raise <= APEX_RAISES; raise++) {
    let deficit = 0;
    for (const k of BOXINESS_TRIES) {
      p.boxiness = k;
      p.clearance = pathClearance(hf, p);
      deficit = minClearance - interiorClearance(hf, p);
      if (p.clearance >= endSlack - CLEARANCE_SLACK && deficit <= 0) return p;
    }
    // Even lifted first and set down last, the sole passes an edge too closely: lift it higher.
    p.apex += deficit > 0 ? deficit : 0;
  }
  // No lift clears the edge by the floor: the first shape that clears the ground at all.
  p.apex = apex;
  for (const k of BOXINESS_TRIES) {
    p.boxiness = k;
    p.clearance = pathClearance(hf, p);
    if (p.clearance >= endSlack - CLEARANCE_SLACK) break;
  }
  return p;
}
