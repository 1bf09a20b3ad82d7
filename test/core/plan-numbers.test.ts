import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import type { Problem } from '../../src/core/source/problem.js';
import { sizePlan } from '../../src/core/stats/plan-sizing.js';
import { firstNonFinite, finiteSizing } from '../../src/core/stats/finite-sizing.js';
import { cleanPlan, planYaml } from '../review/scenarios.js';

/** The extreme but well-typed numbers a fuzzer found putting null, NaN or ∞ into reports, each as a plan. */
const base = cleanPlan();
const design = (extra: Record<string, unknown>) => ({ design: { ...(base.design as object), ...extra } });
const primary = (metric: Record<string, unknown>) => ({ metrics: { primary: { name: 'm', events: ['order_done'], ...metric } } });

const errorsOf = (overrides: Record<string, unknown>): Problem[] => {
  const result = loadPlan(planYaml(cleanPlan(overrides)), 'experiments/x.yaml');
  return result.ok ? [] : result.errors;
};

describe('numbers outside the range where sizing is meaningful are validation errors at their field', () => {
  it.each([
    ['daily units 5e-324', design({ 'daily-units': 5e-324 }), ['design.daily-units']],
    ['daily units 1e308', design({ 'daily-units': 1e308 }), ['design.daily-units']],
    ['a mean of 1e308 with sd 1e308', primary({ kind: 'mean', baseline: { mean: 1e308, sd: 1e308 } }), ['metrics.primary.baseline.mean', 'metrics.primary.baseline.sd']],
    ['a mean of -1e308 with sd 1e308', primary({ kind: 'mean', baseline: { mean: -1e308, sd: 1e308 } }), ['metrics.primary.baseline.mean', 'metrics.primary.baseline.sd']],
    [
      'cluster mean size 1e308 with size CV 1e6',
      { unit: { randomization: 'household', analysis: 'user' }, ...design({ cluster: { 'mean-size': 1e308, icc: 0.05, 'size-cv': 1e6 } }) },
      ['design.cluster.mean-size', 'design.cluster.size-cv'],
    ],
    ['weights that round one arm to nothing', design({ arms: [{ name: 'control', weight: 1e6 }, { name: 'treatment', weight: 1 }] }), ['design.arms[1].weight']],
    ['a weight that overflows the sum', design({ arms: [{ name: 'control', weight: 1e308 }, { name: 'treatment', weight: 1e308 }] }), ['design.arms[0].weight', 'design.arms[1].weight']],
    ['a tiny relative effect', design({ 'min-detectable-effect': { relative: 1e-300 } }), ['design.min-detectable-effect.relative']],
    ['a huge absolute tolerance', { metrics: { ...(base.metrics as object), guardrails: [{ name: 'errors', kind: 'proportion', baseline: { rate: 0.02 }, events: ['cart_error'], direction: 'decrease', tolerance: { absolute: 1e300 } }] } }, ['metrics.guardrails[0].tolerance.absolute']],
  ])('%s', (_, overrides, fields) => {
    const errors = errorsOf(overrides).filter((e) => e.code === 'plan/number-out-of-range');
    expect(errors.map((e) => e.field)).toEqual(fields);
    for (const error of errors) {
      expect(error.line).toBeGreaterThan(1);
      expect(error.expected).toMatch(/from .* to |at least/);
      expect(error.message).not.toMatch(/Infinity|NaN|null|n\/a|∞/);
    }
  });

  it('accepts the edges of each range', () => {
    const edge = cleanPlan({
      ...design({ 'daily-units': 1e10, arms: [{ name: 'control', weight: 999 }, { name: 'treatment', weight: 1 }], 'min-detectable-effect': { relative: 100 } }),
      ...primary({ kind: 'mean', baseline: { mean: 1e15, sd: 1e-12 } }),
    });
    const result = loadPlan(planYaml(edge), 'experiments/x.yaml');
    expect(result.ok ? [] : result.errors).toEqual([]);
  });
});

describe('a plan sizing cannot size fails validation with the message sizing gives', () => {
  it.each([
    ['a relative effect on a mean whose baseline is 0', primary({ kind: 'mean', baseline: { mean: 0, sd: 3 } }), 'design.min-detectable-effect', /whose baseline is 0/],
    [
      'a ratio whose numerator and denominator move in perfect step',
      primary({ kind: 'ratio', baseline: { numerator: { mean: 2, sd: 1 }, denominator: { mean: 4, sd: 2 }, correlation: 1 } }),
      'metrics.primary.baseline',
      /perfect step/,
    ],
    ['an effect that takes a rate above 1', { ...primary({ kind: 'proportion', baseline: { rate: 0.9 } }), ...design({ 'min-detectable-effect': { relative: 0.5 } }) }, 'design.min-detectable-effect', /outside \(0, 1\)/],
  ])('%s', (_, overrides, field, message) => {
    const errors = errorsOf(overrides).filter((e) => e.code === 'plan/cannot-be-sized');
    expect(errors.map((e) => e.field)).toEqual([field]);
    expect(errors[0]!.message).toMatch(message);
  });

  // The expected text says how to fix this plan's cause, with its own figures (room = 1 - rate rising, rate falling).
  it.each([
    [
      'relative 3 on a rate of 0.3, rising',
      { ...primary({ kind: 'proportion', baseline: { rate: 0.3 } }), ...design({ 'min-detectable-effect': { relative: 3 } }) },
      'an effect that keeps the rate inside (0, 1): a rise of less than 0.7 absolute here (from 0.3), or less than 2.333 relative',
    ],
    [
      'absolute 0.4 on a rate of 0.3, falling',
      { ...primary({ kind: 'proportion', baseline: { rate: 0.3 }, direction: 'decrease' }), ...design({ 'min-detectable-effect': { absolute: 0.4 } }) },
      'an effect that keeps the rate inside (0, 1): a fall of less than 0.3 absolute here (from 0.3), or less than 1 relative',
    ],
    [
      'a relative effect on a mean whose baseline is 0',
      primary({ kind: 'mean', baseline: { mean: 0, sd: 3 } }),
      "an absolute effect in the metric's own units, as in { absolute: 0.5 }: a relative change of a baseline of 0 is 0",
    ],
    [
      'a relative effect on a ratio whose numerator mean is 0',
      primary({ kind: 'ratio', baseline: { numerator: { mean: 0, sd: 1 }, denominator: { mean: 4, sd: 2 }, correlation: 0.5 } }),
      "an absolute effect in the metric's own units, as in { absolute: 0.5 }: a relative change of a baseline of 0 is 0",
    ],
    [
      'ratio parts in perfect step',
      primary({ kind: 'ratio', baseline: { numerator: { mean: 2, sd: 1 }, denominator: { mean: 4, sd: 2 }, correlation: 1 } }),
      'a numerator and denominator that do not move in perfect step: a correlation below 1, or standard deviations not in the proportion of the means',
    ],
  ])('expected fits the cause: %s', (_, overrides, expected) => {
    const errors = errorsOf(overrides).filter((e) => e.code === 'plan/cannot-be-sized');
    expect(errors.map((e) => e.expected)).toEqual([expected]);
  });

  it('uses exactly the words sizing uses', () => {
    const plan = cleanPlan(primary({ kind: 'mean', baseline: { mean: 0, sd: 3 } }));
    const errors = errorsOf(plan).filter((e) => e.code === 'plan/cannot-be-sized');
    const withoutRules = loadPlan(planYaml(cleanPlan({ ...primary({ kind: 'mean', baseline: { mean: 1, sd: 3 } }) })), 'x.yaml');
    expect(withoutRules.ok).toBe(true);
    if (!withoutRules.ok) return;
    const zeroBaseline = { ...withoutRules.loaded.plan, metrics: { ...withoutRules.loaded.plan.metrics, primary: { ...withoutRules.loaded.plan.metrics.primary, baseline: { mean: 0, sd: 3 } } } } as typeof withoutRules.loaded.plan;
    const sized = sizePlan(zeroBaseline).metrics[0]!.result;
    expect(sized.ok).toBe(false);
    if (sized.ok) return;
    expect(errors[0]!.message).toBe(`m cannot be sized: ${sized.error.message}`);
  });
});

describe('the guard at the report boundary', () => {
  it('finds the first non-finite figure by path', () => {
    expect(firstNonFinite({ a: 1, b: [{ c: 2 }, { d: Infinity }], e: NaN })).toBe('b.1.d');
    expect(firstNonFinite({ a: 1, b: [0, -3] })).toBeUndefined();
  });

  it('turns a sizing with an overflowing figure into an error naming the figure and the input', () => {
    const loaded = loadPlan(planYaml(cleanPlan()), 'x.yaml');
    if (!loaded.ok) throw new Error('clean plan should load');
    const sizing = sizePlan(loaded.loaded.plan);
    const first = sizing.metrics[0]!;
    if (!first.result.ok) throw new Error('clean plan should size');
    const broken = { ...sizing, metrics: [{ ...first, result: { ok: true as const, value: { ...first.result.value, headline: { perArm: [], totalUnits: 5, duration: { days: Infinity, weeks: 1 } } } } }] };
    const guarded = finiteSizing(broken).metrics[0]!.result;
    expect(guarded).toEqual({ ok: false, error: { input: 'daily-units', message: expect.stringContaining('the number of days overflows for these inputs (headline.duration.days)') } });
    expect(finiteSizing(sizing)).toEqual(sizing);
  });
});
