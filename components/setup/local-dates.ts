/**
 * A moment in the reader's own locale (the browser's), with the month in words so "3/4" never has to be
 * guessed: "1 Dec 2026, 23:25" for en-GB, "Dec 1, 2026, 11:25 PM" for en-US.
 */
export function formatLocalMoment(ms: number, locale?: string): string {
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(ms));
}

/** A day in the reader's own locale, month in words: "1 Dec 2026" (en-GB), "Dec 1, 2026" (en-US). */
export function formatLocalDay(ms: number, locale?: string): string {
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium' }).format(new Date(ms));
}
