/**
 * Collects a signal over a window (one touchdown, one body step-up) in a
 * preallocated buffer and folds each window's step response into a summary.
 */
import { stepResponse } from './step-response';
import type { StepResponseSummary } from './trial-metrics';

export class ResponseWindow {
  readonly times: Float64Array;
  readonly values: Float64Array;
  length = 0;
  open = false;
  /** Values the response starts from and should settle at. */
  initial = 0;
  final = 0;
  /** Settling is reported from this time on (e.g. the touchdown), not from the window start. */
  settleFrom = 0;
  /** Samples after this time end the window. */
  endTime = Infinity;

  constructor(capacity: number) {
    this.times = new Float64Array(capacity);
    this.values = new Float64Array(capacity);
  }

  start(initial: number, final: number, settleFrom: number, endTime: number): void {
    this.open = true;
    this.endTime = endTime;
    this.length = 0;
    this.initial = initial;
    this.final = final;
    this.settleFrom = settleFrom;
  }

  /** Adds a sample; returns false (and adds nothing) when the window is over or full. */
  add(time: number, value: number): boolean {
    if (time > this.endTime || this.length >= this.times.length) return false;
    this.times[this.length] = time;
    this.values[this.length] = value;
    this.length++;
    return true;
  }
}

export class ResponseSummary {
  /** Windows whose step is smaller than this are not measured (percentages of tiny steps mean nothing). */
  readonly minStep: number;
  count = 0;
  private overshootSum = 0;
  private overshootMax = 0;
  private settleSum = 0;
  private settled = 0;
  unsettled = 0;

  constructor(minStep: number) {
    this.minStep = minStep;
  }

  /** Measure and fold a window; windows with under 3 samples or a step under minStep are skipped. */
  fold(w: ResponseWindow): void {
    w.open = false;
    if (w.length < 3 || Math.abs(w.final - w.initial) < this.minStep) return;
    const r = stepResponse(w.times.subarray(0, w.length), w.values.subarray(0, w.length), {
      initial: w.initial,
      final: w.final,
    });
    this.count++;
    this.overshootSum += r.overshootPercent;
    if (r.overshootPercent > this.overshootMax) this.overshootMax = r.overshootPercent;
    if (r.settlingTime === null) this.unsettled++;
    else {
      this.settleSum += Math.max(0, w.times[0] + r.settlingTime - w.settleFrom);
      this.settled++;
    }
  }

  summary(): StepResponseSummary {
    return {
      count: this.count,
      overshootMeanPercent: this.count ? this.overshootSum / this.count : 0,
      overshootMaxPercent: this.overshootMax,
      settleMeanSeconds: this.settled ? this.settleSum / this.settled : null,
      unsettled: this.unsettled,
    };
  }
}
