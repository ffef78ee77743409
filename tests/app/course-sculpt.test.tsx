import { applyBrushStroke, BRUSH_STEP_AT_FULL_STRENGTH } from '../../engine/course/brushes';
import { cloneHeightfield, createHeightfieldGrid } from '../../engine/course/heightfield';
import { heightAt } from '../../engine/course/sample';
import { SculptHistory } from '../../components/course/history';
import { SculptStroke } from '../../components/course/stroke';
import { courseFrame, toCourse, toScreen } from '../../components/course/frame';
import { rampColour } from '../../components/course/ramp';

const flat = () => createHeightfieldGrid(41, 81, 0.05);
const raise = { kind: 'raise' as const, radius: 0.2, strength: 1, falloff: 'smooth' as const };

// Stroke spacing and undo behaviour follow engine/course/brushes.ts; the frame and ramp checks are our own conventions (common practice, no source).
describe('a sculpt stroke', () => {
  it('puts the same dabs as the engine stroke over the same path, and nothing more for a resting finger', () => {
    const mine = flat();
    const stroke = new SculptStroke(mine, raise, { x: 0, z: 1 });
    // Many small pointer moves, then the finger rests.
    for (let k = 1; k <= 40; k++) stroke.moveTo({ x: 0, z: 1 + k * 0.01 });
    for (let k = 0; k < 20; k++) stroke.moveTo({ x: 0, z: 1.4 });
    const change = stroke.finish()!;
    // The engine's own stroke with dabs a quarter radius apart along the same 0.4 m (brushes.ts spacing).
    const reference = flat();
    const dabs = [];
    for (let k = 0; k * (0.2 / 4) * 0.999 <= 0.4 + 1e-12; k++) dabs.push({ x: 0, z: 1 + k * (0.2 / 4) * 0.999 });
    applyBrushStroke(reference, raise, dabs);
    // Same dabs; the dab centres are reached by repeated steps, so heights agree to rounding, not to the bit.
    let worst = 0;
    for (let i = 0; i < mine.heights.length; i++) worst = Math.max(worst, Math.abs(mine.heights[i] - reference.heights[i]));
    expect(worst).toBeLessThan(1e-12);
    expect(change.indices.length).toBeGreaterThan(0);
    // Every changed sample went up and stayed inside one dab per spacing: at most one full step per dab (brushes.ts).
    for (let k = 0; k < change.indices.length; k++) expect(change.after[k]).toBeGreaterThan(change.before[k]);
    expect(Math.max(...mine.heights)).toBeLessThanOrEqual(dabs.length * BRUSH_STEP_AT_FULL_STRENGTH + 1e-12);
  });

  it('flattens to the level where the stroke began', () => {
    const hf = flat();
    for (let r = 0; r < hf.rows; r++) for (let c = 0; c < hf.cols; c++) hf.heights[r * hf.cols + c] = r * 0.01;
    const start = heightAt(hf, 0, 1);
    const stroke = new SculptStroke(hf, { kind: 'flatten', radius: 0.3, strength: 1, falloff: 'constant' }, { x: 0, z: 1 });
    stroke.moveTo({ x: 0, z: 2 });
    stroke.finish();
    expect(heightAt(hf, 0, 1.5)).toBeCloseTo(start, 12);
  });
});

describe('undo and redo', () => {
  it('restore the heights exactly, and a new stroke after undo drops the redo', () => {
    const hf = flat();
    const original = cloneHeightfield(hf);
    const history = new SculptHistory();
    const a = new SculptStroke(hf, raise, { x: 0, z: 1 });
    history.push(a.finish()!);
    const afterA = Array.from(hf.heights);
    const b = new SculptStroke(hf, { ...raise, kind: 'lower' }, { x: 0.3, z: 2 });
    history.push(b.finish()!);
    expect(history.position).toBe(2);
    history.undo(hf);
    expect(Array.from(hf.heights)).toEqual(afterA);
    history.undo(hf);
    expect(Array.from(hf.heights)).toEqual(Array.from(original.heights));
    expect(history.position).toBe(0);
    history.redo(hf);
    expect(Array.from(hf.heights)).toEqual(afterA);
    history.push(new SculptStroke(hf, raise, { x: -0.3, z: 3 }).finish()!);
    expect(history.canRedo).toBe(false);
    // A new entry never reuses an old id, so "unsaved" stays true after undoing past a save.
    expect(history.position).toBe(3);
  });
});

describe('the map frame', () => {
  it('maps screen to course and back, with the walk going up on a phone and right on a wide screen', () => {
    const hf = flat();
    for (const dir of ['up', 'right'] as const) {
      const f = courseFrame(hf, dir, 300, 600);
      const p = toScreen(f, 0.5, 3);
      const back = toCourse(f, p.px, p.py);
      expect(back.x).toBeCloseTo(0.5, 9);
      expect(back.z).toBeCloseTo(3, 9);
    }
    const up = courseFrame(hf, 'up', 300, 600);
    // Walking up the screen: further along is higher up; +x (the walker's left, glTF right-handed) is to the left.
    expect(toScreen(up, 0, 3).py).toBeLessThan(toScreen(up, 0, 1).py);
    expect(toScreen(up, 0.5, 1).px).toBeLessThan(toScreen(up, -0.5, 1).px);
  });

  it('colours the ends of the ramp with its end stops', () => {
    expect(rampColour(0).map(Math.round)).toEqual([0x26, 0x38, 0x45]);
    expect(rampColour(1).map(Math.round)).toEqual([0xc8, 0x64, 0x3b]);
    expect(rampColour(2).map(Math.round)).toEqual([0xc8, 0x64, 0x3b]);
  });
});
