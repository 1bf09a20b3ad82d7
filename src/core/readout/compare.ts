import { normalQuantile, normalUpper, studentQuantile, studentUpper } from '../stats/distributions.js';
import type { Direction } from '../plan/schema.js';
import type { ArmEstimate } from './estimate.js';

/**
 * Treatment against control: the absolute difference with its interval, the relative difference
 * with its interval by the delta method, and the p-value, as the plan registered the test.
 *
 * Variances are unpooled. Means use Welch's t with the Welch–Satterthwaite degrees of freedom
 * (R's t.test(var.equal = FALSE)), which is the normal approximation once arms are large;
 * proportions and ratios use the normal approximation. The relative difference Δ/μc has
 * Var ≈ Var(μt)/μc² + μt² Var(μc)/μc⁴ (Deng, Knoblich & Lu 2018, "Applying the Delta Method in
 * Metric Analytics", section 3.3), with independent arms.
 */
export interface ComparisonSettings {
  /** Significance level of this comparison (after any Bonferroni split across arms). */
  alpha: number;
  sides: 1 | 2;
  /** The desired direction: a one-sided test looks only that way. */
  direction: Direction;
  /** A sequential boundary on the z scale, replacing the fixed critical value. */
  boundaryZ?: number;
}

export interface Interval {
  low: number;
  high: number;
}

export interface Comparison {
  control: ArmEstimate;
  treatment: ArmEstimate;
  difference: number;
  standardError: number;
  interval: Interval;
  /** Absent when the control's value is 0, where a relative change means nothing. */
  relative?: { value: number; standardError: number; interval: Interval };
  /** z, or Welch's t when `df` is present. */
  statistic: number;
  df?: number;
  pValue: number;
  /** The critical value the interval uses. */
  critical: number;
  /** Coverage of the two-sided interval: 1 − α for a two-sided test, 1 − 2α for a one-sided one. */
  confidence: number;
}

export type ComparisonResult = { ok: true; comparison: Comparison } | { ok: false; reason: string };

/** Degrees of freedom large enough that t and normal agree to every printed digit. */
const NORMAL_DF = 1e7;

export function welchDf(control: ArmEstimate, treatment: ArmEstimate): number | undefined {
  if (control.df === undefined || treatment.df === undefined) return undefined;
  const vc = control.variance;
  const vt = treatment.variance;
  const denominator = (vc * vc) / control.df + (vt * vt) / treatment.df;
  if (!(denominator > 0)) return undefined;
  return Math.min(NORMAL_DF, ((vc + vt) * (vc + vt)) / denominator);
}

export function compareArms(control: ArmEstimate, treatment: ArmEstimate, settings: ComparisonSettings): ComparisonResult {
  const difference = treatment.value - control.value;
  const standardError = Math.sqrt(control.variance + treatment.variance);
  if (!(standardError > 0) || !Number.isFinite(standardError)) return { ok: false, reason: 'no variation in either arm, so there is no interval to compute' };
  const df = settings.boundaryZ === undefined ? welchDf(control, treatment) : undefined;
  const level = 1 - settings.alpha / settings.sides;
  const critical = settings.boundaryZ ?? (df !== undefined ? studentQuantile(level, df) : normalQuantile(level));
  const statistic = difference / standardError;
  const upper = (x: number) => (df !== undefined ? studentUpper(x, df) : normalUpper(x));
  const pValue = settings.sides === 2 ? Math.min(1, 2 * upper(Math.abs(statistic))) : upper(settings.direction === 'increase' ? statistic : -statistic);
  const comparison: Comparison = {
    control,
    treatment,
    difference,
    standardError,
    interval: { low: difference - critical * standardError, high: difference + critical * standardError },
    statistic,
    ...(df !== undefined ? { df } : {}),
    pValue,
    critical,
    confidence: 1 - (2 * settings.alpha) / settings.sides,
  };
  if (control.value !== 0) {
    const mc = control.value;
    const relativeSe = Math.sqrt(treatment.variance / (mc * mc) + (treatment.value * treatment.value * control.variance) / mc ** 4);
    const z = settings.boundaryZ ?? normalQuantile(level);
    const value = difference / Math.abs(mc);
    if (Number.isFinite(relativeSe) && Number.isFinite(value)) {
      comparison.relative = { value, standardError: relativeSe, interval: { low: value - z * relativeSe, high: value + z * relativeSe } };
    }
  }
  return { ok: true, comparison };
}
