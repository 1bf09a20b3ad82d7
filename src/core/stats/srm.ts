import { chiSquareUpper } from './distributions.js';
import { SRM_ALARM_P } from './choices.js';
import { fail, ok, type StatsResult } from './result.js';

/**
 * Sample ratio mismatch: a chi-square goodness-of-fit test of the units seen in each arm against
 * the planned weights (what R's chisq.test(x, p = weights / sum(weights)) computes).
 */

export { SRM_ALARM_P } from './choices.js';

export interface SampleRatioCheck {
  statistic: number;
  degreesOfFreedom: number;
  pValue: number;
  expected: number[];
  /** True when pValue < the threshold. */
  mismatch: boolean;
}

export function sampleRatioMismatch(observed: readonly number[], weights: readonly number[], threshold = SRM_ALARM_P): StatsResult<SampleRatioCheck> {
  if (observed.length !== weights.length) return fail('arms', `${observed.length} observed counts for ${weights.length} planned arms`);
  if (observed.length < 2) return fail('arms', 'a ratio needs at least two arms');
  if (observed.some((n) => !(n >= 0) || !Number.isFinite(n))) return fail('observed', 'observed counts must be finite and not negative');
  if (weights.some((w) => !(w > 0) || !Number.isFinite(w))) return fail('weights', 'planned weights must be above 0');
  const total = observed.reduce((a, b) => a + b, 0);
  if (total === 0) return fail('observed', 'no units observed yet');
  const weightSum = weights.reduce((a, b) => a + b, 0);
  const expected = weights.map((w) => (total * w) / weightSum);
  const statistic = observed.reduce((sum, o, i) => sum + (o - expected[i]!) ** 2 / expected[i]!, 0);
  const degreesOfFreedom = observed.length - 1;
  const pValue = chiSquareUpper(statistic, degreesOfFreedom);
  return ok({ statistic, degreesOfFreedom, pValue, expected, mismatch: pValue < threshold });
}
