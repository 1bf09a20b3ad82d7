import { normalUpperQuantile } from './distributions.js';
import { fail, type StatsResult } from './result.js';

/** What every two-sample calculation shares. `ratio` is treatment units per control unit (1 = equal arms). */
export interface TestSettings {
  alpha: number;
  sides: 1 | 2;
  ratio: number;
}

/** Checks the shared inputs; returns the first problem, or undefined when they are usable. */
export function checkSettings(settings: TestSettings, power?: number): StatsResult<never> | undefined {
  if (!(settings.alpha > 0 && settings.alpha < 1)) return fail('alpha', `the significance level must be strictly between 0 and 1; got ${settings.alpha}`);
  if (settings.sides !== 1 && settings.sides !== 2) return fail('sides', 'a test is one-sided (1) or two-sided (2)');
  if (!(settings.ratio > 0 && Number.isFinite(settings.ratio))) return fail('ratio', `the allocation ratio must be above 0; got ${settings.ratio}`);
  if (power !== undefined) {
    if (!(power > 0 && power < 1)) return fail('power', `power must be strictly between 0 and 1; got ${power}`);
    if (power <= settings.alpha) return fail('power', `power (${power}) must exceed the significance level (${settings.alpha}): a test cannot be likelier to detect an effect than to raise a false alarm`);
  }
  return undefined;
}

/** The critical value: z (or t) quantile at 1 - alpha / sides. */
export function upperQuantileLevel(settings: TestSettings): number {
  return 1 - settings.alpha / settings.sides;
}

/** The normal critical value z with P(Z > z) = alpha / sides, from the tail itself. */
export function criticalZ(settings: TestSettings): number {
  return normalUpperQuantile(settings.alpha / settings.sides);
}
