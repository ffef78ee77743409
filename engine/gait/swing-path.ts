/**
 * Swing paths: how a foot travels from liftoff to touchdown. The horizontal
 * motion follows a minimum-jerk profile; the height rises to an apex that
 * clears the highest ground under the path by the step height, and falls back
 * with zero vertical speed at both ends. When the smooth shape would clip the
 * ground (a riser close to either end), the planner makes it boxier: lift
 * first, then move across, then set down. A swing that would bring the foot
 * closer to the hip than the leg can fold (uphill, the sole held at the landing
 * spot's height passes just under a hip that has not risen yet) is lowered as
 * far as that needs and the ground allows, or else follows the line from
 * liftoff to touchdown, raised by the step height; a swing that stays clear of
 * the fold is left as it was. Plans are plain mutable records so a trial reuses
 * one per leg without allocating.
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
  /**
   * 0: the sole rises to the apex and comes down from it. Above 0: the sole follows the straight line from
   * liftoff to touchdown, raised by this much (m) between lifting and setting down; apex is then unused.
   */
  rise: number;
}

export function createSwingPlan(): SwingPlan {
  return { x0: 0, y0: 0, z0: 0, x1: 0, y1: 0, z1: 0, apex: 0, boxiness: 0, clearance: 0, rise: 0 };
}

/**
 * The hip as it is at liftoff (hip0) and as it will be at touchdown (hip1), taken to move at an even speed
 * between them, and the least hip-to-sole distance the leg can fold to, m (fold limit × reach).
 */
export interface FoldGuard {
  readonly hip0: Float64Array;
  readonly hip1: Float64Array;
  least: number;
}

export function createFoldGuard(): FoldGuard {
  return { hip0: new Float64Array(3), hip1: new Float64Array(3), least: 0 };
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

/** Swing progress at which the foot starts coming down: for a plan along the line, where its sole is highest. */
export function descentStart(p: SwingPlan): number {
  if (p.rise <= 0) return 1 - liftFraction(p);
  let best = 0;
  let highest = -Infinity;
  for (let i = 0; i <= DESCENT_SAMPLES; i++) {
    const tau = i / DESCENT_SAMPLES;
    const y = p.y0 + (p.y1 - p.y0) * travelShare(p, tau) + p.rise * liftShare(p, tau);
    if (y > highest) {
      highest = y;
      best = tau;
    }
  }
  return best;
}
const DESCENT_SAMPLES = 48;

/** How far the sole is between its end height and the apex (or the raise over the line) at swing progress tau. */
function liftShare(p: SwingPlan, tau: number): number {
  const lift = liftFraction(p);
  if (tau <= lift) return smoothstep(tau / lift);
  if (tau >= 1 - lift) return smoothstep((1 - tau) / lift);
  return 1;
}

/** Share of the way from liftoff to touchdown the sole has come, horizontally, at swing progress tau. */
function travelShare(p: SwingPlan, tau: number): number {
  const hold = 0.25 * p.boxiness;
  return minimumJerk((tau - hold) / (1 - 2 * hold));
}

/** Foot position at swing progress tau ∈ [0, 1], written into out[o..o+2]. */
export function swingPoint(p: SwingPlan, tau: number, out: Float64Array | number[], o = 0): void {
  const s = travelShare(p, tau);
  out[o] = p.x0 + (p.x1 - p.x0) * s;
  out[o + 2] = p.z0 + (p.z1 - p.z0) * s;
  if (p.rise > 0) {
    out[o + 1] = p.y0 + (p.y1 - p.y0) * s + p.rise * liftShare(p, tau);
    return;
  }
  const lift = liftFraction(p);
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

/**
 * Smallest height above the ground of the path away from its ends (the sole over nosings, lips and rims).
 * Between two neighbouring samples the sole is taken at the lower of their heights and the ground at its
 * highest under them: a riser lies between samples, and the sole climbing past it was measured 1–2 cm higher
 * at the next sample than it was over the nosing (a toe 1 mm into a nosing on code stairs).
 */
function interiorClearance(hf: Ground, p: SwingPlan): number {
  let least = Infinity;
  const lower = p.y0 < p.y1 ? p.y0 : p.y1;
  swingPoint(p, 0, scratchB);
  for (let i = 1; i < INTERIOR_SAMPLES; i++) {
    scratchA.set(scratchB);
    swingPoint(p, i / INTERIOR_SAMPLES, scratchB);
    const x = scratchB[0];
    const z = scratchB[2];
    const d0 = Math.hypot(scratchA[0] - p.x0, scratchA[2] - p.z0);
    const d1 = Math.hypot(x - p.x1, z - p.z1);
    if (d0 < END_ZONE || d1 < END_ZONE) continue;
    // Only where the ground stands above the lower end: a nosing, a lip, a bump; not the ground the foot leaves.
    const g = maxHeightAlong(hf, scratchA[0], scratchA[2], x, z);
    if (g <= lower + OBSTACLE_RISE) continue;
    const c = (scratchA[1] < scratchB[1] ? scratchA[1] : scratchB[1]) - g;
    if (c < least) least = c;
  }
  return least;
}
const INTERIOR_SAMPLES = 48;
/** Ground this much above the lower end counts as something to clear, m. */
const OBSTACLE_RISE = 0.005;
/** Apex raises tried when even the boxiest path passes too close to an edge. */
const APEX_RAISES = 3;

/** Swing progress samples checked against the fold, and the least height weight of the apex at a sample that counts. */
const FOLD_SAMPLES = 24;
const FOLD_APEX_SHARE = 0.5;
/** A fold-lowered apex still clears the highest ground under the path by this share of the step height. */
const FOLD_STEP_SHARE = 0.5;

/**
 * The highest apex (or, for a plan that follows the line, the largest rise) at which the plan, with its
 * present boxiness, keeps the sole at least guard.least from the hip through the part of the swing the
 * apex governs; Infinity when any does. The sole's horizontal path does not depend on either and its
 * height is linear in them, so each sample gives a bound.
 */
export function foldCeiling(p: SwingPlan, g: FoldGuard): number {
  const least = g.least;
  const h0 = g.hip0;
  const h1 = g.hip1;
  let ceiling = Infinity;
  for (let i = 1; i < FOLD_SAMPLES; i++) {
    const tau = i / FOLD_SAMPLES;
    const weight = liftShare(p, tau);
    if (weight < FOLD_APEX_SHARE) continue;
    const s = travelShare(p, tau);
    const hx = h0[0] + (h1[0] - h0[0]) * tau;
    const hy = h0[1] + (h1[1] - h0[1]) * tau;
    const hz = h0[2] + (h1[2] - h0[2]) * tau;
    const dx = p.x0 + (p.x1 - p.x0) * s - hx;
    const dz = p.z0 + (p.z1 - p.z0) * s - hz;
    const flat2 = dx * dx + dz * dz;
    if (flat2 >= least * least) continue;
    const highestSole = hy - Math.sqrt(least * least - flat2);
    // The height the sole has at this sample when the apex (or rise) is 0.
    const base = p.rise > 0 ? p.y0 + (p.y1 - p.y0) * s : tau <= 0.5 ? p.y0 : p.y1;
    const bound = p.rise > 0 ? (highestSole - base) / weight : base + (highestSole - base) / weight;
    if (bound < ceiling) ceiling = bound;
  }
  return ceiling;
}

/** Whether the plan as it stands clears the ground between its ends, and edges away from them by minClearance. */
function clearsGround(hf: Ground, p: SwingPlan, endSlack: number, minClearance: number): boolean {
  p.clearance = pathClearance(hf, p);
  return p.clearance >= endSlack - CLEARANCE_SLACK && minClearance - interiorClearance(hf, p) <= 0;
}

/**
 * Keep a swing that would fold the leg tighter than it can go clear of the hip, if the ground lets it:
 * first the line from liftoff to touchdown raised by as much of the step height as the fold allows (the
 * sole then climbs as the hip does), else the apex lowered (never under the highest ground along the path
 * plus FOLD_STEP_SHARE of the step). A lowered plan that only comes closer to the fold is taken when
 * neither keeps clear of it. Returns false (plan as usual) when the swing stays clear of the fold
 * anyway, or when no such plan clears the ground.
 */
function planAwayFromFold(hf: Ground, p: SwingPlan, g: FoldGuard, apex: number, top: number, stepHeight: number, minClearance: number, endSlack: number): boolean {
  p.rise = 0;
  let binds = false;
  for (const k of BOXINESS_TRIES) {
    p.boxiness = k;
    if (foldCeiling(p, g) < apex) binds = true;
  }
  if (!binds) return false;
  const least = Math.max(minClearance, FOLD_STEP_SHARE * stepHeight);
  // Any rise above 0 makes foldCeiling bound the rise of a plan along the line.
  p.rise = 1;
  for (const k of BOXINESS_TRIES) {
    p.boxiness = k;
    const c = foldCeiling(p, g);
    if (c < least) continue;
    p.rise = c < stepHeight ? c : stepHeight;
    if (clearsGround(hf, p, endSlack, minClearance)) return true;
    p.rise = 1;
  }
  p.rise = 0;
  let partial = -1;
  for (const k of BOXINESS_TRIES) {
    p.boxiness = k;
    const c = foldCeiling(p, g);
    p.apex = c < apex ? (c > top + least ? c : top + least) : apex;
    if (!clearsGround(hf, p, endSlack, minClearance)) continue;
    if (c >= p.apex) return true;
    if (partial < 0) partial = k;
  }
  if (partial < 0) return false;
  p.boxiness = partial;
  const c = foldCeiling(p, g);
  p.apex = c < apex ? (c > top + least ? c : top + least) : apex;
  p.clearance = pathClearance(hf, p);
  return true;
}

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
  fold: FoldGuard | null = null,
): SwingPlan {
  p.x0 = x0;
  p.y0 = y0;
  p.z0 = z0;
  p.x1 = x1;
  p.y1 = y1;
  p.z1 = z1;
  const hf = asGround(ground);
  const highest = maxHeightAlong(hf, x0, z0, x1, z1);
  const top = Math.max(highest, y0, y1);
  p.apex = top + stepHeight;
  p.rise = 0;
  // The ends sit on the ground; measure clearance against the lower of the path and the ground there.
  const endSlack = Math.min(0, y0 - hf.height(x0, z0), y1 - hf.height(x1, z1));
  const apex = p.apex;
  if (fold && fold.least > 0 && planAwayFromFold(hf, p, fold, apex, top, stepHeight, minClearance, endSlack)) return p;
  p.apex = apex;
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
