import { normalCdf, normalQuantile } from './distributions.js';
import { checkSettings, criticalZ, upperQuantileLevel, type TestSettings } from './inputs.js';
import { findRoot } from './root.js';
import { fail, finite, ok, type StatsResult } from './result.js';

/**
 * Two proportions, two-sample z test with the variance pooled under the null hypothesis, as R's
 * stats::power.prop.test computes it. Like R's default (strict = FALSE), a two-sided test's power
 * counts only rejections in the direction of the effect and ignores the far tail, which is
 * negligible at any power worth planning for.
 *
 * With equal arms these are R's formulas exactly. With unequal arms (n2 = ratio * n1) the pooled
 * rate is the size-weighted mean and each arm's variance is divided by its own size.
 */

export interface ProportionTest extends TestSettings {
  /** Control (baseline) rate. */
  p1: number;
  /** Treatment rate under the alternative. */
  p2: number;
}

function checkRates(p1: number, p2: number): StatsResult<never> | undefined {
  if (!(p1 > 0 && p1 < 1)) return fail('baseline.rate', `a baseline rate must be strictly between 0 and 1; got ${p1}`);
  if (!(p2 > 0 && p2 < 1)) return fail('effect', `the effect takes the rate from ${p1} to ${p2}, outside (0, 1)`);
  if (p1 === p2) return fail('effect', 'the effect is zero: there is nothing to detect');
  return undefined;
}

/** Standard errors of p2 - p1 per unit of control-arm size: sqrt(n1) * SE under H0 and under H1. */
function unitErrors(test: ProportionTest): { null0: number; alt1: number } {
  const { p1, p2, ratio } = test;
  const pooled = (p1 + ratio * p2) / (1 + ratio);
  return {
    null0: Math.sqrt(pooled * (1 - pooled) * (1 + 1 / ratio)),
    alt1: Math.sqrt(p1 * (1 - p1) + (p2 * (1 - p2)) / ratio),
  };
}

function powerUnchecked(test: ProportionTest, n1: number): number {
  const z = criticalZ(test);
  const { null0, alt1 } = unitErrors(test);
  return normalCdf((Math.sqrt(n1) * Math.abs(test.p2 - test.p1) - z * null0) / alt1);
}

/** Power with n1 control units (and ratio * n1 treatment units). */
export function proportionPower(test: ProportionTest, n1: number): StatsResult<number> {
  const problem = checkSettings(test) ?? checkRates(test.p1, test.p2);
  if (problem) return problem;
  if (!(n1 > 0)) return fail('n', `the sample size must be above 0; got ${n1}`);
  return finite(powerUnchecked(test, n1), 'n', 'power');
}

/** Control-arm units needed for `power`: the closed-form solution of the power equation above. */
export function proportionSampleSize(test: ProportionTest, power: number): StatsResult<number> {
  const problem = checkSettings(test, power) ?? checkRates(test.p1, test.p2);
  if (problem) return problem;
  const za = criticalZ(test);
  const zb = normalQuantile(power);
  const { null0, alt1 } = unitErrors(test);
  const n1 = ((za * null0 + zb * alt1) / (test.p2 - test.p1)) ** 2;
  return finite(n1, 'effect', 'the sample size');
}

/**
 * The treatment rate detectable with `power` at n1 control units, on the side of p1 given by
 * `direction` (R's power.prop.test solves the increasing side only).
 */
export function proportionDetectable(
  settings: TestSettings & { p1: number },
  n1: number,
  power: number,
  direction: 'increase' | 'decrease',
): StatsResult<number> {
  const problem = checkSettings(settings, power);
  if (problem) return problem;
  const { p1 } = settings;
  if (!(p1 > 0 && p1 < 1)) return fail('baseline.rate', `a baseline rate must be strictly between 0 and 1; got ${p1}`);
  if (!(n1 > 0)) return fail('n', `the sample size must be above 0; got ${n1}`);
  const edge = direction === 'increase' ? 1 - 1e-12 : 1e-12;
  const gap = (p2: number) => powerUnchecked({ ...settings, p2 }, n1) - power;
  if (gap(edge) < 0) {
    return fail('n', `even a rate of ${direction === 'increase' ? 1 : 0} would be detected with less than ${power} power at ${n1.toFixed(0)} units per arm`);
  }
  const near = direction === 'increase' ? p1 + 1e-12 : p1 - 1e-12;
  const p2 = findRoot(gap, near, edge, 1e-13);
  return p2 === undefined ? fail('n', 'no detectable rate found') : ok(p2);
}
