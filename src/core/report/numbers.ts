/**
 * Number formats for reports: counts with thousands separators, rates as percentages, relative
 * changes with a sign. Every formatter refuses NaN and Infinity, so neither can reach a report.
 */

const NOT_A_NUMBER = 'n/a';

/**
 * Counts beyond 10^15 are past the digits a double carries (and far past any real sample): they
 * keep three significant digits, "2.07 × 10^21", rather than 22 digits of which most are noise.
 */
export function formatCount(n: number): string {
  if (!Number.isFinite(n)) return NOT_A_NUMBER;
  if (Math.abs(n) >= 1e15) {
    const [mantissa, exponent] = n.toExponential(2).split('e');
    return `${mantissa} × 10^${Number(exponent)}`;
  }
  return Math.round(n).toLocaleString('en-US');
}

/** 0.1 -> "10.0%"; small rates keep two significant digits (0.0015 -> "0.15%"). */
export function formatRate(rate: number): string {
  if (!Number.isFinite(rate)) return NOT_A_NUMBER;
  const percent = rate * 100;
  const digits = Math.abs(percent) >= 10 ? 1 : Math.abs(percent) >= 1 ? 2 : Math.max(2, 1 - Math.floor(Math.log10(Math.abs(percent) || 1)));
  return `${percent.toFixed(Math.min(digits, 4))}%`;
}

/** A signed relative change: 0.03 -> "+3%", -0.0125 -> "-1.25%". */
export function formatRelative(change: number): string {
  if (!Number.isFinite(change)) return NOT_A_NUMBER;
  const percent = change * 100;
  const text = Number(percent.toPrecision(3)).toString();
  return `${percent >= 0 ? '+' : ''}${text}%`;
}

/** A metric value with four significant digits, without trailing zeros. */
export function formatValue(value: number): string {
  if (!Number.isFinite(value)) return NOT_A_NUMBER;
  if (value !== 0 && Math.abs(value) < 1e-3) return value.toExponential(2);
  return Number(value.toPrecision(4)).toLocaleString('en-US', { maximumFractionDigits: 6 });
}

/** Power as a percentage that never claims certainty: 0.99996 -> ">99.9%". */
export function formatPower(power: number): string {
  if (!Number.isFinite(power)) return NOT_A_NUMBER;
  if (power > 0.999) return '>99.9%';
  if (power < 0.001) return '<0.1%';
  return `${(power * 100).toFixed(1)}%`;
}

/** A multiplier: 1.0127 -> "×1.01". */
export function formatMultiplier(m: number): string {
  return Number.isFinite(m) ? `×${m >= 10 ? m.toFixed(1) : m.toFixed(2)}` : NOT_A_NUMBER;
}

/** A count with its noun, singular or plural: "1 week", "2,274 days", "1 draft". */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${formatCount(n)} ${Math.round(n) === 1 ? singular : plural}`;
}

/** A duration led by whole weeks: "3 weeks (18 days)", "1 week (7 days; why)". */
export function formatWeeks(duration: { days: number; weeks: number }, why?: string): string {
  return `${countOf(duration.weeks, 'week')} (${countOf(duration.days, 'day')}${why ? `; ${why}` : ''})`;
}
