/**
 * Reach bands of a walking leg, as fractions of its full reach (hip to sole,
 * everything straight). A stance leg kept below COMFORT_MAX never straightens
 * (straight knees are where the solver snaps); footholds past CANDIDATE_MAX
 * are rejected; a target past TARGET_MAX is pulled onto that sphere rather
  * than chased; one folded tighter than it can be (measureFoldLimit) is pushed out. The bands are common practice, no source (stance
 * legs between about 80 % and 95 % of reach).
 */
import { forwardKinematics } from '../ik/kinematics';
import type { IKWorkspace } from '../ik/workspace';

export const COMFORT_MAX = 0.93;
export const CANDIDATE_MAX = 0.95;
export const TARGET_MAX = 0.985;
/** A target closer to the hip than this share of reach is pushed out to it: a leg folded tighter flips past its limits. */
export const FOLD_MIN = 0.3;
/** The body never sinks so low that a stance leg is folded below this share of its reach. */
export const STANCE_FOLD_MIN = 0.55;
/** Reach penalties start here. */
export const REACH_COST_START = 0.85;

/** Stance-leg share of reach the neutral body height is chosen for, at the ends of a stance. */
export const NEUTRAL_REACH = 0.88;

/**
 * Pull the point (px, py, pz) toward the hip (hx, hy, hz) onto the sphere of
 * radius `limit` when it lies beyond it; writes into out[o..o+2]; returns
 * true when it pulled.
 */
export function pullInsideReach(
  hx: number,
  hy: number,
  hz: number,
  limit: number,
  out: Float64Array,
  o: number,
): boolean {
  const dx = out[o] - hx;
  const dy = out[o + 1] - hy;
  const dz = out[o + 2] - hz;
  const d = Math.sqrt(dx * dx + dy * dy + dz * dz);
  if (d <= limit) return false;
  const k = limit / d;
  out[o] = hx + dx * k;
  out[o + 1] = hy + dy * k;
  out[o + 2] = hz + dz * k;
  return true;
}

/** Push the point in out[o..o+2] away from the hip onto the sphere of radius `least` when it lies inside it; returns true when it pushed. */
export function pushOutsideFold(
  hx: number,
  hy: number,
  hz: number,
  least: number,
  out: Float64Array,
  o: number,
): boolean {
  let dx = out[o] - hx;
  let dy = out[o + 1] - hy;
  let dz = out[o + 2] - hz;
  let d = Math.sqrt(dx * dx + dy * dy + dz * dz);
  if (d >= least) return false;
  if (d < 1e-9) {
    dx = 0;
    dy = -1;
    dz = 0;
    d = 1;
  }
  const k = least / d;
  out[o] = hx + dx * k;
  out[o + 1] = hy + dy * k;
  out[o + 2] = hz + dz * k;
  return true;
}

/**
 * How tightly a leg can fold, as a share of its reach: drawing the sole in
 * from its rest spot straight toward the hip, each solve starting from the
 * last, the shortest distance the solver still reaches within the joint
 * limits, plus a margin. Measured once per trial, before the walk starts;
 * the workspace's root must be at the origin and its pose at rest.
 */
export function measureFoldLimit(ws: IKWorkspace, reach: number, solveTo: (target: Float64Array) => number): number {
  forwardKinematics(ws);
  const fx = ws.foot[0];
  const fy = ws.foot[1];
  const fz = ws.foot[2];
  const rest = Math.sqrt(fx * fx + fy * fy + fz * fz) / reach;
  let reached = rest;
  for (let k = rest - FOLD_PROBE_STEP; k >= FOLD_PROBE_END - 1e-9; k -= FOLD_PROBE_STEP) {
    const s = k / rest;
    probe[0] = fx * s;
    probe[1] = fy * s;
    probe[2] = fz * s;
    if (solveTo(probe) > FOLD_PROBE_TOLERANCE * reach) break;
    reached = k;
  }
  return Math.max(FOLD_MIN, reached + FOLD_MARGIN);
}
const probe = new Float64Array(3);
const FOLD_PROBE_END = 0.2;
const FOLD_PROBE_STEP = 0.025;
const FOLD_PROBE_TOLERANCE = 0.005;
const FOLD_MARGIN = 0.06;
