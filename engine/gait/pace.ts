/**
 * Pace: how fast the body walks, as a share of the gait speed, from the
 * ground ahead. The gait clock keeps its cadence, so a slower pace means
 * shorter steps: on stairs and steep ramps each swing climbs no more than a
 * set share of the leg's reach (about two code risers for a human leg, as
 * people climb stairs one tread a step: common practice, no source).
 */
import * as sample from '../course/sample';
import type { Trial } from './trial-state';

const { heightAt } = sample;

/** Largest height change one swing may climb or descend, as a share of the shortest leg's reach. */
export const RISE_PER_SWING = 0.33;
/** The body never slows below this share of the gait speed. */
export const SLOWEST_PACE = 0.25;
/** 2 % settling time of the pace filter, s: the walk slows over about a step. */
export const PACE_SETTLE_SECONDS = 0.6;
/** Samples along the look-ahead window. */
const SAMPLES = 24;

/** The pace the ground ahead asks for: the largest height change over one stride between the rearmost hip and a stride past the front feet. */
export function terrainPace(t: Trial): number {
  const stride = t.gait.stride;
  let rear = Infinity;
  let front = -Infinity;
  let reach = Infinity;
  for (const leg of t.rig.legs) {
    if (leg.hip[2] < rear) rear = leg.hip[2];
    if (leg.neutralFoot[1] > front) front = leg.neutralFoot[1];
    if (leg.chain.reach < reach) reach = leg.chain.reach;
  }
  const z0 = t.bodyPos[2] + rear - stride / 2;
  const z1 = t.bodyPos[2] + front + 1.5 * stride;
  const step = (z1 - z0) / SAMPLES;
  const span = Math.max(1, Math.round(stride / step));
  let rise = 0;
  for (let k = 0; k + span <= SAMPLES; k++) {
    const d = Math.abs(heightAt(t.course, 0, z0 + (k + span) * step) - heightAt(t.course, 0, z0 + k * step));
    if (d > rise) rise = d;
  }
  const allowed = RISE_PER_SWING * reach;
  if (rise <= allowed) return 1;
  const pace = allowed / rise;
  return pace < SLOWEST_PACE ? SLOWEST_PACE : pace;
}
