/**
 * The course heightfield: a regular grid of ground heights.
 *
 * World layout (glTF conventions: metres, +Y up, the walk goes along +Z):
 * column c sits at x = (c − (cols − 1)/2)·cellSize (centred across the walk),
 * row r at z = r·cellSize. heights[r·cols + c] is the ground height there.
 */
import { COURSE_LIMITS } from './limits';
import type { WalkPath } from './walk-path';

export interface Heightfield {
  /** Samples across the walk (x). */
  cols: number;
  /** Samples along the walk (z). */
  rows: number;
  /** Metres between neighbouring samples. */
  cellSize: number;
  /** rows × cols heights in metres, row-major. */
  heights: Float64Array;
  /** The line the body walks (walk-path.ts); absent: straight ahead along +Z at x = 0. */
  walkPath?: WalkPath;
}

export class CourseError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CourseError';
  }
}

/** Throws a CourseError naming the first grid dimension that is out of bounds. */
export function checkGrid(cols: number, rows: number, cellSize: number): void {
  const L = COURSE_LIMITS;
  if (!Number.isInteger(cols) || cols < L.minCols || cols > L.maxCols) {
    throw new CourseError(`cols must be an integer in [${L.minCols}, ${L.maxCols}], got ${cols}`);
  }
  if (!Number.isInteger(rows) || rows < L.minRows || rows > L.maxRows) {
    throw new CourseError(`rows must be an integer in [${L.minRows}, ${L.maxRows}], got ${rows}`);
  }
  if (cols * rows > L.maxCells) {
    throw new CourseError(`cols × rows must be at most ${L.maxCells}, got ${cols * rows}`);
  }
  if (!Number.isFinite(cellSize) || cellSize < L.minCellSize || cellSize > L.maxCellSize) {
    throw new CourseError(`cellSize must be in [${L.minCellSize}, ${L.maxCellSize}] m, got ${cellSize}`);
  }
}

/** A flat heightfield at `height` covering `width` × `length` metres (rounded up to whole cells). */
export function createHeightfield(width: number, length: number, cellSize: number, height = 0): Heightfield {
  if (!(width > 0) || !(length > 0)) {
    throw new CourseError(`width and length must be positive, got ${width} × ${length} m`);
  }
  const cols = Math.ceil(width / cellSize - 1e-9) + 1;
  const rows = Math.ceil(length / cellSize - 1e-9) + 1;
  try {
    return createHeightfieldGrid(cols, rows, cellSize, height);
  } catch (err) {
    throw new CourseError(`a ${width} × ${length} m course with ${cellSize} m cells: ${(err as Error).message}`);
  }
}

export function createHeightfieldGrid(cols: number, rows: number, cellSize: number, height = 0): Heightfield {
  checkGrid(cols, rows, cellSize);
  checkHeight(height, 'height');
  const heights = new Float64Array(cols * rows);
  heights.fill(height);
  return { cols, rows, cellSize, heights };
}

export function cloneHeightfield(hf: Heightfield): Heightfield {
  const copy: Heightfield = { cols: hf.cols, rows: hf.rows, cellSize: hf.cellSize, heights: hf.heights.slice() };
  if (hf.walkPath) copy.walkPath = copyWalkPath(hf.walkPath);
  return copy;
}

function copyWalkPath(p: WalkPath): WalkPath {
  return { points: p.points.map((q) => ({ x: q.x, z: q.z })), closed: p.closed, speed: p.speed };
}

export function checkHeight(h: number, what: string): void {
  if (!Number.isFinite(h) || Math.abs(h) > COURSE_LIMITS.maxAbsHeight) {
    throw new CourseError(`${what} must be finite and within ±${COURSE_LIMITS.maxAbsHeight} m, got ${h}`);
  }
}

/** Clamp a height into the course bounds (brushes and generators never leave them). */
export function clampHeight(h: number): number {
  const m = COURSE_LIMITS.maxAbsHeight;
  return h > m ? m : h < -m ? -m : h;
}

export function courseWidth(hf: Heightfield): number {
  return (hf.cols - 1) * hf.cellSize;
}

export function courseLength(hf: Heightfield): number {
  return (hf.rows - 1) * hf.cellSize;
}

export function columnX(hf: Heightfield, col: number): number {
  return (col - (hf.cols - 1) / 2) * hf.cellSize;
}

export function rowZ(hf: Heightfield, row: number): number {
  return row * hf.cellSize;
}

/** Lowest and highest height of the course (both NaN if any height is NaN). */
export function heightRange(hf: Heightfield): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  const h = hf.heights;
  for (let i = 0; i < h.length; i++) {
    if (h[i] !== h[i]) return { min: NaN, max: NaN };
    if (h[i] < min) min = h[i];
    if (h[i] > max) max = h[i];
  }
  return { min, max };
}
