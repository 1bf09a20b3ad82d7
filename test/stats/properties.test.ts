import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designEffect } from '../../src/core/stats/adjustments.js';
import { meanPower, meanSampleSize } from '../../src/core/stats/mean.js';
import { proportionPower, proportionSampleSize } from '../../src/core/stats/proportion.js';
import { sizeMetric, type SizingRequest } from '../../src/core/stats/sizing.js';

// Properties every sizing must have, whatever the inputs (common practice, no source).
const alpha = fc.double({ min: 0.005, max: 0.2, noNaN: true });
const power = fc.double({ min: 0.55, max: 0.99, noNaN: true });
const sides = fc.constantFrom<1 | 2>(1, 2);
const ratio = fc.double({ min: 0.25, max: 4, noNaN: true });
const rate = fc.double({ min: 0.02, max: 0.9, noNaN: true });
const lift = fc.double({ min: 0.02, max: 0.5, noNaN: true });

const proportionTest = fc.record({ alpha, sides, ratio, p1: rate, lift }).filter(({ p1, lift }) => p1 * (1 + lift) < 0.99);

describe('proportions', () => {
  it('required n falls as the effect grows', () => {
    fc.assert(
      fc.property(proportionTest, power, fc.double({ min: 1.1, max: 2, noNaN: true }), ({ p1, lift, ...s }, pw, grow) => {
        fc.pre(p1 * (1 + lift * grow) < 0.99);
        const small = proportionSampleSize({ ...s, p1, p2: p1 * (1 + lift) }, pw);
        const large = proportionSampleSize({ ...s, p1, p2: p1 * (1 + lift * grow) }, pw);
        return small.ok && large.ok && large.value < small.value;
      }),
    );
  });

  it('required n rises as alpha falls', () => {
    fc.assert(
      fc.property(proportionTest, power, ({ p1, lift, ...s }, pw) => {
        fc.pre(pw > s.alpha);
        const loose = proportionSampleSize({ ...s, p1, p2: p1 * (1 + lift) }, pw);
        const strict = proportionSampleSize({ ...s, alpha: s.alpha / 2, p1, p2: p1 * (1 + lift) }, pw);
        return loose.ok && strict.ok && strict.value > loose.value;
      }),
    );
  });

  it('power rises with n, and solving for n then computing power returns the target', () => {
    fc.assert(
      fc.property(proportionTest, power, ({ p1, lift, ...s }, pw) => {
        const test = { ...s, p1, p2: p1 * (1 + lift) };
        const n = proportionSampleSize(test, pw);
        if (!n.ok) return false;
        const at = proportionPower(test, n.value);
        const more = proportionPower(test, n.value * 1.5);
        return at.ok && more.ok && Math.abs(at.value - pw) < 1e-9 && more.value > at.value;
      }),
    );
  });
});

describe('means (exact t)', () => {
  const meanTest = fc.record({ alpha, sides, ratio, d: fc.double({ min: 0.1, max: 1.5, noNaN: true }) });
  it('solving for n then computing power returns the target; power rises with n', () => {
    fc.assert(
      fc.property(meanTest, power, ({ d, ...s }, pw) => {
        const test = { ...s, delta: d, sd: 1, method: 'exact' as const };
        const n = meanSampleSize(test, pw);
        if (!n.ok) return false;
        const at = meanPower(test, n.value);
        const more = meanPower(test, n.value * 1.5);
        // At the smallest sample searched, power may already exceed the target.
        return at.ok && more.ok && (Math.abs(at.value - pw) < 1e-7 || at.value > pw) && more.value > at.value;
      }),
      { numRuns: 60 },
    );
  });
});

describe('multipliers', () => {
  it('the design effect is at least 1', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 500, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 3, noNaN: true }), (m, icc, cv) => designEffect(m, icc, cv) >= 1));
  });

  it('dilution never makes a test cheaper, and every reported number is finite', () => {
    const request = fc.record({
      rate,
      lift: fc.double({ min: 0.03, max: 0.3, noNaN: true }),
      reach: fc.double({ min: 0.05, max: 1, noNaN: true }),
      daily: fc.integer({ min: 100, max: 1_000_000 }),
      looks: fc.integer({ min: 0, max: 3 }),
    });
    fc.assert(
      fc.property(request, ({ rate: p, lift: l, reach, daily, looks }) => {
        fc.pre(p * (1 + l) < 0.99);
        const sizing = sizeMetric({
          baseline: { kind: 'proportion', rate: p },
          direction: 'increase',
          effect: { relative: l },
          arms: [
            { name: 'control', weight: 1 },
            { name: 'treatment', weight: 1 },
          ],
          control: 'control',
          alpha: 0.05,
          power: 0.8,
          sides: 2,
          dailyUnits: daily,
          trafficShare: 1,
          reach,
          interimLooks: looks,
          boundary: 'obrien-fleming-spending',
          prePeriodCorrelation: 0,
          plannedDays: 28,
        } satisfies SizingRequest);
        if (!sizing.ok) return false;
        const m = sizing.value.multipliers;
        const text = JSON.stringify(sizing.value);
        return m.dilutionUnits >= 1 && m.dilutionDays >= 1 - 1e-9 && m.sequential >= 1 && !text.includes('null') && !/NaN|Infinity/.test(text);
      }),
      { numRuns: 40 },
    );
  });
});

describe('sizing for validation (sampleSizeOnly)', () => {
  // Validation sizes every plan with sampleSizeOnly; it must fail exactly when the full sizing fails, with the same
  // words, and agree on the sample size and duration (common practice, no source: a shortcut may not change answers).
  const request = fc.record({
    kind: fc.constantFrom('proportion', 'mean', 'ratio'),
    rate: fc.double({ min: 0, max: 1, noNaN: true }),
    mean: fc.double({ min: -5, max: 50, noNaN: true }),
    correlation: fc.double({ min: -1, max: 1, noNaN: true }),
    effect: fc.oneof(fc.record({ relative: fc.double({ min: 0.005, max: 2, noNaN: true }) }), fc.record({ absolute: fc.double({ min: 0.001, max: 5, noNaN: true }) })),
    treatments: fc.integer({ min: 1, max: 3 }),
    controlWeight: fc.integer({ min: 1, max: 3 }),
    reach: fc.double({ min: 0.05, max: 1, noNaN: true }),
    daily: fc.option(fc.integer({ min: 1, max: 100_000 }), { nil: undefined }),
    plannedDays: fc.option(fc.integer({ min: 1, max: 90 }), { nil: undefined }),
    cluster: fc.option(fc.record({ meanSize: fc.integer({ min: 2, max: 40 }), icc: fc.double({ min: 0, max: 0.3, noNaN: true }), sizeCv: fc.constant(0) }), { nil: undefined }),
    hypothesis: fc.constantFrom<'superiority' | 'non-inferiority'>('superiority', 'non-inferiority'),
  });
  it('fails exactly when the full sizing fails, with the same message, and gives the same sample and duration', () => {
    fc.assert(
      fc.property(request, (r) => {
        const baseline: SizingRequest['baseline'] =
          r.kind === 'proportion'
            ? { kind: 'proportion', rate: r.rate }
            : r.kind === 'mean'
              ? { kind: 'mean', mean: r.mean, sd: 3 }
              : { kind: 'ratio', numerator: { mean: 2, sd: 1 }, denominator: { mean: 4, sd: 2 }, correlation: r.correlation };
        const full: SizingRequest = {
          baseline,
          direction: 'increase',
          effect: r.effect,
          arms: [{ name: 'control', weight: r.controlWeight }, ...Array.from({ length: r.treatments }, (_, i) => ({ name: `t${i}`, weight: 1 }))],
          control: 'control',
          alpha: 0.05,
          power: 0.8,
          sides: r.hypothesis === 'non-inferiority' ? 1 : 2,
          hypothesis: r.hypothesis,
          ...(r.daily !== undefined ? { dailyUnits: r.daily } : {}),
          ...(r.plannedDays !== undefined ? { plannedDays: r.plannedDays } : {}),
          ...(r.cluster ? { cluster: r.cluster } : {}),
          trafficShare: 1,
          reach: r.reach,
          interimLooks: 0,
          boundary: 'obrien-fleming-spending',
          prePeriodCorrelation: 0,
        };
        const a = sizeMetric(full);
        const b = sizeMetric({ ...full, sampleSizeOnly: true });
        expect(b.ok).toBe(a.ok);
        if (!a.ok || !b.ok) {
          expect(b).toEqual(a);
          return;
        }
        expect(b.value.headline).toEqual(a.value.headline);
        expect(b.value.triggered).toEqual(a.value.triggered);
        expect(b.value.feasibility?.feasible).toBe(a.value.feasibility?.feasible);
        expect(b.value.powerByDay).toBeUndefined();
      }),
      { numRuns: 300 },
    );
  });
});
