/**
 * Body adaptation: the body's height, pitch and roll targets from the planted
 * feet, its rotation, and the hip sockets placed from the body pose.
 */
import { quat, vec3 } from 'gl-matrix';
import * as ik from '../ik';
import * as bodyFilter from './body-filter';
import { COMFORT_MAX, STANCE_FOLD_MIN } from './reach';
import * as walkHeight from './walk-height';
import { minimumJerk } from './swing-path';
import type { Walk } from './walk-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { fixedLengthLeg } = walkHeight;
const { setRootTransform } = ik;
const { stepCritical } = bodyFilter;
const { setAxisAngle: quatSetAxisAngle, multiply: quatMultiply } = quat;
const { transformQuat } = vec3;

const X_AXIS = new Float64Array([1, 0, 0]);
const Y_AXIS = new Float64Array([0, 1, 0]);
const Z_AXIS = new Float64Array([0, 0, 1]);
const yawRot = new Float64Array(4);
const hipLocal = new Float64Array(3);
const hipWorld = new Float64Array(3);
const hipRot = new Float64Array(4);
const legRot = new Float64Array(4);
const pitchRot = new Float64Array(4);
const footX = new Float64Array(64);
const footH = new Float64Array(64);
const footZ = new Float64Array(64);

/** Filled by computeBodyTargets: height (m), pitch (nose up) and roll (left up), rad. */
export const bodyTargets = new Float64Array(3);

/**
 * Targets from the footholds: planted feet where they stand and swinging feet
 * where they will land, so the body rises before a step-up and lowers before
 * a step-down. The height follows their mean (blended with the ground under
 * the body by followHeight); pitch and roll follow the least-squares slope of
 * those heights along and across the body's heading; the body crouches on slopes by
 * slopeCrouch. The height is then capped so that every stance leg stays
 * inside its comfortable reach (reach.ts): no leg is driven straight.
 * `landed`: as if every swinging foot had already landed (the height a new
 * foothold asks for, which body step-ups are measured against).
 */
export function computeBodyTargets(t: Walk, landed = false): void {
  const L = t.legs;
  const b = t.setup.body;
  let mh = 0;
  let mx = 0;
  let mz = 0;
  for (let i = 0; i < L; i++) {
    const o = 3 * i;
    const sw = t.swings[i];
    const planted = t.stance[i] === 1;
    // A swinging foot counts more toward where it will land the further its swing has gone.
    const beta = t.gait.dutyFactor;
    const w = planted ? 0 : landed ? 1 : minimumJerk((t.phase[i] - beta) / (1 - beta));
    const x = planted ? t.plant[o] : sw.x0 + (sw.x1 - sw.x0) * w;
    const h = planted ? t.support[i] : sw.y0 + (sw.y1 - sw.y0) * w;
    const z = planted ? t.plant[o + 2] : sw.z0 + (sw.z1 - sw.z0) * w;
    footX[i] = x;
    footH[i] = h;
    footZ[i] = z;
    mh += h;
    mx += x;
    mz += z;
  }
  mh /= L;
  mx /= L;
  mz /= L;
  let sxx = 0;
  let szz = 0;
  let sxh = 0;
  let szh = 0;
  // Across (body +X) and along (body +Z, the heading) the walk.
  const c = Math.cos(t.heading);
  const s = Math.sin(t.heading);
  for (let i = 0; i < L; i++) {
    const wx = footX[i] - mx;
    const wz = footZ[i] - mz;
    const dx = c * wx - s * wz;
    const dz = s * wx + c * wz;
    const dh = footH[i] - mh;
    sxx += dx * dx;
    szz += dz * dz;
    sxh += dx * dh;
    szh += dz * dh;
  }
  // Feet nearly in line across (or along) the walk say nothing about that slope.
  const minSpread = 0.01 * L;
  const slopeZ = szz > minSpread * minSpread ? szh / szz : 0;
  const slopeX = sxx > minSpread * minSpread ? sxh / sxx : 0;
  const pitchRaw = Math.atan(slopeZ);
  const rollRaw = Math.atan(slopeX);
  const under = t.ground.height(t.bodyPos[0], t.bodyPos[2]);
  const ground = under + (mh - under) * b.followHeight;
  const crouch = b.slopeCrouch * t.walkHeight * Math.sqrt(pitchRaw * pitchRaw + rollRaw * rollRaw);
  const wanted = ground + t.walkHeight + b.heightOffset - crouch;
  t.heightCap = stanceHeightCap(t, TARGET_CAP);
  const comfortable = stanceHeightCap(t, COMFORT_MAX);
  const floor = stanceHeightFloor(t, STANCE_FOLD_MIN);
  // Between the floor and the cap; where the two conflict, no leg is driven straight.
  const lifted = wanted > floor ? wanted : floor;
  bodyTargets[0] = lifted < comfortable ? lifted : comfortable;
  bodyTargets[1] = pitchRaw * b.followPitch;
  bodyTargets[2] = rollRaw * b.followRoll;
}

/** The filter may lag behind a falling cap; past this share of reach the body is held down outright. */
const TARGET_CAP = 0.96;
/** A stance leg keeps this much more than its fold limit. */
const FOLD_TO_STANCE = 0.1;

/**
 * The body height at which stance leg i's hip is `r` from its planted foot (the hip turned by the body's
 * present rotation); NaN when the foot lies further than r from the hip horizontally.
 */
function heightAtDistance(t: Walk, i: number, r: number): number {
  const leg = t.rig.legs[i];
  hipLocal[0] = leg.hip[0];
  hipLocal[1] = leg.hip[1];
  hipLocal[2] = leg.hip[2];
  transformQuat(hipWorld as unknown as vec3, hipLocal as unknown as vec3, t.bodyRot as unknown as quat);
  const o = 3 * i;
  const dx = t.bodyPos[0] + hipWorld[0] - t.plant[o];
  const dz = t.bodyPos[2] + hipWorld[2] - t.plant[o + 2];
  const h2 = r * r - dx * dx - dz * dz;
  return h2 > 0 ? t.plant[o + 1] + Math.sqrt(h2) - hipWorld[1] : NaN;
}

/** Highest body height at which every stance leg's hip is within `share` of its reach from its planted foot. */
function stanceHeightCap(t: Walk, share: number): number {
  let cap = Infinity;
  for (let i = 0; i < t.legs; i++) {
    if (!t.stance[i]) continue;
    const chain = t.rig.legs[i].chain;
    // A leg that cannot fold stands at its full length or not at all.
    let top = heightAtDistance(t, i, (fixedLengthLeg(chain) ? 1 : share) * chain.reach);
    // Out of reach already: no height helps, so hold the hip level with the foot's side of the sphere.
    if (top !== top) top = t.plant[3 * i + 1] - hipWorld[1];
    if (top < cap) cap = top;
  }
  return cap;
}

/** Lowest body height at which every stance leg's hip is at least `share` of its reach (and clear of its fold limit) from its planted foot. */
function stanceHeightFloor(t: Walk, share: number): number {
  let floor = -Infinity;
  for (let i = 0; i < t.legs; i++) {
    if (!t.stance[i]) continue;
    const chain = t.rig.legs[i].chain;
    const fold = t.foldLimit[i] + FOLD_TO_STANCE;
    const low = heightAtDistance(t, i, (fixedLengthLeg(chain) ? 1 : share > fold ? share : fold) * chain.reach);
    if (low > floor) floor = low;
  }
  return floor;
}

/** One filter step of the body height, pitch and roll toward bodyTargets; the height never passes the stance cap. */
export function followBodyTargets(t: Walk): void {
  stepCritical(t.height, bodyTargets[0], t.filter);
  stepCritical(t.pitch, bodyTargets[1], t.filter);
  stepCritical(t.roll, bodyTargets[2], t.filter);
  if (t.height.value > t.heightCap) {
    t.height.value = t.heightCap;
    if (t.height.velocity > 0) t.height.velocity = 0;
  }
  t.bodyPos[1] = t.height.value;
}

export function updateBodyRotation(t: Walk): void {
  // Heading about +Y, then in the body's frame: nose up is a negative turn about +X (+Z forward, +Y up);
  // left side up is a positive turn about +Z.
  quatSetAxisAngle(pitchRot as unknown as quat, X_AXIS as unknown as vec3, -t.pitch.value);
  quatSetAxisAngle(t.bodyRot as unknown as quat, Z_AXIS as unknown as vec3, t.roll.value);
  quatMultiply(t.bodyRot as unknown as quat, t.bodyRot as unknown as quat, pitchRot as unknown as quat);
  quatSetAxisAngle(yawRot as unknown as quat, Y_AXIS as unknown as vec3, t.heading);
  quatMultiply(t.bodyRot as unknown as quat, yawRot as unknown as quat, t.bodyRot as unknown as quat);
}

/** Hip sockets (the chains' roots) from the body pose. */
export function placeHips(t: Walk): void {
  for (let i = 0; i < t.legs; i++) {
    const leg = t.rig.legs[i];
    hipLocal[0] = leg.hip[0];
    hipLocal[1] = leg.hip[1];
    hipLocal[2] = leg.hip[2];
    transformQuat(hipWorld as unknown as vec3, hipLocal as unknown as vec3, t.bodyRot as unknown as quat);
    hipWorld[0] += t.bodyPos[0];
    hipWorld[1] += t.bodyPos[1];
    hipWorld[2] += t.bodyPos[2];
    legRot[0] = leg.hipRotation[0];
    legRot[1] = leg.hipRotation[1];
    legRot[2] = leg.hipRotation[2];
    legRot[3] = leg.hipRotation[3];
    quatMultiply(hipRot as unknown as quat, t.bodyRot as unknown as quat, legRot as unknown as quat);
    setRootTransform(t.solvers[i], hipWorld, hipRot);
  }
}
