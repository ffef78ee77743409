/**
 * Limits every course obeys, whether built in memory, sculpted or decoded.
 * Heights are bounded so a course always fits the 16-bit, 1 mm encoding.
 */
export const COURSE_LIMITS = {
  /** Lateral samples (across the walk). */
  minCols: 2,
  maxCols: 512,
  /** Samples along the walk. */
  minRows: 2,
  maxRows: 16384,
  /** Total samples: keeps a decoded course under ~32 MB of Float64. */
  maxCells: 4_194_304,
  /** Metres between neighbouring samples. */
  minCellSize: 0.005,
  maxCellSize: 1,
  /** |height| bound, metres: 2 × 32 m stays inside 65 535 quanta of 1 mm. */
  maxAbsHeight: 32,
  /** Height quantum of the encoding, metres. */
  quantum: 0.001,
} as const;
