/** Undo and redo over the changes strokes return; each entry has an id so "unsaved" survives undo past a save. */
import { redoChange, undoChange, type HeightChange } from '../../engine/course/brushes';
import type { Heightfield } from '../../engine/course/heightfield';

interface Entry {
  id: number;
  change: HeightChange;
}

export class SculptHistory {
  private done: Entry[] = [];
  private undone: Entry[] = [];
  private nextId = 1;

  push(change: HeightChange): void {
    this.done.push({ id: this.nextId++, change });
    this.undone = [];
  }

  undo(hf: Heightfield): boolean {
    const e = this.done.pop();
    if (!e) return false;
    undoChange(hf, e.change);
    this.undone.push(e);
    return true;
  }

  redo(hf: Heightfield): boolean {
    const e = this.undone.pop();
    if (!e) return false;
    redoChange(hf, e.change);
    this.done.push(e);
    return true;
  }

  get canUndo(): boolean {
    return this.done.length > 0;
  }

  get canRedo(): boolean {
    return this.undone.length > 0;
  }

  /** Identifies the heights as they stand: 0 for the loaded course, else the id of the last applied change. */
  get position(): number {
    return this.done.length ? this.done[this.done.length - 1].id : 0;
  }

  clear(): void {
    this.done = [];
    this.undone = [];
  }
}
