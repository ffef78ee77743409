/**
 * Treadle's height colours: a ramp of our own from deep slate (low) through teal moss, lichen and sand to rust
 * (high), with a hillshade so steps and slopes read at a glance.
 */
import type { Heightfield } from '../../engine/course/heightfield';

const STOPS: readonly [number, number, number, number][] = [
  [0, 0x26, 0x38, 0x45],
  [0.3, 0x3f, 0x6e, 0x6a],
  [0.55, 0xa9, 0xb7, 0x7e],
  [0.78, 0xe2, 0xc9, 0x8f],
  [1, 0xc8, 0x64, 0x3b],
];

export const RAMP_CSS_STOPS = STOPS.map(([t, r, g, b]) => ({ offset: t, color: `rgb(${r}, ${g}, ${b})` }));

/** The colour of t in [0, 1] as [r, g, b]. */
export function rampColour(t: number, out: Uint8ClampedArray | number[] = [0, 0, 0], offset = 0) {
  const c = t < 0 ? 0 : t > 1 ? 1 : t;
  let k = 1;
  while (k < STOPS.length - 1 && STOPS[k][0] < c) k++;
  const [t0, r0, g0, b0] = STOPS[k - 1];
  const [t1, r1, g1, b1] = STOPS[k];
  const u = (c - t0) / (t1 - t0);
  out[offset] = r0 + (r1 - r0) * u;
  out[offset + 1] = g0 + (g1 - g0) * u;
  out[offset + 2] = b0 + (b1 - b0) * u;
  return out;
}

/** Heights the ramp spans: the course's own range, at least 10 cm wide so a flat course is not all rust. */
export function rampRange(min: number, max: number): { lo: number; hi: number } {
  const span = Math.max(0.1, max - min);
  const mid = (min + max) / 2;
  return { lo: mid - span / 2, hi: mid + span / 2 };
}

/** One shaded RGBA colour per sample (row-major like the heights), light falling from the far end of the course. */
export function sampleColours(hf: Heightfield, lo: number, hi: number, out: Uint8ClampedArray): Uint8ClampedArray {
  const { cols, rows, cellSize, heights: h } = hf;
  const inv = 1 / (hi - lo);
  const rgb = [0, 0, 0];
  for (let r = 0; r < rows; r++) {
    const rn = r + 1 < rows ? r + 1 : r;
    const rp = r > 0 ? r - 1 : r;
    for (let c = 0; c < cols; c++) {
      const i = r * cols + c;
      const cn = c + 1 < cols ? c + 1 : c;
      const cp = c > 0 ? c - 1 : c;
      const dz = (h[rn * cols + c] - h[rp * cols + c]) / ((rn - rp || 1) * cellSize);
      const dx = (h[r * cols + cn] - h[r * cols + cp]) / ((cn - cp || 1) * cellSize);
      let shade = 1 + 0.9 * dz * 0.8 + 0.9 * dx * 0.3;
      shade = shade < 0.62 ? 0.62 : shade > 1.22 ? 1.22 : shade;
      rampColour((h[i] - lo) * inv, rgb);
      out[4 * i] = rgb[0] * shade;
      out[4 * i + 1] = rgb[1] * shade;
      out[4 * i + 2] = rgb[2] * shade;
      out[4 * i + 3] = 255;
    }
  }
  return out;
}
