/**
 * Unsaved course edits kept while Treadle stays open, so leaving the editor (a tab, the side rail, Back) and
 * coming back finds the sculpting, the name and the walk path as they were, with their undo history. Kept per
 * course and only for the version they were made on: once someone saves a newer one, the course opens as saved.
 */
import type { Heightfield } from '../../engine/course/heightfield';
import type { WalkPath } from '../../engine/course/walk-path';
import type { SculptHistory } from './history';

export interface UnsavedCourse {
  baseVersion: number;
  hf: Heightfield;
  history: SculptHistory;
  savedPosition: number;
  savedName: string;
  name: string;
  walkPath: WalkPath | undefined;
  savedPath: string;
}

const kept = new Map<number, UnsavedCourse>();

/** The edits left unsaved on this course at `version`, if any (a newer saved version drops them). */
export function unsavedCourse(courseId: number, version: number): UnsavedCourse | undefined {
  const edits = kept.get(courseId);
  if (edits && edits.baseVersion !== version) kept.delete(courseId);
  return edits?.baseVersion === version ? edits : undefined;
}

/** Keeps the editor's unsaved edits of a course, or forgets them (`undefined`) once there is nothing to save. */
export function keepUnsavedCourse(courseId: number, edits: UnsavedCourse | undefined): void {
  if (edits) kept.set(courseId, edits);
  else kept.delete(courseId);
}
