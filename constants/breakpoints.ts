/** At this width and wider the shell trades the bottom tabs for a side rail. */
export const WIDE_MIN_WIDTH = 768;
/** Content stops growing past this width so lines stay readable. */
export const CONTENT_MAX_WIDTH = 1120;
