/**
 * Sculpting brushes: raise, lower, smooth, flatten. A dab or a stroke edits the
 * heightfield in place and returns the change it made, so the editor can undo
 * and redo it. Heights always stay finite and inside the course bounds.
 */
import { z } from 'zod';
import { CourseError, clampHeight, type Heightfield } from './heightfield';
import { COURSE_LIMITS } from './limits';
import { parseOrThrow } from './parse';
import { heightAt } from './sample';

/** Height moved at the centre of a raise/lower dab at strength 1, m. */
export const BRUSH_STEP_AT_FULL_STRENGTH = 0.05;

export const BrushSchema = z.object({
  kind: z.enum(['raise', 'lower', 'smooth', 'flatten']),
  radius: z.number().min(0.01).max(20).describe('m'),
  /** 0..1: raise/lower move BRUSH_STEP_AT_FULL_STRENGTH·strength at the centre; smooth/flatten blend that fraction of the way. */
  strength: z.number().gt(0).max(1),
  /** How the effect fades from the centre to the rim. */
  falloff: z.enum(['constant', 'linear', 'smooth']).default('smooth'),
  /** Flatten level, m; omitted = the ground height where the stroke starts. */
  level: z.number().min(-COURSE_LIMITS.maxAbsHeight).max(COURSE_LIMITS.maxAbsHeight).optional(),
});

export type Brush = z.infer<typeof BrushSchema>;
export type BrushInput = z.input<typeof BrushSchema>;

/** What a brush changed: the touched samples with their heights before and after. */
export interface HeightChange {
  indices: Uint32Array;
  before: Float64Array;
  after: Float64Array;
}

export interface BrushPoint {
  x: number;
  z: number;
}

function weight(falloff: Brush['falloff'], d: number, radius: number): number {
  if (d >= radius) return 0;
  const t = 1 - d / radius;
  if (falloff === 'constant') return 1;
  if (falloff === 'linear') return t;
  return t * t * (3 - 2 * t);
}

function checkPoint(p: BrushPoint, i: number): void {
  if (!Number.isFinite(p.x) || !Number.isFinite(p.z)) {
    throw new CourseError(`brush point ${i} must have finite x and z, got (${p.x}, ${p.z})`);
  }
}

/** One dab; `original` collects the height each edited sample had before the stroke. */
function dab(hf: Heightfield, b: Brush, level: number, p: BrushPoint, original: Map<number, number>, scratch: Float64Array): void {
  const { cols, rows, cellSize } = hf;
  const h = hf.heights;
  const cx = p.x / cellSize + (cols - 1) / 2;
  const cz = p.z / cellSize;
  const rc = b.radius / cellSize;
  const c0 = Math.max(0, Math.ceil(cx - rc));
  const c1 = Math.min(cols - 1, Math.floor(cx + rc));
  const r0 = Math.max(0, Math.ceil(cz - rc));
  const r1 = Math.min(rows - 1, Math.floor(cz + rc));
  if (c0 > c1 || r0 > r1) return;
  const w = c1 - c0 + 1;
  // Smoothing reads the heights as they were before this dab.
  if (b.kind === 'smooth') {
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        let sum = 0;
        let n = 0;
        for (let dr = -1; dr <= 1; dr++) {
          const rr = r + dr;
          if (rr < 0 || rr >= rows) continue;
          for (let dc = -1; dc <= 1; dc++) {
            const cc = c + dc;
            if (cc < 0 || cc >= cols) continue;
            sum += h[rr * cols + cc];
            n++;
          }
        }
        scratch[(r - r0) * w + (c - c0)] = sum / n;
      }
    }
  }
  for (let r = r0; r <= r1; r++) {
    for (let c = c0; c <= c1; c++) {
      const dx = (c - cx) * cellSize;
      const dz = (r - cz) * cellSize;
      const k = weight(b.falloff, Math.sqrt(dx * dx + dz * dz), b.radius);
      if (k <= 0) continue;
      const i = r * cols + c;
      const old = h[i];
      let next: number;
      switch (b.kind) {
        case 'raise':
          next = old + BRUSH_STEP_AT_FULL_STRENGTH * b.strength * k;
          break;
        case 'lower':
          next = old - BRUSH_STEP_AT_FULL_STRENGTH * b.strength * k;
          break;
        case 'smooth':
          next = old + b.strength * k * (scratch[(r - r0) * w + (c - c0)] - old);
          break;
        case 'flatten':
          next = old + b.strength * k * (level - old);
          break;
      }
      next = clampHeight(next);
      if (next === old) continue;
      if (!original.has(i)) original.set(i, old);
      h[i] = next;
    }
  }
}

/**
 * Apply a brush along a stroke (one point = a single dab). Dabs are spaced a
 * quarter radius apart along the polyline so a fast finger leaves no gaps.
 */
export function applyBrushStroke(hf: Heightfield, brushInput: BrushInput, points: readonly BrushPoint[]): HeightChange {
  const b = parseOrThrow(BrushSchema, brushInput, 'brush', (m) => new CourseError(m));
  if (points.length === 0) throw new CourseError('a brush stroke needs at least one point');
  points.forEach(checkPoint);
  const level = b.level ?? heightAt(hf, points[0].x, points[0].z);
  const original = new Map<number, number>();
  const side = Math.ceil((2 * b.radius) / hf.cellSize) + 2;
  const scratch = new Float64Array(side * side);
  const spacing = b.radius / 4;
  dab(hf, b, level, points[0], original, scratch);
  for (let k = 1; k < points.length; k++) {
    const a = points[k - 1];
    const p = points[k];
    const d = Math.hypot(p.x - a.x, p.z - a.z);
    const n = Math.max(1, Math.ceil(d / spacing));
    for (let j = 1; j <= n; j++) {
      const t = j / n;
      dab(hf, b, level, { x: a.x + (p.x - a.x) * t, z: a.z + (p.z - a.z) * t }, original, scratch);
    }
  }
  const indices = Uint32Array.from([...original.keys()].sort((x, y) => x - y));
  const before = new Float64Array(indices.length);
  const after = new Float64Array(indices.length);
  for (let k = 0; k < indices.length; k++) {
    before[k] = original.get(indices[k])!;
    after[k] = hf.heights[indices[k]];
  }
  return { indices, before, after };
}

/** A single dab at (x, z). */
export function applyBrush(hf: Heightfield, brush: BrushInput, x: number, z: number): HeightChange {
  return applyBrushStroke(hf, brush, [{ x, z }]);
}

export function undoChange(hf: Heightfield, change: HeightChange): void {
  for (let k = 0; k < change.indices.length; k++) hf.heights[change.indices[k]] = change.before[k];
}

export function redoChange(hf: Heightfield, change: HeightChange): void {
  for (let k = 0; k < change.indices.length; k++) hf.heights[change.indices[k]] = change.after[k];
}
