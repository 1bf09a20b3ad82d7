import type { MetricTotals, PrePeriodTotals } from '../totals/schema.js';

/**
 * One arm's estimate of a metric from its sufficient statistics: the value, the variance of that
 * value (unpooled: each arm its own), and the degrees of freedom when a t distribution applies.
 *
 * - proportion: p = x / n, Var = p(1 − p) / n (the normal approximation);
 * - mean: ȳ = Σy / n, Var = s² / n with the sample variance s² (Welch's t takes it from here);
 * - ratio: R = Σy / Σx over units, Var by the delta method (Deng et al. 2018, section 3):
 *   (s²_y − 2R s_xy + R² s²_x) / (n x̄²);
 * - CUPED (Deng, Xu, Kohavi & Walker 2013): y − θ(pre − mean pre of all arms) with one θ estimated
 *   on the pooled data of every arm, so each arm is shifted by the same rule.
 */
export interface ArmEstimate {
  n: number;
  value: number;
  variance: number;
  /** Degrees of freedom of the variance estimate (n − 1) when a t distribution applies (means). */
  df?: number;
}

export type EstimateResult = { ok: true; estimate: ArmEstimate } | { ok: false; reason: string };

function sampleVariance(n: number, sum: number, sumSquares: number): number {
  return Math.max(0, (sumSquares - (sum * sum) / n) / (n - 1));
}

function sampleCovariance(n: number, sumA: number, sumB: number, sumProducts: number): number {
  return (sumProducts - (sumA * sumB) / n) / (n - 1);
}

export function estimateArm(totals: MetricTotals, cuped?: CupedAdjustment): EstimateResult {
  if (totals.n < 2) return { ok: false, reason: `only ${totals.n} units: at least 2 per arm are needed` };
  const n = totals.n;
  if (totals.kind === 'ratio') {
    const x = totals.denominator;
    const y = totals.numerator;
    if (!(x.sum > 0)) return { ok: false, reason: 'the denominator sums to 0: the ratio is undefined' };
    const ratio = y.sum / x.sum;
    const meanX = x.sum / n;
    const variance =
      (sampleVariance(n, y.sum, y.sumSquares) - 2 * ratio * sampleCovariance(n, x.sum, y.sum, totals.sumProducts) + ratio * ratio * sampleVariance(n, x.sum, x.sumSquares)) /
      (n * meanX * meanX);
    return { ok: true, estimate: { n, value: ratio, variance: Math.max(0, variance) } };
  }
  const mean = totals.sum / n;
  const df = totals.kind === 'mean' ? { df: n - 1 } : {};
  if (cuped && totals.pre) {
    const pre = totals.pre;
    const theta = cuped.theta;
    const adjusted = mean - theta * (pre.sum / n - cuped.pooledPreMean);
    const variance =
      sampleVariance(n, totals.sum, totals.sumSquares) - 2 * theta * sampleCovariance(n, totals.sum, pre.sum, pre.sumProducts) + theta * theta * sampleVariance(n, pre.sum, pre.sumSquares);
    return { ok: true, estimate: { n, value: adjusted, variance: Math.max(0, variance) / n, ...df } };
  }
  const variance = totals.kind === 'proportion' ? (mean * (1 - mean)) / n : sampleVariance(n, totals.sum, totals.sumSquares) / n;
  return { ok: true, estimate: { n, value: mean, variance, ...df } };
}

export interface CupedAdjustment {
  theta: number;
  pooledPreMean: number;
  /** Share of the variance the covariate removes on the pooled data: the squared correlation. */
  varianceReduction: number;
}

/** θ = Cov(y, pre) / Var(pre) on every arm's data pooled; undefined when the pre-period does not vary. */
export function cupedAdjustment(arms: readonly { n: number; sum: number; sumSquares: number; pre?: PrePeriodTotals }[]): CupedAdjustment | undefined {
  if (arms.some((a) => !a.pre)) return undefined;
  const n = arms.reduce((s, a) => s + a.n, 0);
  const sumY = arms.reduce((s, a) => s + a.sum, 0);
  const sumYY = arms.reduce((s, a) => s + a.sumSquares, 0);
  const sumP = arms.reduce((s, a) => s + a.pre!.sum, 0);
  const sumPP = arms.reduce((s, a) => s + a.pre!.sumSquares, 0);
  const sumYP = arms.reduce((s, a) => s + a.pre!.sumProducts, 0);
  if (n < 3) return undefined;
  const varP = sampleVariance(n, sumP, sumPP);
  const varY = sampleVariance(n, sumY, sumYY);
  if (!(varP > 0) || !(varY > 0)) return undefined;
  const cov = sampleCovariance(n, sumY, sumP, sumYP);
  const theta = cov / varP;
  return { theta, pooledPreMean: sumP / n, varianceReduction: Math.min(1, (cov * cov) / (varP * varY)) };
}
