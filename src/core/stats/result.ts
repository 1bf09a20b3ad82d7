/**
 * Statistics never throw and never return NaN or Infinity: an impossible request comes back as
 * an error value naming the input that makes it impossible.
 */
export interface StatsError {
  /** The input at fault, e.g. `baseline.rate` or `power`. */
  input: string;
  message: string;
}

export type StatsResult<T> = { ok: true; value: T } | { ok: false; error: StatsError };

export const ok = <T>(value: T): StatsResult<T> => ({ ok: true, value });
export const fail = <T>(input: string, message: string): StatsResult<T> => ({ ok: false, error: { input, message } });

/** Guards a computed number before it can reach a report. */
export function finite(value: number, input: string, what: string): StatsResult<number> {
  return Number.isFinite(value) ? ok(value) : fail(input, `${what} cannot be computed for these inputs`);
}
