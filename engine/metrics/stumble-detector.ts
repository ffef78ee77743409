/**
 * Stumble detection. One detector, fed frame by frame: the trial loop feeds
 * it every simulated frame, and `detectStumbles` feeds it a recorded series.
 * Per leg and frame it needs the contact flag, the sole and its target, the
 * ground height under the sole and the leg's fastest joint speed.
 *
 *  - sink: in stance, sole below the ground by more than sinkDepth for
 *    sinkFrames frames or more; one event per run, size = deepest.
 *  - skid: in stance, horizontal distance from where the foot was at
 *    touchdown above skidDistance; one event per stance, size = largest.
 *  - reach-miss: at touchdown, |target − foot| above reachMissResidual.
 *  - scuff: in swing, sole below the ground by more than scuffDepth; one
 *    event per run, size = deepest.
 *  - snap: fastest joint above snapSpeed; one event per run, size = fastest.
 * Events live in growable typed arrays; a frame without events allocates nothing.
 */
import { STUMBLE_KINDS, type StumbleKind, type StumbleThresholds } from './stumble-thresholds';
import type { StumbleEvent } from './trial-metrics';

const SINK = 0;
const SKID = 1;
const REACH_MISS = 2;
const SCUFF = 3;
const SNAP = 4;
const KINDS = STUMBLE_KINDS.length;

export class StumbleDetector {
  readonly legs: number;
  readonly thresholds: StumbleThresholds;
  /** Touchdowns seen, all legs. */
  steps = 0;
  readonly counts = new Int32Array(KINDS);

  private time = 0;
  private started: Uint8Array;
  private contact: Uint8Array;
  private anchorX: Float64Array;
  private anchorZ: Float64Array;
  private sinkRun: Int32Array;
  private sinkMax: Float64Array;
  private sinkStart: Float64Array;
  /** Index of the open event of each kind per leg (−1 = none): legs × kinds. */
  private open: Int32Array;

  private evKind = new Uint8Array(64);
  private evLeg = new Uint16Array(64);
  private evTime = new Float64Array(64);
  private evSize = new Float64Array(64);
  eventCount = 0;

  constructor(legs: number, thresholds: StumbleThresholds) {
    this.legs = legs;
    this.thresholds = thresholds;
    this.started = new Uint8Array(legs);
    this.contact = new Uint8Array(legs);
    this.anchorX = new Float64Array(legs);
    this.anchorZ = new Float64Array(legs);
    this.sinkRun = new Int32Array(legs);
    this.sinkMax = new Float64Array(legs);
    this.sinkStart = new Float64Array(legs);
    this.open = new Int32Array(legs * KINDS).fill(-1);
  }

  private push(kind: number, leg: number, time: number, size: number): number {
    if (this.eventCount === this.evKind.length) {
      const n = this.eventCount * 2;
      const grow = <T extends Uint8Array | Uint16Array | Float64Array>(a: T, make: (n: number) => T): T => {
        const b = make(n);
        b.set(a);
        return b;
      };
      this.evKind = grow(this.evKind, (k) => new Uint8Array(k));
      this.evLeg = grow(this.evLeg, (k) => new Uint16Array(k));
      this.evTime = grow(this.evTime, (k) => new Float64Array(k));
      this.evSize = grow(this.evSize, (k) => new Float64Array(k));
    }
    const i = this.eventCount++;
    this.evKind[i] = kind;
    this.evLeg[i] = leg;
    this.evTime[i] = time;
    this.evSize[i] = size;
    this.counts[kind]++;
    return i;
  }

  /** Grow the open event of `kind` on `leg` to `size`, or open one. */
  private runEvent(kind: number, leg: number, size: number): void {
    const slot = leg * KINDS + kind;
    const i = this.open[slot];
    if (i < 0) this.open[slot] = this.push(kind, leg, this.time, size);
    else if (size > this.evSize[i]) this.evSize[i] = size;
  }

  private close(kind: number, leg: number): void {
    this.open[leg * KINDS + kind] = -1;
  }

  /**
   * One frame for every leg: contact (1 = stance), sole positions and targets
   * (3 per leg), ground height under each sole, fastest joint speed (°/s).
   * Arrays rather than numbers as arguments: doubles passed to a call that is
   * not inlined get boxed, which would allocate every frame.
   */
  observe(
    time: number,
    contact: ArrayLike<number>,
    foot: ArrayLike<number>,
    target: ArrayLike<number>,
    ground: ArrayLike<number>,
    jointSpeed: ArrayLike<number>,
  ): void {
    this.time = time;
    const th = this.thresholds;
    for (let leg = 0; leg < this.legs; leg++) {
      const o = 3 * leg;
      const footX = foot[o];
      const footY = foot[o + 1];
      const footZ = foot[o + 2];
      const c = contact[leg] ? 1 : 0;
      const first = this.started[leg] === 0;
      const touchdown = !first && c === 1 && this.contact[leg] === 0;
      const liftoff = !first && c === 0 && this.contact[leg] === 1;
      this.started[leg] = 1;
      this.contact[leg] = c;

      if (touchdown || (first && c === 1)) {
        this.anchorX[leg] = footX;
        this.anchorZ[leg] = footZ;
        this.close(SKID, leg);
      }
      if (touchdown) {
        this.steps++;
        const dx = target[o] - footX;
        const dy = target[o + 1] - footY;
        const dz = target[o + 2] - footZ;
        const residual = Math.sqrt(dx * dx + dy * dy + dz * dz);
        if (residual > th.reachMissResidual) this.push(REACH_MISS, leg, time, residual);
        this.close(SCUFF, leg);
      }
      if (liftoff) {
        this.close(SINK, leg);
        this.sinkRun[leg] = 0;
        this.close(SKID, leg);
      }

      const depth = ground[leg] - footY;
      if (c === 1) {
        if (depth > th.sinkDepth) {
          if (this.sinkRun[leg] === 0) {
            this.sinkStart[leg] = time;
            this.sinkMax[leg] = depth;
          } else if (depth > this.sinkMax[leg]) this.sinkMax[leg] = depth;
          this.sinkRun[leg]++;
          // The event is dated to the first frame of the run.
          if (this.sinkRun[leg] === th.sinkFrames) this.open[leg * KINDS + SINK] = this.push(SINK, leg, this.sinkStart[leg], this.sinkMax[leg]);
          else if (this.sinkRun[leg] > th.sinkFrames) this.runEvent(SINK, leg, depth);
        } else {
          this.sinkRun[leg] = 0;
          this.close(SINK, leg);
        }
        const sx = footX - this.anchorX[leg];
        const sz = footZ - this.anchorZ[leg];
        const slide = Math.sqrt(sx * sx + sz * sz);
        if (slide > th.skidDistance) this.runEvent(SKID, leg, slide);
      } else if (depth > th.scuffDepth) this.runEvent(SCUFF, leg, depth);
      else this.close(SCUFF, leg);

      const speed = jointSpeed[leg];
      if (speed > th.snapSpeed) this.runEvent(SNAP, leg, speed);
      else this.close(SNAP, leg);
    }
  }

  events(): StumbleEvent[] {
    const out: StumbleEvent[] = [];
    for (let i = 0; i < this.eventCount; i++) {
      out.push({ kind: STUMBLE_KINDS[this.evKind[i]], time: this.evTime[i], leg: this.evLeg[i], size: this.evSize[i] });
    }
    return out;
  }

  countOf(kind: StumbleKind): number {
    return this.counts[STUMBLE_KINDS.indexOf(kind)];
  }
}
