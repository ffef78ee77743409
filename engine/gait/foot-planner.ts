/**
 * Foot planner: where each foot lands and how it gets there. At liftoff the
 * touchdown spot is chosen from candidates around the nominal spot (ahead of
 * the leg's neutral spot by half the stance travel) by the foothold cost
 * (foothold.ts), rejecting what the leg cannot reach from the hip as it will
 * be; the swing starts from where the foot really is, so after a stumble the
 * next step is planned from the truth. A planted foot stays locked; a
 * swinging foot follows its planned path (swing-path.ts).
 */
import { quat, vec3 } from 'gl-matrix';
import * as sample from '../course/sample';
import { terrainCost } from './foothold';
import { CANDIDATE_PATTERN, CANDIDATE_COUNT } from './foothold';
import { CANDIDATE_MAX, REACH_COST_START } from './reach';
import * as swingPath from './swing-path';
import type { Trial } from './trial-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { heightAt, normalAt } = sample;
const { minimumJerk, planSwing, swingPoint } = swingPath;
const { transformQuat } = vec3;

/** Winter (1992): minimum toe clearance in swing about 1.29 cm; no swing plans less. */
export const MIN_TOE_CLEARANCE = 0.0129;

const landing = new Float64Array(3);
/** Times the search radius is doubled when nothing inside it is reachable. */
const SEARCH_WIDENINGS = 2;
const terrain = new Float64Array(1);
const hipLocal = new Float64Array(3);
const hipOffset = new Float64Array(3);

/** Where the body will be along the walk at `time`, at its present pace. */
export function bodyZAt(t: Trial, time: number): number {
  return t.bodyPos[2] + t.gait.speed * t.pace.value * (time - t.frame * t.options.timeStep);
}

/** The nominal touchdown spot of leg i at `time`: ahead of its neutral spot by half the stance travel. */
export function touchdownPoint(t: Trial, i: number, time: number, out: Float64Array, o: number): void {
  const leg = t.rig.legs[i];
  const x = leg.neutralFoot[0];
  const zz = bodyZAt(t, time) + leg.neutralFoot[1] + (t.gait.dutyFactor * t.gait.stride * t.pace.value) / 2;
  out[o] = x;
  out[o + 1] = heightAt(t.course, x, zz);
  out[o + 2] = zz;
}

export function plantAt(t: Trial, i: number, x: number, y: number, zz: number): void {
  t.plant[3 * i] = x;
  t.plant[3 * i + 1] = y;
  t.plant[3 * i + 2] = zz;
  normalAt(t.course, x, zz, t.plantNormal, 3 * i);
  t.support[i] = y;
}

/** Height leg i's support will have once it has landed: planted legs where they stand, swinging ones where they land. */
function nextSupportHeight(t: Trial, j: number): number {
  return t.stance[j] ? t.support[j] : t.swings[j].y1;
}

/**
 * Choose leg i's touchdown spot for a landing at `landTime` into out (x, y, z):
 * the cheapest reachable candidate around the nominal spot, widening the
 * search twice when none is; failing that, the one that over-reaches least.
 */
export function chooseFoothold(t: Trial, i: number, landTime: number, out: Float64Array): void {
  touchdownPoint(t, i, landTime, landing, 0);
  const w = t.setup.footholds;
  const leg = t.rig.legs[i];
  const reach = leg.chain.reach;
  // Legs with short strides for their reach (insects) still search far enough to step past a gap.
  const radius0 = w.searchRadius * Math.max(t.gait.stride, reach);
  // The hip at touchdown and at the following liftoff, the body at the height these footholds will give it.
  hipLocal[0] = leg.hip[0];
  hipLocal[1] = leg.hip[1];
  hipLocal[2] = leg.hip[2];
  transformQuat(hipOffset as unknown as vec3, hipLocal as unknown as vec3, t.bodyRot as unknown as quat);
  let others = 0;
  for (let j = 0; j < t.legs; j++) if (j !== i) others += nextSupportHeight(t, j);
  const lift = t.walkHeight + t.setup.body.heightOffset + hipOffset[1];
  const hx = t.bodyPos[0] + hipOffset[0];
  const hzDown = bodyZAt(t, landTime) + hipOffset[2];
  const hzUp = hzDown + t.gait.speed * t.pace.value * t.gait.dutyFactor * t.gait.cycleTime;
  const limit = CANDIDATE_MAX * reach;
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
      const cx = landing[0] + CANDIDATE_PATTERN[2 * k] * radius;
      const cz = landing[2] + CANDIDATE_PATTERN[2 * k + 1] * radius;
      const cost = terrainCost(t.course, cx, cz, soleHalf, w, terrain);
      const cy = terrain[0];
      const hy = (others + cy) / t.legs + lift;
      const dx = cx - hx;
      const dy = cy - hy;
      const dDown = Math.sqrt(dx * dx + dy * dy + (cz - hzDown) * (cz - hzDown));
      const dUp = Math.sqrt(dx * dx + dy * dy + (cz - hzUp) * (cz - hzUp));
      const d = dDown > dUp ? dDown : dUp;
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
      if (over > 0) total += w.reachWeight * (over / (CANDIDATE_MAX - REACH_COST_START)) ** 2;
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
}

/** Plan leg i's swing from where its foot is to the foothold chosen for the touchdown at `landTime`. */
export function startSwing(t: Trial, i: number, landTime: number): void {
  chooseFoothold(t, i, landTime, landing);
  // After a stumble (the foot is not where it was planted) the swing starts from where the foot really is.
  const foot = t.solvers[i].foot;
  const p = t.plant;
  const o = 3 * i;
  const off = Math.sqrt((foot[0] - p[o]) ** 2 + (foot[1] - p[o + 1]) ** 2 + (foot[2] - p[o + 2]) ** 2);
  const fromTruth = t.started && off > t.options.thresholds.reachMissResidual;
  const fromX = fromTruth ? foot[0] : p[o];
  const fromZ = fromTruth ? foot[2] : p[o + 2];
  const fromY = fromTruth ? Math.max(foot[1], heightAt(t.course, fromX, fromZ)) : p[o + 1];
  planSwing(
    t.course,
    t.swings[i],
    fromX,
    fromY,
    fromZ,
    landing[0],
    landing[1],
    landing[2],
    Math.max(t.gait.stepHeight, MIN_TOE_CLEARANCE),
    MIN_TOE_CLEARANCE,
  );
  for (let k = 0; k < 3; k++) t.liftNormal[3 * i + k] = t.plantNormal[3 * i + k];
  normalAt(t.course, landing[0], landing[2], t.landNormal, 3 * i);
}

/** Targets for the current phase of every leg. */
export function updateTargets(t: Trial): void {
  const beta = t.gait.dutyFactor;
  for (let i = 0; i < t.legs; i++) {
    const phase = t.phase[i];
    const o = 3 * i;
    if (phase < beta) {
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
