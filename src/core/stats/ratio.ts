import { fail, ok, type StatsResult } from './result.js';

/**
 * A ratio metric (e.g. clicks per session when users are randomized) summed per unit: X / Y with
 * per-unit numerator X and denominator Y. Its variance comes from the delta method (first-order
 * Taylor expansion; e.g. Deng, Knoblich & Lu 2018, "Applying the Delta Method in Metric Analytics"):
 *   Var(X/Y) ~ (sx^2 - 2 r rho sx sy + r^2 sy^2) / my^2,  with r = mx / my.
 * The result is a per-unit standard deviation, so the ratio is then sized like a mean.
 */
export interface RatioBaseline {
  numerator: { mean: number; sd: number };
  denominator: { mean: number; sd: number };
  /** Correlation of numerator and denominator per unit. */
  correlation: number;
}

export function ratioMoments(baseline: RatioBaseline): StatsResult<{ ratio: number; sd: number }> {
  const { numerator: x, denominator: y, correlation: rho } = baseline;
  if (!(y.mean > 0)) return fail('baseline.denominator.mean', `the denominator's mean must be above 0; got ${y.mean}`);
  if (!(x.sd >= 0 && y.sd >= 0)) return fail('baseline', 'standard deviations cannot be negative');
  if (!(rho >= -1 && rho <= 1)) return fail('baseline.correlation', `a correlation lies between -1 and 1; got ${rho}`);
  const ratio = x.mean / y.mean;
  const variance = (x.sd ** 2 - 2 * ratio * rho * x.sd * y.sd + ratio ** 2 * y.sd ** 2) / y.mean ** 2;
  if (!(variance > 0)) {
    return fail('baseline', 'these moments give the ratio no variance (numerator and denominator move in perfect step); check sd and correlation');
  }
  return ok({ ratio, sd: Math.sqrt(variance) });
}
