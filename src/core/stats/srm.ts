import { chiSquareUpper } from './distributions.js';
import { SRM_ALARM_P } from './choices.js';
import { fail, ok, type StatsResult } from './result.js';

/**
 * Sample ratio mismatch: a chi-square goodness-of-fit test of the units seen in each arm against
 * the planned weights (what R's chisq.test(x, p = weights / sum(weights)) computes).
 */

export { SRM_ALARM_P } from './choices.js';

/**
 * The largest count of units taken: Number.MAX_SAFE_INTEGER (2^53 - 1), the last whole number a double
 * holds exactly. A count past it has already been rounded, and the sums below would be too.
 */
export const MAX_UNIT_COUNT = Number.MAX_SAFE_INTEGER;

/** A count of units: a whole number from 0 to MAX_UNIT_COUNT. */
export function isUnitCount(n: number): boolean {
  return Number.isInteger(n) && n >= 0 && n <= MAX_UNIT_COUNT;
}

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
  if (!observed.every(isUnitCount)) return fail('observed', `observed counts must be whole numbers from 0 to ${MAX_UNIT_COUNT}`);
  if (weights.some((w) => !(w > 0) || !Number.isFinite(w))) return fail('weights', 'planned weights must be finite and above 0');
  const total = observed.reduce((a, b) => a + b, 0);
  if (total === 0) return fail('observed', 'no units observed yet');
  if (!(threshold > 0 && threshold < 1)) return fail('threshold', 'the alarm threshold must be a p-value strictly between 0 and 1');
  // Scaled by the largest weight first, so that weights near the largest double still sum to a finite number.
  const largest = Math.max(...weights);
  const shares = weights.map((w) => w / largest);
  const shareSum = shares.reduce((a, b) => a + b, 0);
  const expected = shares.map((s) => (total * s) / shareSum);
  const statistic = observed.reduce((sum, o, i) => sum + (o - expected[i]!) ** 2 / expected[i]!, 0);
  // Only weights billions of times apart leave an arm expecting next to no units, and the statistic past any double.
  if (!Number.isFinite(statistic) || expected.some((e) => !(e > 0))) return fail('weights', 'the planned weights are too far apart: an arm expects next to no units, and the test cannot be computed');
  const degreesOfFreedom = observed.length - 1;
  const pValue = chiSquareUpper(statistic, degreesOfFreedom);
  if (!Number.isFinite(pValue)) return fail('observed', 'the chi-square p-value cannot be computed for these counts');
  return ok({ statistic, degreesOfFreedom, pValue, expected, mismatch: pValue < threshold });
}
