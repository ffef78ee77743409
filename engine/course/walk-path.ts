/**
 * A course's walk path: the line the body follows across the ground, a few
 * control points in the plane (x across, z along the course, metres) joined by
 * a centripetal Catmull–Rom curve (Yuksel, Schaefer & Keyser 2011: no cusps or
 * self-loops between control points), and the body's speed along it. A course
 * without one is walked straight ahead along +Z at x = 0, as it always was.
 *
 * The curve is sampled once into an arc-length table (`createPathTrack`), so a
 * walk asks "where is the body s metres along, and which way does it face" in
 * constant time and allocates nothing per frame.
 */
import { z } from 'zod';

/** Most control points a path may have: enough for a loop or an S, few enough to drag by finger. */
export const WALK_PATH_MAX_POINTS = 32;
/** Control points closer than this are one point, m. */
export const WALK_PATH_MIN_SPACING = 0.05;

const coordinate = z.number().min(-1000).max(1000);

export const WalkPathPointSchema = z.object({ x: coordinate, z: coordinate });

export const WalkPathSchema = z
  .object({
    /** Control points in walking order, m. */
    points: z
      .array(WalkPathPointSchema)
      .min(2, 'A walk path needs at least two points.')
      .max(WALK_PATH_MAX_POINTS, `A walk path has at most ${WALK_PATH_MAX_POINTS} points.`),
    /** After the last point the path runs back to the first: a loop walked until the trial's time is up. */
    closed: z.boolean().default(false),
    /** Body speed along the path, m/s; null: the leg setup's own gait speed. */
    speed: z.number().positive('The speed must be above 0.').max(10, 'Walk at most 10 m/s.').nullable().default(null),
  })
  .superRefine((p, ctx) => {
    const n = p.points.length;
    for (let i = 0; i < n; i++) {
      if (!p.closed && i === n - 1) break;
      const a = p.points[i];
      const b = p.points[(i + 1) % n];
      if (Math.hypot(b.x - a.x, b.z - a.z) < WALK_PATH_MIN_SPACING) {
        ctx.addIssue({
          code: 'custom',
          path: ['points', (i + 1) % n],
          message: `This point is within ${WALK_PATH_MIN_SPACING * 100} cm of the one before it; move it or remove it.`,
        });
      }
    }
    if (p.closed && n < 3) ctx.addIssue({ code: 'custom', path: ['points'], message: 'A closed walk path needs at least three points.' });
  });

export type WalkPath = z.infer<typeof WalkPathSchema>;
export type WalkPathInput = z.input<typeof WalkPathSchema>;

/**
 * Problems of a path on a course of this size (x within the width, z within the length), as
 * [index, message] pairs: the schema cannot know the grid, the encoding and the recipe can.
 */
export function walkPathOutside(p: { points: readonly { x: number; z: number }[] }, width: number, length: number): [number, string][] {
  const out: [number, string][] = [];
  p.points.forEach((q, i) => {
    if (Math.abs(q.x) > width / 2 + 1e-9 || q.z < -1e-9 || q.z > length + 1e-9) {
      out.push([i, `This point (x ${q.x.toFixed(2)} m, z ${q.z.toFixed(2)} m) is off the course: x within ±${(width / 2).toFixed(2)} m, z within 0–${length.toFixed(2)} m.`]);
    }
  });
  return out;
}

/** A walk path sampled by arc length: positions and unit tangents every `spacing` metres. */
export interface PathTrack {
  readonly closed: boolean;
  /** Arc length of the whole path, m. */
  readonly length: number;
  readonly spacing: number;
  readonly count: number;
  /** x, z per sample. */
  readonly xz: Float64Array;
  /** Unit tangent x, z per sample. */
  readonly tangent: Float64Array;
}

/** Samples per curve segment before the arc-length table is resampled. */
const FINE_PER_SEGMENT = 256;
const TRACK_SPACING = 0.01;

/** Centripetal Catmull–Rom point on segment p1→p2 (α = ½), by the Barry–Goldman pyramid. */
function catmullRom(p0: number[], p1: number[], p2: number[], p3: number[], u: number, out: number[]): void {
  const knot = (a: number[], b: number[]) => Math.sqrt(Math.max(Math.hypot(b[0] - a[0], b[1] - a[1]), 1e-9));
  const t0 = 0;
  const t1 = t0 + knot(p0, p1);
  const t2 = t1 + knot(p1, p2);
  const t3 = t2 + knot(p2, p3);
  const t = t1 + (t2 - t1) * u;
  for (let c = 0; c < 2; c++) {
    const a1 = ((t1 - t) * p0[c] + (t - t0) * p1[c]) / (t1 - t0);
    const a2 = ((t2 - t) * p1[c] + (t - t1) * p2[c]) / (t2 - t1);
    const a3 = ((t3 - t) * p2[c] + (t - t2) * p3[c]) / (t3 - t2);
    const b1 = ((t2 - t) * a1 + (t - t0) * a2) / (t2 - t0);
    const b2 = ((t3 - t) * a2 + (t - t1) * a3) / (t3 - t1);
    out[c] = ((t2 - t) * b1 + (t - t1) * b2) / (t2 - t1);
  }
}

/** Sample a path by arc length (made once per trial; allocates). */
export function createPathTrack(path: WalkPath): PathTrack {
  const pts = path.points.map((p) => [p.x, p.z]);
  const n = pts.length;
  const segments = path.closed ? n : n - 1;
  const at = (i: number) => {
    if (path.closed) return pts[((i % n) + n) % n];
    if (i < 0) return [2 * pts[0][0] - pts[1][0], 2 * pts[0][1] - pts[1][1]];
    if (i >= n) return [2 * pts[n - 1][0] - pts[n - 2][0], 2 * pts[n - 1][1] - pts[n - 2][1]];
    return pts[i];
  };
  const fine: number[] = [];
  const p = [0, 0];
  for (let s = 0; s < segments; s++) {
    for (let k = 0; k < FINE_PER_SEGMENT; k++) {
      catmullRom(at(s - 1), at(s), at(s + 1), at(s + 2), k / FINE_PER_SEGMENT, p);
      fine.push(p[0], p[1]);
    }
  }
  const last = path.closed ? pts[0] : pts[n - 1];
  fine.push(last[0], last[1]);
  const m = fine.length / 2;
  const cum = new Float64Array(m);
  for (let k = 1; k < m; k++) cum[k] = cum[k - 1] + Math.hypot(fine[2 * k] - fine[2 * k - 2], fine[2 * k + 1] - fine[2 * k - 1]);
  const length = cum[m - 1];
  const count = Math.max(2, Math.ceil(length / TRACK_SPACING) + 1);
  const spacing = length / (count - 1);
  const xz = new Float64Array(2 * count);
  let j = 0;
  for (let k = 0; k < count; k++) {
    const s = k * spacing;
    while (j < m - 2 && cum[j + 1] < s) j++;
    const span = cum[j + 1] - cum[j];
    const f = span > 0 ? Math.min(1, Math.max(0, (s - cum[j]) / span)) : 0;
    xz[2 * k] = fine[2 * j] + (fine[2 * j + 2] - fine[2 * j]) * f;
    xz[2 * k + 1] = fine[2 * j + 1] + (fine[2 * j + 3] - fine[2 * j + 1]) * f;
  }
  const tangent = new Float64Array(2 * count);
  for (let k = 0; k < count; k++) {
    let a = k - 1;
    let b = k + 1;
    if (path.closed) {
      // The first and last samples are the same point of a loop.
      a = k === 0 ? count - 2 : a;
      b = k === count - 1 ? 1 : b;
    } else {
      a = a < 0 ? 0 : a;
      b = b > count - 1 ? count - 1 : b;
    }
    const dx = xz[2 * b] - xz[2 * a];
    const dz = xz[2 * b + 1] - xz[2 * a + 1];
    const d = Math.hypot(dx, dz) || 1;
    tangent[2 * k] = dx / d;
    tangent[2 * k + 1] = dz / d;
  }
  return { closed: path.closed, length, spacing, count, xz, tangent };
}

/**
 * Where the body is s metres along the track: x, z and heading (rad about +Y; 0 faces +Z, π/2 faces +X)
 * into out[0..2]. A loop wraps; an open path continues straight past its ends along its end tangents.
 */
export function trackPoint(track: PathTrack, s: number, out: Float64Array): void {
  const L = track.length;
  let u = s;
  if (track.closed) u = u - Math.floor(u / L) * L;
  const n = track.count;
  let over = 0;
  if (u < 0) {
    over = u;
    u = 0;
  } else if (u > L) {
    over = u - L;
    u = L;
  }
  const f = u / track.spacing;
  let k = Math.floor(f);
  if (k >= n - 1) k = n - 2;
  const w = f - k;
  const xz = track.xz;
  const tg = track.tangent;
  let tx = tg[2 * k] + (tg[2 * k + 2] - tg[2 * k]) * w;
  let tz = tg[2 * k + 1] + (tg[2 * k + 3] - tg[2 * k + 1]) * w;
  const d = Math.sqrt(tx * tx + tz * tz) || 1;
  tx /= d;
  tz /= d;
  out[0] = xz[2 * k] + (xz[2 * k + 2] - xz[2 * k]) * w + tx * over;
  out[1] = xz[2 * k + 1] + (xz[2 * k + 3] - xz[2 * k + 1]) * w + tz * over;
  out[2] = Math.atan2(tx, tz);
}
