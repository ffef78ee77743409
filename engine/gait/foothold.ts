/**
 * Foothold choice: where a swinging foot is set down. Candidates lie in a
 * fixed pattern around the nominal spot (rings, plus a line along the walk,
 * where stairs and gaps put their edges); each is scored by a cost of our own
 * design, after the terrain-cost foothold selection of Kalakrishnan et al.
 * (ICRA 2010) around Raibert's neutral point (1986):
 *
 *   cost = wd·(distance / radius) + ws·slope angle + wr·roughness
 *          + we·(edge + pit) + wreach·(over-extension)²
 *
 * - edge: the largest height jump under the sole, counted more the closer to
 *   the sole's centre it is: it catches stair nosings, curb lips and rims;
 * - pit: how far the sole sits below ground that rises steeply on both sides
 *   of it within a share of the leg's reach (a trench, a hole). The sole of a
 *   foot stood in the middle of a trench sees no edge under it, so without this
 *   a trench floor was the cleanest spot around;
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

/**
 * Pit probe: rays in eight directions out to PIT_REACH of the leg's reach, sampled at thirds. Ground on a
 * ray counts as a rim when it stands above the sole by more than PIT_GRADE of its distance (walls steeper
 * than about 14°); a ramp, a stair run or a broad dip has no rim on one of any two opposite rays.
 * Our own choice (common practice, no source).
 */
export const PIT_REACH = 0.3;
export const PIT_GRADE = 0.25;
const PIT_DIRECTIONS = 8;
const PIT_SAMPLES = [1 / 3, 2 / 3, 1];
const pitDx = new Float64Array(PIT_DIRECTIONS);
const pitDz = new Float64Array(PIT_DIRECTIONS);
for (let k = 0; k < PIT_DIRECTIONS; k++) {
  pitDx[k] = Math.sin((2 * Math.PI * k) / PIT_DIRECTIONS);
  pitDz[k] = Math.cos((2 * Math.PI * k) / PIT_DIRECTIONS);
}
const rimRise = new Float64Array(PIT_DIRECTIONS);

/**
 * How deep (m) the spot (x, z) at height hc lies in a pit: over the pairs of opposite rays, the lower of
 * their two rims' rise above it (less the grade allowance); 0 when no pair has a rim on both sides.
 */
export function pitDepth(ground: Ground, x: number, z: number, hc: number, radius: number): number {
  if (radius <= 0) return 0;
  for (let k = 0; k < PIT_DIRECTIONS; k++) {
    let rise = 0;
    for (let j = 0; j < PIT_SAMPLES.length; j++) {
      const d = PIT_SAMPLES[j] * radius;
      const r = ground.height(x + pitDx[k] * d, z + pitDz[k] * d) - hc - PIT_GRADE * d;
      if (r > rise) rise = r;
    }
    rimRise[k] = rise;
  }
  let pit = 0;
  for (let k = 0; k < PIT_DIRECTIONS / 2; k++) {
    const a = rimRise[k];
    const b = rimRise[k + PIT_DIRECTIONS / 2];
    const both = a < b ? a : b;
    if (both > pit) pit = both;
  }
  return pit;
}

const normalScratch = new Float64Array(3);

/** The terrain part of a candidate's cost (slope, roughness, edges, pits) for a leg of this reach; the candidate's height goes to out[0]. */
export function terrainCost(ground: Ground, x: number, z: number, soleHalf: number, reach: number, w: FootholdWeights, out: Float64Array): number {
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
  const pit = pitDepth(ground, x, z, hc, PIT_REACH * reach);
  return w.slopeWeight * slope + w.roughnessWeight * (spread / n) + w.edgeWeight * (edge + pit);
}
