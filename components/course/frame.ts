/**
 * Where a course lands on screen, seen from above. The walk runs up the screen on a phone ('up') and to the
 * right on a wide screen ('right'); in both, +x (the walker's left, glTF right-handed with +Y up) is a quarter
 * turn anticlockwise from the walking direction. The frame includes half a cell around the outer samples so
 * every sample owns a square of screen.
 */
import type { Heightfield } from '../../engine/course/heightfield';

export type WalkDirection = 'up' | 'right';

export interface CourseFrame {
  direction: WalkDirection;
  /** Pixels per metre. */
  scale: number;
  /** Screen size of the map, px. */
  width: number;
  height: number;
  /** Half extents of the course in metres, with the half-cell margin. */
  halfAcross: number;
  along: number;
  margin: number;
}

export function courseFrame(hf: Heightfield, direction: WalkDirection, maxWidth: number, maxHeight: number): CourseFrame {
  const margin = hf.cellSize / 2;
  const across = (hf.cols - 1) * hf.cellSize + 2 * margin;
  const along = (hf.rows - 1) * hf.cellSize + 2 * margin;
  const [screenW, screenH] = direction === 'up' ? [across, along] : [along, across];
  const scale = Math.max(1e-6, Math.min(maxWidth / screenW, maxHeight / screenH));
  return {
    direction,
    scale,
    width: Math.round(screenW * scale),
    height: Math.round(screenH * scale),
    halfAcross: across / 2,
    along: along - margin,
    margin,
  };
}

/** Screen position (px from the map's top left) of the course point (x, z). */
export function toScreen(f: CourseFrame, x: number, z: number): { px: number; py: number } {
  const a = (f.halfAcross - x) * f.scale;
  return f.direction === 'up' ? { px: a, py: (f.along - z) * f.scale } : { px: (z + f.margin) * f.scale, py: a };
}

/** Course point under the screen position (px, py). */
export function toCourse(f: CourseFrame, px: number, py: number): { x: number; z: number } {
  return f.direction === 'up'
    ? { x: f.halfAcross - px / f.scale, z: f.along - py / f.scale }
    : { x: f.halfAcross - py / f.scale, z: px / f.scale - f.margin };
}

/** Distance along the walk shown at a screen offset along the walking axis (for the profile beside the map). */
export function alongAt(f: CourseFrame, offset: number): number {
  return f.direction === 'up' ? f.along - offset / f.scale : offset / f.scale - f.margin;
}
