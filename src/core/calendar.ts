/** Calendar dates as YYYY-MM-DD strings, in UTC: no time of day, no time zone surprises. */

const DAY_MS = 86_400_000;

function toUtcMs(date: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return Date.UTC(y, m - 1, d);
}

export function addDays(date: string, days: number): string {
  return new Date(toUtcMs(date) + days * DAY_MS).toISOString().slice(0, 10);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return Math.round((toUtcMs(to) - toUtcMs(from)) / DAY_MS);
}

/** Days in a window when both the start and the end day are included. */
export function inclusiveDays(start: string, end: string): number {
  return daysBetween(start, end) + 1;
}
