/**
 * A moment in the reader's own locale (the browser's), with the month in words so "3/4" never has to be
 * guessed: "1 Dec 2026, 23:25" for en-GB, "Dec 1, 2026, 11:25 PM" for en-US.
 */
export function formatLocalMoment(ms: number, locale?: string): string {
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(ms));
}
