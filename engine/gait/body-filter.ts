/**
 * Critically damped second-order filter (ζ = 1): the body follows its target
 * height, pitch and roll without overshoot. The update is the exact solution
 * over a step with the target held, so it is stable for any time step.
 */

/** ωn·t at which a critically damped step response enters the 2 % band: (1 + x)·e^(−x) = 0.02. */
export const CRITICAL_SETTLE_2PCT = 5.8339;

export interface DampedState {
  value: number;
  velocity: number;
}

export function createDampedState(value = 0): DampedState {
  return { value, velocity: 0 };
}

/** Natural frequency giving a 2 % settling time of `settleTime` seconds. */
export function omegaForSettleTime(settleTime: number): number {
  return CRITICAL_SETTLE_2PCT / settleTime;
}

/** A filter for a fixed time step, with its decay over one step worked out once. */
export interface CriticalFilter {
  omega: number;
  dt: number;
  decay: number;
}

export function createCriticalFilter(settleTime: number, dt: number): CriticalFilter {
  const omega = omegaForSettleTime(settleTime);
  return { omega, dt, decay: Math.exp(-omega * dt) };
}

/** Advance s by the filter's step toward target. */
export function stepCritical(s: DampedState, target: number, f: CriticalFilter): void {
  const e0 = s.value - target;
  const v0 = s.velocity;
  const k = v0 + f.omega * e0;
  s.value = target + (e0 + k * f.dt) * f.decay;
  s.velocity = (v0 - f.omega * k * f.dt) * f.decay;
}

/** Advance s by dt toward target with natural frequency omega (rad/s). */
export function stepCriticallyDamped(s: DampedState, target: number, omega: number, dt: number): void {
  stepCritical(s, target, { omega, dt, decay: Math.exp(-omega * dt) });
}

/** The value s will have `tau` seconds on, following a held target with natural frequency omega (the exact response). */
export function criticalValueAt(s: DampedState, target: number, omega: number, tau: number): number {
  if (!(tau > 0)) return s.value;
  const e0 = s.value - target;
  const k = s.velocity + omega * e0;
  return target + (e0 + k * tau) * Math.exp(-omega * tau);
}

/** The integral of s's value over the next `tau` seconds, following a held target with natural frequency omega. */
export function criticalIntegral(s: DampedState, target: number, omega: number, tau: number): number {
  if (!(tau > 0)) return s.value * tau;
  const e0 = s.value - target;
  const k = s.velocity + omega * e0;
  const decay = Math.exp(-omega * tau);
  return target * tau + (e0 * (1 - decay)) / omega + (k * (1 - decay * (1 + omega * tau))) / (omega * omega);
}
