import { fail, ok, type StatsResult } from './result.js';

/**
 * How many different eligible units a test can have seen by day d.
 *
 * With a single daily figure, that figure is read as *new* eligible units each day (units never
 * seen before), so the count grows linearly: U(d) = daily × d. Most products see the same people
 * again, and a daily-active figure read that way overstates the sample: weekly shoppers at 9,000
 * a day are not 252,000 different people after 28 days.
 *
 * With different units counted over two spans (d1, U1) and (d2, U2), e.g. the first 7 days and
 * the first 28, the count is interpolated by the power law through both points,
 *   U(d) = U1 × (d / d1)^b,  b = ln(U2 / U1) / ln(d2 / d1),
 * which passes through the origin, is exact at both points, grows more slowly than linearly when
 * people return (0 < b < 1; b = 1 is all-new traffic) and extends past d2 with the same exponent.
 * The power law is a convention for the shape between and beyond the points (common practice for
 * reach curves, no source); the two figures themselves are what matters, so give the second at
 * the planned window's length.
 */
export interface TrafficCurve {
  /** Different eligible units seen by the end of day `day` (fractional days allowed). */
  unitsBy(day: number): number;
  /** The first whole day by which `units` different units have been seen; undefined when never. */
  dayFor(units: number): number | undefined;
  /** How the curve was given, for the report. */
  source: { kind: 'daily'; perDay: number } | { kind: 'unique'; points: { days: number; units: number }[]; exponent: number };
}

/** Past this many days a test is not a test; dayFor answers undefined beyond it. */
const LAST_DAY = 36_500;

export function dailyCurve(perDay: number): StatsResult<TrafficCurve> {
  if (!(perDay > 0 && Number.isFinite(perDay))) return fail('daily-units', 'zero traffic: no test can reach its sample');
  return ok({
    unitsBy: (day) => perDay * day,
    dayFor: (units) => {
      const day = Math.max(1, Math.ceil(units / perDay - 1e-9));
      return Number.isFinite(day) && day <= LAST_DAY ? day : undefined;
    },
    source: { kind: 'daily', perDay },
  });
}

export function uniqueUnitsCurve(points: readonly { days: number; units: number }[]): StatsResult<TrafficCurve> {
  if (points.length !== 2) return fail('unique-units', 'exactly two points are needed, e.g. the first 7 days and 28 days');
  const [first, second] = [...points].sort((a, b) => a.days - b.days) as [{ days: number; units: number }, { days: number; units: number }];
  if (!(first.days > 0 && first.units > 0)) return fail('unique-units', 'days and units must be above 0');
  if (first.days === second.days) return fail('unique-units', `the two points must count different spans; both are ${first.days} days`);
  if (second.units < first.units) {
    return fail('unique-units', `${second.units} different units over ${second.days} days is fewer than the ${first.units} over the first ${first.days}; a longer span sees at least as many`);
  }
  const exponent = Math.log(second.units / first.units) / Math.log(second.days / first.days);
  if (exponent > 1 + 1e-12) {
    return fail('unique-units', `${second.units} over ${second.days} days grows faster than the first ${first.days} days' rate; if every unit is new, give daily-units instead`);
  }
  const unitsBy = (day: number) => (day <= 0 ? 0 : first.units * (day / first.days) ** exponent);
  return ok({
    unitsBy,
    dayFor: (units) => {
      if (exponent <= 0) return units <= first.units ? first.days : undefined;
      const exact = first.days * (units / first.units) ** (1 / exponent);
      if (!Number.isFinite(exact) || exact > LAST_DAY) return undefined;
      // The closed form, then a whole-day check against the curve itself (rounding can cost a day).
      let day = Math.max(1, Math.ceil(exact - 1e-9));
      while (day > 1 && unitsBy(day - 1) >= units) day--;
      while (unitsBy(day) < units * (1 - 1e-12)) day++;
      return day;
    },
    source: { kind: 'unique', points: [first, second], exponent },
  });
}

/**
 * A number of units for a sentence: whole numbers with separators from 100 up, three significant
 * digits below, so small traffic reads as it was given ("0.01", "2.5") instead of rounding to 0.
 */
export function unitsAmount(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  if (Math.abs(n) >= 100) return Math.round(n).toLocaleString('en-US');
  return Number(n.toPrecision(3)).toLocaleString('en-US', { maximumFractionDigits: 8 });
}
