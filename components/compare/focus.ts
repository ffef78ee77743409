import type { StumbleEvent } from '../../engine/metrics/trial-metrics';

/** What the cursor points at on Compare, and so which table rows (and which entries' cells in them) light up. */
export interface CompareFocus {
  /** Metric row keys (METRIC_ROWS keys, or `course.<name>` for a course's own score); the first is the one pointed at. */
  rows: string[];
  /** Per row key, the picks whose cell in that row is the one under the cursor at that instant. */
  cells: Record<string, string[]>;
  /** Where the cursor is: a course and either a distance along it (a plot) or a time (the shared walk). */
  at: { course: string; distance?: number; time?: number };
}

export type PlotQuantity = 'bodyHeight' | 'footError';

/** The table rows that summarise each plotted series. */
export const ROWS_OF_QUANTITY: Record<PlotQuantity, string[]> = {
  footError: ['trackingRms'],
  bodyHeight: ['bodyOvershoot', 'bodySettle'],
};

export const courseRowKey = (course: string) => `course.${course}`;

/** A point in the overlaid plot: the plotted quantity's rows and the course's own score, the nearest line's cells. */
export function focusFromPlot(quantity: PlotQuantity, course: string, distance: number, nearestPick: string | null): CompareFocus {
  const rows = [...ROWS_OF_QUANTITY[quantity], courseRowKey(course)];
  const cells: Record<string, string[]> = {};
  for (const r of rows) cells[r] = nearestPick ? [nearestPick] : [];
  return { rows, cells, at: { course, distance } };
}

/** How close in time a stumble must be to the playhead to count as "at that instant" (two frames at 30 Hz either side would flicker). */
export const STUMBLE_WINDOW_S = 0.25;

/**
 * An instant of the shared walk: the course's own score row for every entry, and each stumble kind that one of the
 * walks has within STUMBLE_WINDOW_S of the playhead, with the cells of the entries stumbling then.
 */
export function focusFromWalk(course: string, time: number, walks: readonly { pick: string; events: readonly StumbleEvent[]; duration: number }[]): CompareFocus {
  const courseRow = courseRowKey(course);
  const rows = [courseRow];
  const cells: Record<string, string[]> = { [courseRow]: walks.map((w) => w.pick) };
  for (const w of walks) {
    const t = Math.min(time, w.duration);
    for (const e of w.events) {
      if (Math.abs(e.time - t) > STUMBLE_WINDOW_S) continue;
      const key = `stumbles.${e.kind}`;
      if (!cells[key]) {
        cells[key] = [];
        rows.push(key);
      }
      if (!cells[key].includes(w.pick)) cells[key].push(w.pick);
    }
  }
  return { rows, cells, at: { course, time } };
}

/** Index of the sample nearest to `x` in an ascending array (binary search; the plots are downsampled but still long). */
export function nearestIndex(xs: readonly number[], x: number): number {
  if (!xs.length) return -1;
  let lo = 0;
  let hi = xs.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= x) lo = mid;
    else hi = mid;
  }
  return Math.abs(xs[hi] - x) < Math.abs(xs[lo] - x) ? hi : lo;
}
