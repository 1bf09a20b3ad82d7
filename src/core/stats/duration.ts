/**
 * Calendar time a test needs: days = ceil(units needed / units enrolled per day), and whole weeks,
 * since behaviour cycles by day of week and a test should see each weekday equally often
 * (common practice, no source). `daily-units` is read as *new* eligible units per day; returning
 * units do not add to the sample.
 */
export interface Duration {
  days: number;
  weeks: number;
}

export function durationFor(unitsNeeded: number, unitsPerDay: number): Duration | undefined {
  if (!(unitsPerDay > 0) || !Number.isFinite(unitsNeeded) || !Number.isFinite(unitsPerDay)) return undefined;
  const days = Math.max(1, Math.ceil(unitsNeeded / unitsPerDay - 1e-9));
  return { days, weeks: Math.ceil(days / 7) };
}
