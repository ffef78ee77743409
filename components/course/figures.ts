import type { CourseSummary } from '../../schemas/courses';

/** One line of a course's figures: "8.29 m long · 1.60 m wide · 2 cm cells · 0.89 m relief · version 3". */
export function courseFigures(c: Pick<CourseSummary, 'length' | 'width' | 'cellSize' | 'minHeight' | 'maxHeight' | 'version'>): string {
  const cell = c.cellSize < 0.1 ? `${Math.round(c.cellSize * 1000) / 10} cm` : `${c.cellSize} m`;
  return `${c.length.toFixed(2)} m long · ${c.width.toFixed(2)} m wide · ${cell} cells · ${(c.maxHeight - c.minHeight).toFixed(2)} m relief · version ${c.version}`;
}
