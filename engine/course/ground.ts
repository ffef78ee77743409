/**
 * Ground as the walk sees it: a height and a unit normal at any point of the
 * plane. A course's heightfield is one such ground (`heightfieldGround`); a
 * game's own ground, queried through a callback the way a physics raycast is,
 * is another (`queryGround`). The segment tests used to check swing paths are
 * written once here, over any ground. Nothing per query allocates.
 */
import type { Heightfield } from './heightfield';
import * as sample from './sample';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { heightAt, normalAt } = sample;

export interface Ground {
  /** Ground height at (x, z), m. */
  height(x: number, z: number): number;
  /** Unit ground normal at (x, z) into out[o..o+2]. */
  normal(x: number, z: number, out: Float64Array, o: number): void;
  /** Spacing at which the segment tests sample it, m (a heightfield's cell size). */
  readonly spacing: number;
}

export interface HeightfieldGround extends Ground {
  readonly heightfield: Heightfield;
}

/** One class for every heightfield: its methods are one function each, so call sites stay monomorphic across trials. */
class HeightfieldGroundOf implements HeightfieldGround {
  readonly heightfield: Heightfield;
  readonly spacing: number;
  constructor(hf: Heightfield) {
    this.heightfield = hf;
    this.spacing = hf.cellSize;
  }
  height(x: number, z: number): number {
    return heightAt(this.heightfield, x, z);
  }
  normal(x: number, z: number, out: Float64Array, o: number): void {
    normalAt(this.heightfield, x, z, out, o);
  }
}

export function heightfieldGround(hf: Heightfield): HeightfieldGround {
  return new HeightfieldGroundOf(hf);
}

export function isGround(g: Heightfield | Ground): g is Ground {
  return typeof (g as Ground).height === 'function';
}

/** A heightfield as ground (made anew: for tests and tools, not for per-frame code, which keeps its Ground). */
export function asGround(g: Heightfield | Ground): Ground {
  return isGround(g) ? g : heightfieldGround(g);
}

/** A ground query that failed: the callback threw, or gave a height or normal that is not a finite number. */
export class GroundQueryError extends Error {
  readonly x: number;
  readonly z: number;
  constructor(message: string, x: number, z: number) {
    super(message);
    this.name = 'GroundQueryError';
    this.x = x;
    this.z = z;
  }
}

/** The game's ground: returns the height under (x, z) and writes the unit normal into normal[0..2] (or leaves it). */
export type GroundQueryFn = (x: number, z: number, normal: Float64Array) => number;

const fmt = (v: number) => (Number.isFinite(v) ? v.toFixed(3) : String(v));

/**
 * A game's ground callback as Ground. A failed query throws a GroundQueryError naming the point and what came
 * back, so the caller can stop the step and keep its last good pose. A normal the callback leaves unwritten
 * (or writes non-finite) is estimated from heights `spacing` apart (central differences).
 */
export function queryGround(query: GroundQueryFn, spacing = 0.02): Ground {
  const scratch = new Float64Array(3);
  const ask = (x: number, z: number): number => {
    scratch[0] = NaN;
    let h: number;
    try {
      h = query(x, z, scratch);
    } catch (err) {
      throw new GroundQueryError(`the ground callback threw at x ${fmt(x)} m, z ${fmt(z)} m: ${err instanceof Error ? err.message : String(err)}`, x, z);
    }
    if (typeof h !== 'number' || !Number.isFinite(h)) {
      throw new GroundQueryError(`the ground callback returned ${String(h)} for the height at x ${fmt(x)} m, z ${fmt(z)} m; it must return a finite number of metres`, x, z);
    }
    return h;
  };
  const e = spacing / 2;
  return {
    spacing,
    height: ask,
    normal(x, z, out, o) {
      ask(x, z);
      let nx = scratch[0];
      let ny = scratch[1];
      let nz = scratch[2];
      const len = Math.sqrt(nx * nx + ny * ny + nz * nz);
      if (len > 1e-12 && Number.isFinite(len)) {
        out[o] = nx / len;
        out[o + 1] = ny / len;
        out[o + 2] = nz / len;
        return;
      }
      const dx = (ask(x + e, z) - ask(x - e, z)) / spacing;
      const dz = (ask(x, z + e) - ask(x, z - e)) / spacing;
      const n = 1 / Math.sqrt(dx * dx + 1 + dz * dz);
      nx = -dx * n;
      ny = n;
      nz = -dz * n;
      out[o] = nx;
      out[o + 1] = ny;
      out[o + 2] = nz;
    },
  };
}

/** Samples per spacing used by the segment tests: enough to catch every bilinear ridge within a few mm. */
const SAMPLES_PER_CELL = 2;

function sampleCount(g: Ground, ax: number, az: number, bx: number, bz: number): number {
  const d = Math.sqrt((bx - ax) * (bx - ax) + (bz - az) * (bz - az));
  return Math.max(1, Math.ceil((d / g.spacing) * SAMPLES_PER_CELL));
}

/** Highest ground under the straight line from (ax, az) to (bx, bz), ends included. */
export function maxHeightAlong(ground: Heightfield | Ground, ax: number, az: number, bx: number, bz: number): number {
  const g = asGround(ground);
  const n = sampleCount(g, ax, az, bx, bz);
  let best = -Infinity;
  for (let k = 0; k <= n; k++) {
    const t = k / n;
    const h = g.height(ax + (bx - ax) * t, az + (bz - az) * t);
    if (h > best) best = h;
  }
  return best;
}

/**
 * Smallest height of the 3D segment a→b above the ground along it (negative:
 * the segment dips below the ground by that much).
 */
export function segmentClearance(
  ground: Heightfield | Ground,
  ax: number,
  ay: number,
  az: number,
  bx: number,
  by: number,
  bz: number,
): number {
  const g = asGround(ground);
  const n = sampleCount(g, ax, az, bx, bz);
  let least = Infinity;
  for (let k = 0; k <= n; k++) {
    const t = k / n;
    const c = ay + (by - ay) * t - g.height(ax + (bx - ax) * t, az + (bz - az) * t);
    if (c < least) least = c;
  }
  return least;
}

/** True when the segment a→b stays at least `margin` metres above the ground. */
export function segmentClears(
  ground: Heightfield | Ground,
  ax: number,
  ay: number,
  az: number,
  bx: number,
  by: number,
  bz: number,
  margin = 0,
): boolean {
  return segmentClearance(ground, ax, ay, az, bx, by, bz) >= margin;
}
