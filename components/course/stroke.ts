/**
 * One finger or mouse stroke over the course: dabs the engine's brush at a quarter radius apart along the
 * pointer's path (a resting finger adds nothing) and gathers the whole stroke into one change for undo.
 */
import { applyBrushStroke, type BrushInput, type BrushPoint, type HeightChange } from '../../engine/course/brushes';
import type { Heightfield } from '../../engine/course/heightfield';
import { heightAt } from '../../engine/course/sample';

export class SculptStroke {
  private readonly original = new Map<number, number>();
  private readonly brush: BrushInput;
  private readonly spacing: number;
  private last: BrushPoint;

  constructor(
    private readonly hf: Heightfield,
    brush: BrushInput,
    start: BrushPoint,
  ) {
    // Flatten holds the level found where the stroke began, for the whole stroke.
    this.brush = brush.kind === 'flatten' ? { ...brush, level: brush.level ?? heightAt(hf, start.x, start.z) } : brush;
    // Slightly under a quarter radius, so the engine puts exactly one dab on each point we hand it.
    this.spacing = (brush.radius / 4) * 0.999;
    this.last = start;
    this.dab([start]);
  }

  /** Moves the pen; true when the heights changed. */
  moveTo(p: BrushPoint): boolean {
    const points: BrushPoint[] = [];
    let { x, z } = this.last;
    let d = Math.hypot(p.x - x, p.z - z);
    while (d >= this.spacing) {
      x += ((p.x - x) * this.spacing) / d;
      z += ((p.z - z) * this.spacing) / d;
      points.push({ x, z });
      d -= this.spacing;
    }
    if (!points.length) return false;
    this.last = points[points.length - 1];
    return this.dab(points);
  }

  /** The stroke as one change (null when it changed nothing). */
  finish(): HeightChange | null {
    const indices = Uint32Array.from([...this.original.keys()].filter((i) => this.original.get(i) !== this.hf.heights[i]).sort((a, b) => a - b));
    if (!indices.length) return null;
    const before = new Float64Array(indices.length);
    const after = new Float64Array(indices.length);
    indices.forEach((i, k) => {
      before[k] = this.original.get(i)!;
      after[k] = this.hf.heights[i];
    });
    return { indices, before, after };
  }

  private dab(points: BrushPoint[]): boolean {
    const change = applyBrushStroke(this.hf, this.brush, points);
    for (let k = 0; k < change.indices.length; k++) {
      if (!this.original.has(change.indices[k])) this.original.set(change.indices[k], change.before[k]);
    }
    return change.indices.length > 0;
  }
}
