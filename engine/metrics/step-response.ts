/**
 * Step-response measures of a sampled signal, with their textbook definitions
 * (Ogata, Modern Control Engineering; Nise, Control Systems Engineering):
 *  - percent overshoot = (y_peak − y_final)/(y_final − y_0)·100, 0 when the
 *    response never passes its final value;
 *  - peak time: when the peak happens;
 *  - settling time: after it |y − y_final| stays within band·|y_final − y_0|;
 *  - rise time: from 10% to 90% of the step.
 * Times are measured from the step instant (default: the first sample). Peaks
 * and crossings are interpolated between samples, so the measures do not
 * snap to the sample grid. Works for steps up and down.
 */

export interface StepResponseOptions {
  /** Index range [start, end) of the samples to use (default: all). */
  start?: number;
  end?: number;
  /** Value before the step (default: the first sample). */
  initial?: number;
  /** Value the response should settle at (default: the last sample). */
  final?: number;
  /** When the step happened (default: the first sample's time). */
  stepTime?: number;
  /** Settling band as a fraction of the step (default 0.02). */
  band?: number;
}

export interface StepResponse {
  /** Percent overshoot; 0 when the response never passes its final value. */
  overshootPercent: number;
  /** Seconds from the step to the peak; null without overshoot. */
  peakTime: number | null;
  /** Seconds from the step until the response stays in the band; null when it never settles in the window. */
  settlingTime: number | null;
  /** Seconds from 10% to 90% of the step; null when it never reaches 90%. */
  riseTime: number | null;
  /** The step size final − initial. */
  step: number;
}

/** Below this step size (relative to the values) there is no step to measure. */
const TINY_STEP = 1e-12;

type Samples = ArrayLike<number>;

function range(y: Samples, o: StepResponseOptions): [number, number] {
  const start = o.start ?? 0;
  const end = o.end ?? y.length;
  if (!(start >= 0 && end <= y.length && end - start >= 2)) {
    throw new RangeError(`step response needs at least 2 samples in [start, end), got [${start}, ${end}) of ${y.length}`);
  }
  return [start, end];
}

/** Normalised response n = (y − y0)/(yf − y0) at sample i. */
function norm(y: Samples, i: number, y0: number, step: number): number {
  return (y[i] - y0) / step;
}

/** Time where the segment between samples i and i+1 crosses normalised level `level`. */
function crossing(t: Samples, y: Samples, i: number, y0: number, step: number, level: number): number {
  const a = norm(y, i, y0, step);
  const b = norm(y, i + 1, y0, step);
  const f = b === a ? 0 : (level - a) / (b - a);
  return t[i] + f * (t[i + 1] - t[i]);
}

/** Vertex of the parabola through samples i−1, i, i+1 as [time, normalised value]. */
function parabolicPeak(t: Samples, y: Samples, i: number, y0: number, step: number): [number, number] {
  const t0 = t[i - 1];
  const t1 = t[i];
  const t2 = t[i + 1];
  const v0 = norm(y, i - 1, y0, step);
  const v1 = norm(y, i, y0, step);
  const v2 = norm(y, i + 1, y0, step);
  const d = (t0 - t1) * (t0 - t2) * (t1 - t2);
  const a = (t2 * (v1 - v0) + t1 * (v0 - v2) + t0 * (v2 - v1)) / d;
  const b = (t2 * t2 * (v0 - v1) + t1 * t1 * (v2 - v0) + t0 * t0 * (v1 - v2)) / d;
  if (!(a < 0)) return [t1, v1];
  const tv = -b / (2 * a);
  if (tv < t0 || tv > t2) return [t1, v1];
  const c = v0 - a * t0 * t0 - b * t0;
  return [tv, a * tv * tv + b * tv + c];
}

export function stepResponse(times: Samples, values: Samples, options: StepResponseOptions = {}): StepResponse {
  if (times.length !== values.length) {
    throw new RangeError(`times and values differ in length (${times.length} vs ${values.length})`);
  }
  const [start, end] = range(values, options);
  const y0 = options.initial ?? values[start];
  const yf = options.final ?? values[end - 1];
  const t0 = options.stepTime ?? times[start];
  const band = options.band ?? 0.02;
  const step = yf - y0;
  const scale = Math.max(Math.abs(y0), Math.abs(yf), 1);
  if (!Number.isFinite(step) || Math.abs(step) <= TINY_STEP * scale) {
    return { overshootPercent: 0, peakTime: null, settlingTime: 0, riseTime: null, step: 0 };
  }

  let peakI = start;
  let peakV = -Infinity;
  for (let i = start; i < end; i++) {
    const v = norm(values, i, y0, step);
    if (v > peakV) {
      peakV = v;
      peakI = i;
    }
  }
  let overshootPercent = 0;
  let peakTime: number | null = null;
  if (peakV > 1) {
    let tp = times[peakI];
    if (peakI > start && peakI < end - 1) [tp, peakV] = parabolicPeak(times, values, peakI, y0, step);
    overshootPercent = (peakV - 1) * 100;
    peakTime = tp - t0;
  }

  // Settling: the last sample outside the band, then the crossing back into it.
  let last = -1;
  for (let i = end - 1; i >= start; i--) {
    if (Math.abs(norm(values, i, y0, step) - 1) > band) {
      last = i;
      break;
    }
  }
  let settlingTime: number | null;
  if (last < 0) settlingTime = Math.max(0, times[start] - t0);
  else if (last === end - 1) settlingTime = null;
  else {
    const level = norm(values, last, y0, step) > 1 ? 1 + band : 1 - band;
    settlingTime = crossing(times, values, last, y0, step, level) - t0;
  }

  let t10: number | null = null;
  let t90: number | null = null;
  for (let i = start; i < end - 1 && t90 === null; i++) {
    const a = norm(values, i, y0, step);
    const b = norm(values, i + 1, y0, step);
    if (t10 === null && a < 0.1 && b >= 0.1) t10 = crossing(times, values, i, y0, step, 0.1);
    if (t10 === null && a >= 0.1) t10 = times[i];
    if (t10 !== null && a < 0.9 && b >= 0.9) t90 = crossing(times, values, i, y0, step, 0.9);
  }
  const riseTime = t10 !== null && t90 !== null ? t90 - t10 : null;
  return { overshootPercent, peakTime, settlingTime, riseTime, step };
}

export const percentOvershoot = (t: Samples, y: Samples, o?: StepResponseOptions): number => stepResponse(t, y, o).overshootPercent;
export const peakTime = (t: Samples, y: Samples, o?: StepResponseOptions): number | null => stepResponse(t, y, o).peakTime;
export const settlingTime = (t: Samples, y: Samples, o?: StepResponseOptions): number | null => stepResponse(t, y, o).settlingTime;
export const riseTime = (t: Samples, y: Samples, o?: StepResponseOptions): number | null => stepResponse(t, y, o).riseTime;

/** Uniform sample times start, start+dt, …: a helper for signals recorded at a fixed rate. */
export function uniformTimes(n: number, dt: number, start = 0): Float64Array {
  const t = new Float64Array(n);
  for (let i = 0; i < n; i++) t[i] = start + i * dt;
  return t;
}
