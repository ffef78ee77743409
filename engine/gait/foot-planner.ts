/**
 * Foot planner: where each foot lands and how it gets there. At liftoff the
 * touchdown spot is chosen from candidates around the nominal spot (the leg's
 * neutral spot as it will be half a stance after touchdown, Raibert's neutral
 * point, turned with the body on a turn) by the foothold cost (foothold.ts),
 * rejecting what the leg cannot reach from the hip as it will be; the swing
 * starts from where the foot really is, so after a stumble the next step is
 * planned from the truth. A planted foot stays locked; a swinging foot follows
 * its planned path (swing-path.ts).
 */
import { quat, vec3 } from 'gl-matrix';
import * as walkPath from '../course/walk-path';
import * as bodyFilter from './body-filter';
import * as foothold from './foothold';
import * as paceRules from './pace';
import * as reachRules from './reach';
import * as swingPath from './swing-path';
import * as walkHeight from './walk-height';
import * as walkState from './walk-state';
import type { Walk } from './walk-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { createFoldGuard, minimumJerk, planSwing, swingPoint } = swingPath;
const { transformQuat } = vec3;
const { trackPoint } = walkPath;
const { terrainCost, CANDIDATE_PATTERN, CANDIDATE_COUNT } = foothold;
const { CANDIDATE_MAX, REACH_COST_START, TARGET_MAX } = reachRules;
const { terrainPace } = paceRules;
const { criticalIntegral, criticalValueAt } = bodyFilter;
const { fixedLengthLeg } = walkHeight;
const { DRIVE_PATH } = walkState;

/** Candidates for a fixed-length leg (walk-height.ts) within this share of its length from the hip as it will be. */
const FIXED_LENGTH_CANDIDATE_MAX = 1.005;
/** Winter (1992): minimum toe clearance in swing about 1.29 cm; no swing plans less. */
export const MIN_TOE_CLEARANCE = 0.0129;
/** A swing keeps the sole this many times the fold limit from the hip (common practice, no source). */
const FOLD_SWING_MARGIN = 1;

const landing = new Float64Array(3);
/** Times the search radius is doubled when nothing inside it is reachable. */
const SEARCH_WIDENINGS = 2;
const terrain = new Float64Array(1);
const hipLocal = new Float64Array(3);
const hipOffset = new Float64Array(3);
const predicted = new Float64Array(3);
/** The swing's hip at liftoff and at touchdown (chooseFoothold's prediction), against which its fold is checked. */
const foldGuard = createFoldGuard();

/** The body moves at a constant velocity (no path to follow, no turn): the plain arithmetic of a straight walk. */
function steadyVelocity(t: Walk): boolean {
  const m = t.motion;
  return !(m.mode === DRIVE_PATH && m.track) && m.turnRate === 0;
}

/**
 * The pace the walk is heading for: set by the foot planner before it predicts, so that the body is
 * predicted as its pace filter will carry it (NaN: the pace held as it is). After a slow stretch the pace
 * rises over the next step; footholds predicted at the present pace were set short, the body then ran
 * ahead of them, and the following swings were 15 % longer than a stride (the joints at their speed limit).
 */
let paceGoal = NaN;

/** The pace `tau` seconds on, and the distance factor (the pace's integral) over them. */
function paceAfter(t: Walk, tau: number): number {
  return paceGoal === paceGoal ? criticalValueAt(t.pace, paceGoal, t.paceFilter.omega, tau) : t.pace.value;
}
function paceTravel(t: Walk, tau: number): number {
  return paceGoal === paceGoal ? criticalIntegral(t.pace, paceGoal, t.paceFilter.omega, tau) : t.pace.value * tau;
}

/**
 * Where the body will be at walk time `time` as its pace goes, into out (x, z, heading): along its path,
 * or carried on at its velocity and turn rate (the velocity turning with the body: constant turn rate and velocity).
 */
export function bodyAt(t: Walk, time: number, out: Float64Array): void {
  const tau = time - t.frame * t.timeStep;
  const m = t.motion;
  const travel = paceTravel(t, tau);
  if (m.mode === DRIVE_PATH && m.track) {
    trackPoint(m.track, m.s + m.pathSpeed * travel, out);
    return;
  }
  const w = m.turnRate;
  if (w === 0) {
    out[0] = t.bodyPos[0] + m.vx * travel;
    out[1] = t.bodyPos[2] + m.vz * travel;
    out[2] = t.heading;
    return;
  }
  const a = w * tau;
  const A = Math.sin(a) / w;
  const B = (1 - Math.cos(a)) / w;
  const pace = tau !== 0 ? travel / tau : t.pace.value;
  const vx = m.vx * pace;
  const vz = m.vz * pace;
  out[0] = t.bodyPos[0] + vx * A + vz * B;
  out[1] = t.bodyPos[2] - vx * B + vz * A;
  out[2] = t.heading + a;
}

/** The nominal touchdown spot of leg i at `time`: its neutral spot as the body will be half a stance later. */
export function touchdownPoint(t: Walk, i: number, time: number, out: Float64Array, o: number): void {
  const leg = t.rig.legs[i];
  const nx = leg.neutralFoot[0];
  const nz = leg.neutralFoot[1];
  let x: number;
  let zz: number;
  if (steadyVelocity(t)) {
    bodyAt(t, time, predicted);
    const c = Math.cos(predicted[2]);
    const s = Math.sin(predicted[2]);
    const m = t.motion;
    const v = Math.sqrt(m.vx * m.vx + m.vz * m.vz);
    const ux = v > 0 ? m.vx / v : 0;
    const uz = v > 0 ? m.vz / v : 0;
    const half = (t.gait.dutyFactor * t.stride * paceAfter(t, time - t.frame * t.timeStep)) / 2;
    x = predicted[0] + (c * nx + s * nz) + ux * half;
    zz = predicted[1] + (c * nz - s * nx) + uz * half;
  } else {
    bodyAt(t, time + (t.gait.dutyFactor * t.cycleTime) / 2, predicted);
    const c = Math.cos(predicted[2]);
    const s = Math.sin(predicted[2]);
    x = predicted[0] + c * nx + s * nz;
    zz = predicted[1] + c * nz - s * nx;
  }
  out[o] = x;
  out[o + 1] = t.ground.height(x, zz);
  out[o + 2] = zz;
}

export function plantAt(t: Walk, i: number, x: number, y: number, zz: number): void {
  t.plant[3 * i] = x;
  t.plant[3 * i + 1] = y;
  t.plant[3 * i + 2] = zz;
  t.ground.normal(x, zz, t.plantNormal, 3 * i);
  t.support[i] = y;
}

/** A stopping walk's leg i need not step: its planted foot is already within a tenth of a stride of where the step would land (common practice, no source). */
export function restsWhereItStands(t: Walk, i: number, landTime: number): boolean {
  touchdownPoint(t, i, landTime, landing, 0);
  const o = 3 * i;
  const dx = t.plant[o] - landing[0];
  const dz = t.plant[o + 2] - landing[2];
  const tolerance = 0.1 * t.gait.stride;
  return dx * dx + dz * dz <= tolerance * tolerance;
}

/** Height leg i's support will have once it has landed: planted legs where they stand, swinging ones where they land. */
function nextSupportHeight(t: Walk, j: number): number {
  return t.stance[j] ? t.support[j] : t.swings[j].y1;
}

/**
 * Choose leg i's touchdown spot for a landing at `landTime` into out (x, y, z):
 * the cheapest reachable candidate around the nominal spot, widening the
 * search twice when none is; failing that, the one that over-reaches least.
 */
export function chooseFoothold(t: Walk, i: number, landTime: number, out: Float64Array): void {
  paceGoal = terrainPace(t);
  // Reset however the search ends: a game's ground query may throw inside it.
  try {
    searchFoothold(t, i, landTime, out);
  } finally {
    paceGoal = NaN;
  }
}

function searchFoothold(t: Walk, i: number, landTime: number, out: Float64Array): void {
  touchdownPoint(t, i, landTime, landing, 0);
  const w = t.setup.footholds;
  const leg = t.rig.legs[i];
  const reach = leg.chain.reach;
  const beta = t.gait.dutyFactor;
  // Legs with short strides for their reach (insects) still search far enough to step past a gap.
  const radius0 = w.searchRadius * Math.max(t.stride, reach);
  // The hip at touchdown and at the following liftoff, the body at the height these footholds will give it.
  hipLocal[0] = leg.hip[0];
  hipLocal[1] = leg.hip[1];
  hipLocal[2] = leg.hip[2];
  transformQuat(hipOffset as unknown as vec3, hipLocal as unknown as vec3, t.bodyRot as unknown as quat);
  let others = 0;
  for (let j = 0; j < t.legs; j++) if (j !== i) others += nextSupportHeight(t, j);
  const lift = t.walkHeight + t.setup.body.heightOffset + hipOffset[1];
  let hx: number;
  let hzDown: number;
  let hxUp: number;
  let hzUp: number;
  // The hip at touchdown should the body have slowed by then to the pace the ground and the planted feet ask
  // for now (approaching stairs the pace falls after the choice, and a foot chosen at 95 % of reach was set
  // down past the reach of a hip that had fallen 23 cm behind).
  let hxSlow: number;
  let hzSlow: number;
  // The candidate pattern (its line along the walk) turns with the body.
  let c = 1;
  let s = 0;
  bodyAt(t, landTime, predicted);
  if (steadyVelocity(t)) {
    const m = t.motion;
    hx = predicted[0] + hipOffset[0];
    hzDown = predicted[1] + hipOffset[2];
    const tau = landTime - t.frame * t.timeStep;
    const toTouchdown = paceTravel(t, tau);
    const overStance = paceTravel(t, tau + beta * t.cycleTime) - toTouchdown;
    hxUp = hx + m.vx * overStance;
    hzUp = hzDown + m.vz * overStance;
    // Slowed at once to the pace asked for, rather than as the filter brings it.
    const lag = paceGoal < t.pace.value ? toTouchdown - paceGoal * tau : 0;
    hxSlow = hx - m.vx * lag;
    hzSlow = hzDown - m.vz * lag;
    c = Math.cos(t.heading);
    s = Math.sin(t.heading);
  } else {
    // The hip offset as the body has turned by then.
    let turn = predicted[2] - t.heading;
    let ct = Math.cos(turn);
    let st = Math.sin(turn);
    hx = predicted[0] + ct * hipOffset[0] + st * hipOffset[2];
    hzDown = predicted[1] - st * hipOffset[0] + ct * hipOffset[2];
    c = Math.cos(predicted[2]);
    s = Math.sin(predicted[2]);
    bodyAt(t, landTime + beta * t.cycleTime, predicted);
    turn = predicted[2] - t.heading;
    ct = Math.cos(turn);
    st = Math.sin(turn);
    hxUp = predicted[0] + ct * hipOffset[0] + st * hipOffset[2];
    hzUp = predicted[1] - st * hipOffset[0] + ct * hipOffset[2];
    hxSlow = hx;
    hzSlow = hzDown;
  }
  // A leg that cannot fold lands at its full length or nowhere: its spots are judged at that length, with no
  // reach penalty (every spot it can take would pay the whole of it, and the cheapest were those it cannot reach).
  const fixedLength = fixedLengthLeg(t.rig.legs[i].chain);
  const limit = (fixedLength ? FIXED_LENGTH_CANDIDATE_MAX : CANDIDATE_MAX) * reach;
  const soleHalf = t.soleHalf[i];

  let best = Infinity;
  let bestOver = Infinity;
  let bx = landing[0];
  let by = landing[1];
  let bz = landing[2];
  let found = false;
  // When nothing within the radius is reachable (the nominal spot lies in a gap), the search widens.
  for (let widen = 0, radius = radius0; widen <= SEARCH_WIDENINGS && !found; widen++, radius *= 2) {
    for (let k = 0; k < CANDIDATE_COUNT; k++) {
      const px = CANDIDATE_PATTERN[2 * k];
      const pz = CANDIDATE_PATTERN[2 * k + 1];
      const cx = landing[0] + (c * px + s * pz) * radius;
      const cz = landing[2] + (c * pz - s * px) * radius;
      const cost = terrainCost(t.ground, cx, cz, soleHalf, reach, w, terrain);
      const cy = terrain[0];
      const hy = (others + cy) / t.legs + lift;
      const dx = cx - hx;
      const dxUp = cx - hxUp;
      const dy = cy - hy;
      const dDown = Math.sqrt(dx * dx + dy * dy + (cz - hzDown) * (cz - hzDown));
      const dUp = Math.sqrt(dxUp * dxUp + dy * dy + (cz - hzUp) * (cz - hzUp));
      // From the slowed hip the spot need only be reachable at all (TARGET_MAX), not comfortably.
      const dxSlow = cx - hxSlow;
      const dSlow = (Math.sqrt(dxSlow * dxSlow + dy * dy + (cz - hzSlow) * (cz - hzSlow)) * CANDIDATE_MAX) / TARGET_MAX;
      const dMost = dDown > dUp ? dDown : dUp;
      const d = dMost > dSlow ? dMost : dSlow;
      if (d > limit) {
        if (!found && d < bestOver) {
          bestOver = d;
          bx = cx;
          by = cy;
          bz = cz;
        }
        continue;
      }
      const dn = Math.sqrt((cx - landing[0]) * (cx - landing[0]) + (cz - landing[2]) * (cz - landing[2]));
      const over = d / reach - REACH_COST_START;
      let total = cost + (radius0 > 0 ? (w.distanceWeight * dn) / radius0 : 0);
      if (over > 0 && !fixedLength) total += w.reachWeight * (over / (CANDIDATE_MAX - REACH_COST_START)) ** 2;
      if (total < best) {
        best = total;
        found = true;
        bx = cx;
        by = cy;
        bz = cz;
      }
    }
  }
  out[0] = bx;
  out[1] = by;
  out[2] = bz;
  const hipAt = foldGuard.hip1;
  hipAt[0] = hx;
  hipAt[1] = (others + by) / t.legs + lift;
  hipAt[2] = hzDown;
}

/** Plan leg i's swing from where its foot is to the foothold chosen for the touchdown at `landTime`. */
export function startSwing(t: Walk, i: number, landTime: number): void {
  chooseFoothold(t, i, landTime, landing);
  const hip = t.solvers[i].rootPos;
  foldGuard.hip0[0] = hip[0];
  foldGuard.hip0[1] = hip[1];
  foldGuard.hip0[2] = hip[2];
  foldGuard.least = FOLD_SWING_MARGIN * t.foldLimit[i] * t.rig.legs[i].chain.reach;
  // After a stumble (the foot is not where it was planted) the swing starts from where the foot really is.
  const foot = t.solvers[i].foot;
  const p = t.plant;
  const o = 3 * i;
  const off = Math.sqrt((foot[0] - p[o]) ** 2 + (foot[1] - p[o + 1]) ** 2 + (foot[2] - p[o + 2]) ** 2);
  const fromTruth = t.started && off > t.replanDistance;
  const fromX = fromTruth ? foot[0] : p[o];
  const fromZ = fromTruth ? foot[2] : p[o + 2];
  const fromY = fromTruth ? Math.max(foot[1], t.ground.height(fromX, fromZ)) : p[o + 1];
  planSwing(
    t.ground,
    t.swings[i],
    fromX,
    fromY,
    fromZ,
    landing[0],
    landing[1],
    landing[2],
    Math.max(t.gait.stepHeight, MIN_TOE_CLEARANCE),
    MIN_TOE_CLEARANCE,
    // Before the walk has started the hips are not placed yet.
    t.started ? foldGuard : null,
  );
  for (let k = 0; k < 3; k++) t.liftNormal[3 * i + k] = t.plantNormal[3 * i + k];
  t.ground.normal(landing[0], landing[2], t.landNormal, 3 * i);
}

/** Targets for the current phase of every leg. */
export function updateTargets(t: Walk): void {
  const beta = t.gait.dutyFactor;
  for (let i = 0; i < t.legs; i++) {
    const phase = t.phase[i];
    const o = 3 * i;
    if (t.stance[i]) {
      for (let k = 0; k < 3; k++) {
        t.target[o + k] = t.plant[o + k];
        t.targetNormal[o + k] = t.plantNormal[o + k];
      }
    } else {
      const tau = (phase - beta) / (1 - beta);
      swingPoint(t.swings[i], tau, t.target, o);
      const s = minimumJerk(tau);
      let nx = t.liftNormal[o] + (t.landNormal[o] - t.liftNormal[o]) * s;
      let ny = t.liftNormal[o + 1] + (t.landNormal[o + 1] - t.liftNormal[o + 1]) * s;
      let nz = t.liftNormal[o + 2] + (t.landNormal[o + 2] - t.liftNormal[o + 2]) * s;
      const n = 1 / Math.sqrt(nx * nx + ny * ny + nz * nz);
      nx *= n;
      ny *= n;
      nz *= n;
      t.targetNormal[o] = nx;
      t.targetNormal[o + 1] = ny;
      t.targetNormal[o + 2] = nz;
    }
  }
}
