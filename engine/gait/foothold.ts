/**
 * Foothold choice: where a swinging foot is set down. Candidates lie in a
 * fixed pattern around the nominal spot (rings, plus a line along the walk,
 * where stairs and gaps put their edges); each is scored by a cost of our own
 * design, after the terrain-cost foothold selection of Kalakrishnan et al.
 * (ICRA 2010) around Raibert's neutral point (1986):
 *
 *   cost = wd·(distance / radius) + ws·slope angle + wr·roughness + we·edge
 *          + wreach·(over-extension)²
 *
 * - edge: the largest height jump under the sole, counted more the closer to
 *   the sole's centre it is: it catches stair nosings, curb lips and rims;
 * - roughness: the mean height spread under the sole;
 * - reach: candidates the leg cannot reach from the hip as it will be at
 *   touchdown and at liftoff (with a margin) are rejected; those near full
 *   extension cost more.
 * The choice is made once per swing, at liftoff, so it never flickers.
 * Nothing here allocates.
 */
import type { Ground } from '../course/ground';

/** Settings of the foothold search (part of the leg setup). */
export interface FootholdWeights {
  searchRadius: number;
  distanceWeight: number;
  slopeWeight: number;
  roughnessWeight: number;
  edgeWeight: number;
  reachWeight: number;
}

/** Candidate pattern in units of the search radius: centre, three rings of eight, and a line along the walk. */
const RING_RADII = [1 / 3, 2 / 3, 1];
const RING_POINTS = 8;
const LINE_STEPS = [-1, -5 / 6, -4 / 6, -3 / 6, -2 / 6, -1 / 6, 1 / 6, 2 / 6, 3 / 6, 4 / 6, 5 / 6, 1];
function buildPattern(): Float64Array {
  const pts: number[] = [0, 0];
  for (const r of RING_RADII) {
    for (let k = 0; k < RING_POINTS; k++) {
      const a = (2 * Math.PI * k) / RING_POINTS;
      pts.push(r * Math.sin(a), r * Math.cos(a));
    }
  }
  for (const s of LINE_STEPS) pts.push(0, s);
  return Float64Array.from(pts);
}
/** (x, z) pairs. */
export const CANDIDATE_PATTERN = buildPattern();
export const CANDIDATE_COUNT = CANDIDATE_PATTERN.length / 2;

/** Footprint samples in units of the sole's half-length: two rings of eight. */
const FOOT_RADII = [0.45, 1];
const FOOT_POINTS = 8;
const footDx = new Float64Array(FOOT_RADII.length * FOOT_POINTS);
const footDz = new Float64Array(FOOT_RADII.length * FOOT_POINTS);
const footCloseness = new Float64Array(FOOT_RADII.length * FOOT_POINTS);
for (let r = 0; r < FOOT_RADII.length; r++) {
  for (let k = 0; k < FOOT_POINTS; k++) {
    const a = (2 * Math.PI * k) / FOOT_POINTS;
    const i = r * FOOT_POINTS + k;
    footDx[i] = FOOT_RADII[r] * Math.sin(a);
    footDz[i] = FOOT_RADII[r] * Math.cos(a);
    // A jump at the sole's rim counts half as much as one near its centre.
    footCloseness[i] = 1.5 - FOOT_RADII[r];
  }
}

/** Height jump (m) past which a sample under the sole is treated as an edge rather than texture. */
const normalScratch = new Float64Array(3);

/** The terrain part of a candidate's cost (slope, roughness, edges); the candidate's height goes to out[0]. */
export function terrainCost(ground: Ground, x: number, z: number, soleHalf: number, w: FootholdWeights, out: Float64Array): number {
  const hc = ground.height(x, z);
  out[0] = hc;
  let edge = 0;
  let spread = 0;
  const n = footDx.length;
  for (let k = 0; k < n; k++) {
    const d = Math.abs(ground.height(x + footDx[k] * soleHalf, z + footDz[k] * soleHalf) - hc);
    spread += d;
    const e = d * footCloseness[k];
    if (e > edge) edge = e;
  }
  ground.normal(x, z, normalScratch, 0);
  const ny = normalScratch[1];
  const slope = Math.acos(ny > 1 ? 1 : ny);
  return w.slopeWeight * slope + w.roughnessWeight * (spread / n) + w.edgeWeight * edge;
}
