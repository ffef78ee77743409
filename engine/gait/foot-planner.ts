/**
 * Foot planner: where each foot lands and how it gets there. A touchdown
 * target lies ahead of the leg's neutral spot by half the stance travel, on
 * the ground, with the ground normal as the foot's orientation; a planted
 * foot stays locked; a swinging foot follows its planned path (swing-path.ts).
 */
import * as sample from '../course/sample';
import * as swingPath from './swing-path';
import type { Trial } from './trial-state';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { heightAt, normalAt } = sample;
const { minimumJerk, planSwing, swingPoint } = swingPath;

const landing = new Float64Array(3);

export function bodyZAt(t: Trial, time: number): number {
  return t.startZ + t.gait.speed * time;
}

/** Where leg i touches down at `time`: ahead of its neutral spot by half the stance travel. */
export function touchdownPoint(t: Trial, i: number, time: number, out: Float64Array, o: number): void {
  const leg = t.rig.legs[i];
  const x = leg.neutralFoot[0];
  const zz = bodyZAt(t, time) + leg.neutralFoot[1] + (t.gait.dutyFactor * t.gait.stride) / 2;
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

/** Plan leg i's swing from its planted spot to the touchdown at `landTime`. */
export function startSwing(t: Trial, i: number, landTime: number): void {
  touchdownPoint(t, i, landTime, landing, 0);
  const p = t.plant;
  planSwing(
    t.course,
    t.swings[i],
    p[3 * i],
    p[3 * i + 1],
    p[3 * i + 2],
    landing[0],
    landing[1],
    landing[2],
    t.gait.stepHeight,
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
