/**
 * How the gait follows speed. At the setup's own speed v0 the cycle time and
 * stride are the setup's (T0, λ0). At another speed v the cycle time is
 *
 *   T(v) = T0 · (v / v0)^(2b − 1),   b = 0.3,
 *
 * from Alexander's relation λ/h = 2.3·Fr^b (Alexander 1976, Nature 261; stride.ts): the stride grows as v^0.6,
 * so cadence grows as v^0.4, as in walking people and animals. The cycle is held within
 * [CYCLE_MIN_SHARE, CYCLE_MAX_SHARE] × T0 (common practice, no source: very slow walks shuffle rather than
 * stepping ever more slowly). "Speed" is the fastest any foot moves relative to the body, |v| + |ω|·r with r the
 * farthest neutral foot spot from the body's centre, so a body turning in place steps too.
 *
 * On a turn the cycle is also short enough that one stance turns the body by at most MAX_STANCE_TURN: a planted
 * foot is carried round the hip by the turn, and legs without a hip twist take it sideways (common practice,
 * no source).
 *
 * Limits: the body walks at most at the walk-to-run transition, Froude number 0.5 (Kram, Domingo & Ferris
 * 1997), or at the setup's own speed if that is faster, and turns at most as fast as keeps MAX_STANCE_TURN at
 * the shortest cycle; the fastest foot (|v| + |ω|·r) stays within the top speed.
 */
import { ALEXANDER_STRIDE, speedForFroude } from './stride';
import type { GaitParams } from './gait-params';

export const CYCLE_MIN_SHARE = 0.6;
export const CYCLE_MAX_SHARE = 2;
/** Froude number of the walk-to-run transition (Kram, Domingo & Ferris 1997). */
export const WALK_RUN_FROUDE = 0.5;
/** Most the body turns during one stance, rad (20°). */
export const MAX_STANCE_TURN = (20 * Math.PI) / 180;
/** Below this share of the setup's speed the walk comes to a stop. */
export const STOP_SHARE = 0.02;
const CADENCE_EXPONENT = 2 * ALEXANDER_STRIDE.exponent - 1;

/** Cycle time for a foot speed (see above); exactly the setup's at its own speed. */
export function cycleTimeForSpeed(gait: GaitParams, speed: number): number {
  if (speed === gait.speed) return gait.cycleTime;
  const lo = CYCLE_MIN_SHARE * gait.cycleTime;
  const hi = CYCLE_MAX_SHARE * gait.cycleTime;
  if (!(speed > 0)) return hi;
  const t = gait.cycleTime * Math.pow(speed / gait.speed, CADENCE_EXPONENT);
  return t < lo ? lo : t > hi ? hi : t;
}

/** The cycle time for a foot speed, shortened on a turn so that a stance turns the body by at most MAX_STANCE_TURN. */
export function cycleTimeForMotion(gait: GaitParams, speed: number, turnRate: number): number {
  const t = cycleTimeForSpeed(gait, speed);
  const w = Math.abs(turnRate);
  if (!(w > 0)) return t;
  const turnCap = MAX_STANCE_TURN / (gait.dutyFactor * w);
  const lo = CYCLE_MIN_SHARE * gait.cycleTime;
  return t < turnCap ? t : turnCap > lo ? turnCap : lo;
}

/** Stride (one cycle of one foot) at that speed and cycle time; exactly the setup's at its own speed. */
export function strideForSpeed(gait: GaitParams, speed: number, cycleTime: number): number {
  return speed === gait.speed ? gait.stride : speed * cycleTime;
}

/** Fastest planar body speed, m/s. */
export function topWalkSpeed(gait: GaitParams, hipHeight: number): number {
  const transition = speedForFroude(WALK_RUN_FROUDE, hipHeight);
  return gait.speed > transition ? gait.speed : transition;
}

/** Fastest turn rate, rad/s: a stance of the shortest cycle turns the body by MAX_STANCE_TURN, and the farthest foot moves at most at the top speed. */
export function topTurnRate(gait: GaitParams, hipHeight: number, turnRadius: number): number {
  const bySpeed = topWalkSpeed(gait, hipHeight) / (turnRadius > 0.05 ? turnRadius : 0.05);
  const byStance = MAX_STANCE_TURN / (gait.dutyFactor * CYCLE_MIN_SHARE * gait.cycleTime);
  return bySpeed < byStance ? bySpeed : byStance;
}
