/**
 * Ground queries on a heightfield: bilinear height and its normal (segment
 * tests over any ground are in ground.ts). Outside the grid the edge heights
 * continue. Nothing here allocates.
 */
import type { Heightfield } from './heightfield';

/** Bilinear ground height at (x, z). */
export function heightAt(hf: Heightfield, x: number, z: number): number {
  const inv = 1 / hf.cellSize;
  let u = x * inv + (hf.cols - 1) * 0.5;
  let v = z * inv;
  const cm = hf.cols - 1;
  const rm = hf.rows - 1;
  u = u < 0 ? 0 : u > cm ? cm : u;
  v = v < 0 ? 0 : v > rm ? rm : v;
  let c = Math.floor(u);
  let r = Math.floor(v);
  if (c >= cm) c = cm - 1;
  if (r >= rm) r = rm - 1;
  const fu = u - c;
  const fv = v - r;
  const h = hf.heights;
  const i = r * hf.cols + c;
  const h00 = h[i];
  const h10 = h[i + 1];
  const h01 = h[i + hf.cols];
  const h11 = h[i + hf.cols + 1];
  return (h00 * (1 - fu) + h10 * fu) * (1 - fv) + (h01 * (1 - fu) + h11 * fu) * fv;
}

/**
 * Ground height under each of `count` points stored x, y, z in `points`,
 * into out: one call for many points, so no doubles are boxed per point.
 */
export function heightsUnder(hf: Heightfield, points: ArrayLike<number>, count: number, out: Float64Array): void {
  for (let i = 0; i < count; i++) out[i] = heightAt(hf, points[3 * i], points[3 * i + 2]);
}

/**
 * Unit ground normal at (x, z) from the gradient of the bilinear surface,
 * written into out[offset..offset+2]; returns out.
 */
export function normalAt<T extends { [i: number]: number }>(hf: Heightfield, x: number, z: number, out: T, offset = 0): T {
  const inv = 1 / hf.cellSize;
  const cm = hf.cols - 1;
  const rm = hf.rows - 1;
  let u = x * inv + cm * 0.5;
  let v = z * inv;
  const outside = u < 0 || u > cm;
  const outsideV = v < 0 || v > rm;
  u = u < 0 ? 0 : u > cm ? cm : u;
  v = v < 0 ? 0 : v > rm ? rm : v;
  let c = Math.floor(u);
  let r = Math.floor(v);
  if (c >= cm) c = cm - 1;
  if (r >= rm) r = rm - 1;
  const fu = u - c;
  const fv = v - r;
  const h = hf.heights;
  const i = r * hf.cols + c;
  const h00 = h[i];
  const h10 = h[i + 1];
  const h01 = h[i + hf.cols];
  const h11 = h[i + hf.cols + 1];
  // Beyond the edge the heights are held constant, so the slope across it is zero.
  const dx = outside ? 0 : ((h10 - h00) * (1 - fv) + (h11 - h01) * fv) * inv;
  const dz = outsideV ? 0 : ((h01 - h00) * (1 - fu) + (h11 - h10) * fu) * inv;
  const n = 1 / Math.sqrt(dx * dx + 1 + dz * dz);
  out[offset] = -dx * n;
  out[offset + 1] = n;
  out[offset + 2] = -dz * n;
  return out;
}
