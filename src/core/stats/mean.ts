import { noncentralTUpper, normalCdf, normalQuantile, studentQuantile } from './distributions.js';
import { checkSettings, criticalZ, upperQuantileLevel, type TestSettings } from './inputs.js';
import { solveIncreasing } from './root.js';
import { fail, finite, ok, type StatsResult } from './result.js';

/**
 * Difference of two means with a common standard deviation. `exact` is the noncentral-t
 * calculation of R's stats::power.t.test (two-sample, strict = FALSE: the far tail is ignored);
 * `normal` is the large-sample approximation. With unequal arms (n2 = ratio * n1) the degrees of
 * freedom are n1 + n2 - 2 and the noncentrality is delta / (sd * sqrt(1/n1 + 1/n2)).
 */

export type MeanMethod = 'exact' | 'normal';

export interface MeanTest extends TestSettings {
  /** Difference to detect, in the metric's units. */
  delta: number;
  /** Standard deviation per unit. */
  sd: number;
  method: MeanMethod;
}

/**
 * Smallest control arm searched. R's power.t.test starts its search at 2 per arm but extends it
 * below 2 when even 2 is more than enough, so the solution may imply less than two degrees of
 * freedom; we follow it down to 0.01 degrees of freedom. Sizing rounds every arm up to at least 2.
 */
export function minimumControlUnits(ratio: number): number {
  return 2.01 / (1 + ratio);
}

function checkMoments(delta: number, sd: number): StatsResult<never> | undefined {
  if (!(sd > 0 && Number.isFinite(sd))) return fail('baseline.sd', `the standard deviation must be above 0; got ${sd}`);
  if (!Number.isFinite(delta) || delta === 0) return fail('effect', 'the effect is zero: there is nothing to detect');
  return undefined;
}

function powerUnchecked(test: MeanTest, n1: number): number {
  const n2 = test.ratio * n1;
  const standardError = test.sd * Math.sqrt(1 / n1 + 1 / n2);
  const shift = Math.abs(test.delta) / standardError;
  const level = upperQuantileLevel(test);
  if (test.method === 'normal') return normalCdf(shift - criticalZ(test));
  const df = n1 + n2 - 2;
  return noncentralTUpper(studentQuantile(level, df), df, shift);
}

export function meanPower(test: MeanTest, n1: number): StatsResult<number> {
  const problem = checkSettings(test) ?? checkMoments(test.delta, test.sd);
  if (problem) return problem;
  if (!(n1 >= minimumControlUnits(test.ratio))) return fail('n', `at least ${minimumControlUnits(test.ratio)} control units are needed for a t test; got ${n1}`);
  return finite(powerUnchecked(test, n1), 'n', 'power');
}

/** Control-arm units for `power`. The normal method is closed-form; the exact one starts from it. */
export function meanSampleSize(test: MeanTest, power: number): StatsResult<number> {
  const problem = checkSettings(test, power) ?? checkMoments(test.delta, test.sd);
  if (problem) return problem;
  const z = criticalZ(test) + normalQuantile(power);
  const normal = ((test.sd * z) / test.delta) ** 2 * (1 + 1 / test.ratio);
  if (test.method === 'normal') return finite(normal, 'effect', 'the sample size');
  const min = minimumControlUnits(test.ratio);
  if (powerUnchecked(test, min) >= power) return ok(min);
  const n1 = solveIncreasing((n) => powerUnchecked(test, n), power, Math.max(normal, min), min, 1e12, 1e-12);
  return n1 === undefined ? fail('effect', 'the sample size cannot be computed for these inputs') : ok(n1);
}

/** The smallest |delta| detectable with `power` at n1 control units. */
export function meanDetectable(settings: TestSettings & { sd: number; method: MeanMethod }, n1: number, power: number): StatsResult<number> {
  const problem = checkSettings(settings, power) ?? checkMoments(1, settings.sd);
  if (problem) return problem;
  if (!(n1 >= minimumControlUnits(settings.ratio))) return fail('n', `at least ${minimumControlUnits(settings.ratio)} control units are needed; got ${n1}`);
  const z = criticalZ(settings) + normalQuantile(power);
  const guess = settings.sd * z * Math.sqrt(1 / n1 + 1 / (settings.ratio * n1));
  if (settings.method === 'normal') return finite(guess, 'n', 'the detectable effect');
  const delta = solveIncreasing((d) => powerUnchecked({ ...settings, delta: d }, n1), power, guess, 1e-300, 1e300, 1e-12);
  return delta === undefined ? fail('n', 'the detectable effect cannot be computed for these inputs') : ok(delta);
}
