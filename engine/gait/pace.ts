/**
 * Pace: how fast the body walks, as a share of the gait speed, from the
 * ground ahead. The gait clock keeps its cadence, so a slower pace means
 * shorter steps.
 *
 * - Stairs (a run of edges at a regular spacing, all up or all down): each
 *   swing carries the foot a whole number of treads, as many as keep its
 *   climb within RISE_PER_SWING of the leg's reach (at least one), so every
 *   foot lands on a tread, not a nosing.
 * - Other ground: each swing climbs or descends no more than RISE_PER_SWING
 *   of the reach, measured on the ground's upper envelope so that a narrow
 *   gap (which is stepped over, not into) does not count as a drop.
 * - The planted feet: no stance foot is left behind further than the leg can
 *   comfortably reach when it lifts off (stancePace).
 * The rule of thumb behind RISE_PER_SWING: people climb code stairs one tread
 * a step, two risers a swing (common practice, no source).
 */
import { COMFORT_MAX } from './reach';
import type { Walk } from './walk-state';

/** Largest height change one swing may climb or descend, as a share of the shortest leg's reach. */
export const RISE_PER_SWING = 0.33;
/** The body never slows below this share of the gait speed. */
export const SLOWEST_PACE = 0.2;
/** 2 % settling time of the pace filter, s: the walk changes speed over about a step. */
export const PACE_SETTLE_SECONDS = 0.6;
/** Profile sample spacing along the walk, m, and the most samples looked at. */
const SAMPLE_STEP = 0.02;
const MAX_SAMPLES = 256;
/** A height change steeper than this between neighbouring samples is an edge (a riser, a curb, a rim). */
const EDGE_RISE = 0.025;
/** Gaps up to this wide are bridged by the upper envelope, m. */
const ENVELOPE_HALF_WIDTH = 0.15;
/** Treads of one stair run differ by less than this share. */
const TREAD_TOLERANCE = 0.2;

const profile = new Float64Array(MAX_SAMPLES);
const envelope = new Float64Array(MAX_SAMPLES);
const edgeAt = new Float64Array(MAX_SAMPLES);
const edgeRise = new Float64Array(MAX_SAMPLES);

/**
 * Longest swing the pace may ask for, as a share of the setup's stride: the swing's own speed is what the
 * joints were set up for. Feet planted short on a slow stretch were left behind a body that sped up again,
 * and the next swings ran 15 % longer than a stride, the joints at their speed limit and the foot 10–17 cm
 * behind its target. The 5 % allowance is our own choice.
 */
const SWING_MAX = 1.05;

/** Stance time left below this share of the cycle: the foot is about to lift and does not hold the body back. */
const MIN_STANCE_LEFT = 0.05;

/**
 * The pace the planted feet allow: each stance foot must still be within COMFORT_MAX of its reach from the
 * hip when it lifts off. Steps shortened for the ground (treads, at the foot of a stair run) leave feet
 * planted behind a body that then speeds up again; without this the trailing leg was drawn out straight.
 * A foot already past that range is left out: it is about to lift, and stopping the body would not help it.
 */
function stancePace(t: Walk): number {
  const T = t.cycleTime;
  const beta = t.gait.dutyFactor;
  // The way the body travels (a driven body may walk sideways or back), and the way it faces.
  const m = t.motion;
  const v = Math.sqrt(m.vx * m.vx + m.vz * m.vz);
  if (!(v > 0)) return 1;
  const cv = m.vz / v;
  const sv = m.vx / v;
  const c = Math.cos(t.heading);
  const s = Math.sin(t.heading);
  const swing = (1 - beta) * T;
  const halfStance = (beta * t.gait.stride) / 2;
  let pace = 1;
  for (let i = 0; i < t.legs; i++) {
    if (!t.stance[i]) continue;
    const left = (beta - t.phase[i]) * T;
    if (left < MIN_STANCE_LEFT * T) continue;
    const leg = t.rig.legs[i];
    const hx = leg.hip[0];
    const hz = leg.hip[2];
    const dx = t.plant[3 * i] - (t.bodyPos[0] + c * hx + s * hz);
    const dz = t.plant[3 * i + 2] - (t.bodyPos[2] - s * hx + c * hz);
    const along = sv * dx + cv * dz;
    const across = cv * dx - sv * dz;
    const dy = t.bodyPos[1] + leg.hip[1] - t.plant[3 * i + 1];
    const reach = COMFORT_MAX * leg.chain.reach;
    const room = reach * reach - across * across - dy * dy;
    const ahead = (room > 0 ? Math.sqrt(room) : 0) + along;
    if (ahead > 0) {
      const p = ahead / (v * left);
      if (p < pace) pace = p;
    }
    // The swing after this stance: from the plant to the neutral spot as the body will be half a stance after
    // touchdown. At pace p the body covers p·v·(left + swing) + p·β·stride/2 past its neutral spot by then.
    const behind = leg.neutralFoot[1] - leg.hip[2] - along;
    const room2 = SWING_MAX * t.gait.stride - behind;
    const per = v * (left + swing) + halfStance;
    const p2 = room2 > 0 ? room2 / per : 0;
    if (p2 < pace) pace = p2;
  }
  return pace < SLOWEST_PACE ? SLOWEST_PACE : pace;
}

/** The pace the ground ahead and the planted feet ask for, whichever is slower. */
export function terrainPace(t: Walk): number {
  const ground = groundPace(t);
  const feet = stancePace(t);
  return feet < ground ? feet : ground;
}

/** The pace the ground ahead asks for, between the rearmost hip and a stride and a half past the front feet. */
function groundPace(t: Walk): number {
  const stride = t.gait.stride;
  let rear = Infinity;
  let front = -Infinity;
  let reach = Infinity;
  for (const leg of t.rig.legs) {
    if (leg.hip[2] < rear) rear = leg.hip[2];
    if (leg.neutralFoot[1] > front) front = leg.neutralFoot[1];
    if (leg.chain.reach < reach) reach = leg.chain.reach;
  }
  // Along the body's heading (c, s: its cosine and sine).
  const c = Math.cos(t.heading);
  const s = Math.sin(t.heading);
  const x0 = t.bodyPos[0] + s * rear - (s * stride) / 2;
  const z0 = t.bodyPos[2] + c * rear - (c * stride) / 2;
  const x1 = t.bodyPos[0] + s * front + s * 1.5 * stride;
  const z1 = t.bodyPos[2] + c * front + c * 1.5 * stride;
  const length = c * (z1 - z0) + s * (x1 - x0);
  const n = Math.min(MAX_SAMPLES, Math.max(2, Math.ceil(length / SAMPLE_STEP) + 1));
  const step = length / (n - 1);
  const stepX = s * step;
  const stepZ = c * step;
  for (let k = 0; k < n; k++) profile[k] = t.ground.height(x0 + k * stepX, z0 + k * stepZ);
  const allowed = RISE_PER_SWING * reach;

  const stairs = stairPace(n, step, stride, allowed);
  if (stairs > 0) return stairs;

  const half = Math.max(1, Math.round(ENVELOPE_HALF_WIDTH / step));
  for (let k = 0; k < n; k++) {
    let m = -Infinity;
    const a = k - half < 0 ? 0 : k - half;
    const b = k + half >= n ? n - 1 : k + half;
    for (let j = a; j <= b; j++) if (profile[j] > m) m = profile[j];
    envelope[k] = m;
  }
  const span = Math.max(1, Math.round(stride / step));
  let rise = 0;
  for (let k = 0; k + span < n; k++) {
    const d = Math.abs(envelope[k + span] - envelope[k]);
    if (d > rise) rise = d;
  }
  if (rise <= allowed) return 1;
  const pace = allowed / rise;
  return pace < SLOWEST_PACE ? SLOWEST_PACE : pace;
}

/** On a stair run ahead, the pace that carries each foot a whole number of treads; 0 when the ground ahead is no stair run. */
function stairPace(n: number, step: number, stride: number, allowed: number): number {
  let edges = 0;
  let k = 0;
  while (k + 1 < n) {
    const d = profile[k + 1] - profile[k];
    if (Math.abs(d) <= EDGE_RISE) {
      k++;
      continue;
    }
    // One edge may span a few samples: add them up.
    let total = d;
    let j = k + 1;
    while (j + 1 < n && Math.abs(profile[j + 1] - profile[j]) > EDGE_RISE && Math.sign(profile[j + 1] - profile[j]) === Math.sign(d)) {
      total += profile[j + 1] - profile[j];
      j++;
    }
    edgeAt[edges] = (k + j) * 0.5 * step;
    edgeRise[edges] = total;
    edges++;
    k = j;
  }
  if (edges < 3) return 0;
  let treadSum = 0;
  let riseSum = 0;
  for (let e = 0; e < edges; e++) {
    if (Math.sign(edgeRise[e]) !== Math.sign(edgeRise[0])) return 0;
    riseSum += Math.abs(edgeRise[e]);
    if (e > 0) treadSum += edgeAt[e] - edgeAt[e - 1];
  }
  const tread = treadSum / (edges - 1);
  for (let e = 1; e < edges; e++) if (Math.abs(edgeAt[e] - edgeAt[e - 1] - tread) > TREAD_TOLERANCE * tread) return 0;
  const riser = riseSum / edges;
  const byRise = Math.floor(allowed / riser);
  const byStride = Math.floor(stride / tread);
  const treads = Math.max(1, Math.min(byRise, byStride));
  const pace = (treads * tread) / stride;
  return pace > 1 ? 1 : pace < SLOWEST_PACE ? SLOWEST_PACE : pace;
}
