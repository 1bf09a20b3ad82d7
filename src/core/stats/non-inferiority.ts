import { normalCdf, normalQuantile, normalUpperQuantile } from './distributions.js';
import { fail, finite, type StatsResult } from './result.js';

/**
 * Non-inferiority of a proportion: show that the treatment is not worse than the control by more
 * than a margin delta (a guardrail's tolerance), one-sided at level alpha, sized for no true
 * difference (p2 = p1 = p). The Wald test of H0: harm >= delta against H1: harm < delta has
 *   power(n1) = Phi(delta / sqrt(p(1 - p)(1/n1 + 1/n2)) - z_alpha),  n2 = ratio * n1,
 *   n1 = (z_alpha + z_beta)^2 p(1 - p)(1 + 1/ratio) / delta^2,
 * the standard formula of Chow, Shao & Wang, "Sample Size Calculations in Clinical Research"
 * (2nd ed., 2008), sec. 4.2, with the true difference 0 (from memory). Means need nothing new: a
 * non-inferiority t test at margin delta has exactly the power of a one-sided t test for an
 * effect of delta (the same book, sec. 3.2), which mean.ts computes as R's power.t.test does.
 */
export interface NonInferiorityProportion {
  p: number;
  alpha: number;
  ratio: number;
}

function check(test: NonInferiorityProportion): StatsResult<never> | undefined {
  if (!(test.p > 0 && test.p < 1)) return fail('baseline.rate', `a baseline rate must be strictly between 0 and 1; got ${test.p}`);
  if (!(test.alpha > 0 && test.alpha < 1)) return fail('alpha', `the significance level must be strictly between 0 and 1; got ${test.alpha}`);
  if (!(test.ratio > 0)) return fail('ratio', `the allocation ratio must be above 0; got ${test.ratio}`);
  return undefined;
}

const spread = (test: NonInferiorityProportion) => Math.sqrt(test.p * (1 - test.p) * (1 + 1 / test.ratio));

export function nonInferiorityProportionSize(test: NonInferiorityProportion, margin: number, power: number): StatsResult<number> {
  const problem = check(test);
  if (problem) return problem;
  if (!(margin > 0)) return fail('tolerance', 'the tolerance must be above 0');
  if (!(power > test.alpha && power < 1)) return fail('power', `power must be between the significance level and 1; got ${power}`);
  const z = normalUpperQuantile(test.alpha) + normalQuantile(power);
  return finite(((z * spread(test)) / margin) ** 2, 'tolerance', 'the sample size');
}

export function nonInferiorityProportionPower(test: NonInferiorityProportion, margin: number, n1: number): StatsResult<number> {
  const problem = check(test);
  if (problem) return problem;
  if (!(n1 > 0)) return fail('n', `the sample size must be above 0; got ${n1}`);
  return finite(normalCdf((Math.sqrt(n1) * margin) / spread(test) - normalUpperQuantile(test.alpha)), 'n', 'power');
}

/** The smallest margin that n1 control units rule out with `power` when there is no true difference. */
export function nonInferiorityProportionMargin(test: NonInferiorityProportion, n1: number, power: number): StatsResult<number> {
  const problem = check(test);
  if (problem) return problem;
  if (!(n1 > 0)) return fail('n', `the sample size must be above 0; got ${n1}`);
  const z = normalUpperQuantile(test.alpha) + normalQuantile(power);
  return finite((z * spread(test)) / Math.sqrt(n1), 'n', 'the detectable margin');
}
