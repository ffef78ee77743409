import type { Heightfield } from '../../engine/course/heightfield';
import type { CourseFrame } from './frame';

export type StrokeEvent = { phase: 'start' | 'move' | 'end'; x: number; z: number };

export interface HeightMapProps {
  hf: Heightfield;
  frame: CourseFrame;
  /** Bumped whenever the heights change, so the map redraws. */
  revision: number;
  /** Heights at the two ends of the colour ramp. */
  lo: number;
  hi: number;
  /** Shows the brush outline at the pointer and sends strokes when set. */
  brushRadius?: number;
  onStroke?(e: StrokeEvent): void;
  label: string;
}
