/**
 * Reach bands of a walking leg, as fractions of its full reach (hip to sole,
 * everything straight). A stance leg kept below COMFORT_MAX never straightens
 * (straight knees are where the solver snaps); footholds past CANDIDATE_MAX
 * are rejected; a target past TARGET_MAX is pulled onto that sphere rather
 * than chased. The bands are common practice, no source (walking.md: stance
 * legs between about 80 % and 95 % of reach).
 */
export const COMFORT_MAX = 0.93;
export const CANDIDATE_MAX = 0.95;
export const TARGET_MAX = 0.985;
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
