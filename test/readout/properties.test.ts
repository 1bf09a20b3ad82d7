import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareArms } from '../../src/core/readout/compare.js';
import { estimateArm } from '../../src/core/readout/estimate.js';
import type { MetricTotals } from '../../src/core/totals/schema.js';

/** Per-unit values of one arm, turned into the totals a file would hold. */
const values = fc.array(fc.double({ min: -1000, max: 1000, noNaN: true }), { minLength: 3, maxLength: 60 });

function meanTotals(ys: readonly number[], shift = 0): MetricTotals {
  const shifted = ys.map((y) => y + shift);
  return { kind: 'mean', n: ys.length, sum: shifted.reduce((a, b) => a + b, 0), sumSquares: shifted.reduce((a, b) => a + b * b, 0) };
}

function comparison(control: MetricTotals, treatment: MetricTotals) {
  const c = estimateArm(control);
  const t = estimateArm(treatment);
  if (!c.ok || !t.ok) return undefined;
  const result = compareArms(c.estimate, t.estimate, { alpha: 0.05, sides: 2, direction: 'increase' });
  return result.ok ? result.comparison : undefined;
}

const varies = (ys: readonly number[]) => Math.max(...ys) - Math.min(...ys) > 1e-3;

describe('readout properties (fast-check)', () => {
  it('swapping the arms flips the difference, its interval and the statistic, and keeps the p-value', () => {
    fc.assert(
      fc.property(values, values, (a, b) => {
        fc.pre(varies(a) && varies(b));
        const ab = comparison(meanTotals(a), meanTotals(b));
        const ba = comparison(meanTotals(b), meanTotals(a));
        if (!ab || !ba) return;
        const tol = 1e-9 * (1 + Math.abs(ab.difference) + ab.standardError);
        expect(Math.abs(ab.difference + ba.difference)).toBeLessThan(tol);
        expect(Math.abs(ab.interval.low + ba.interval.high)).toBeLessThan(tol + 1e-9 * Math.abs(ab.interval.low));
        expect(Math.abs(ab.statistic + ba.statistic)).toBeLessThan(1e-6 * (1 + Math.abs(ab.statistic)));
        expect(Math.abs(ab.pValue - ba.pValue)).toBeLessThan(1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('swapping proportions flips the difference too', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 100000 }), fc.integer({ min: 2, max: 100000 }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), (n1, n2, r1, r2) => {
        const p = (n: number, r: number): MetricTotals => {
          const x = Math.round(n * r);
          return { kind: 'proportion', n, sum: x, sumSquares: x };
        };
        const ab = comparison(p(n1, r1), p(n2, r2));
        const ba = comparison(p(n2, r2), p(n1, r1));
        if (!ab || !ba) return;
        expect(ab.difference).toBeCloseTo(-ba.difference, 12);
        expect(ab.pValue).toBeCloseTo(ba.pValue, 12);
      }),
      { numRuns: 200 },
    );
  });

  it('adding a constant to every unit’s value moves both arms alike and leaves the difference, its interval and p', () => {
    fc.assert(
      fc.property(values, values, fc.double({ min: -500, max: 500, noNaN: true }), (a, b, k) => {
        fc.pre(varies(a) && varies(b));
        const before = comparison(meanTotals(a), meanTotals(b));
        const after = comparison(meanTotals(a, k), meanTotals(b, k));
        if (!before || !after) return;
        expect(after.control.value - before.control.value).toBeCloseTo(k, 6);
        expect(after.treatment.value - before.treatment.value).toBeCloseTo(k, 6);
        // Sums of squares lose digits to the shift; the tolerance follows their size.
        const scale = 1e-7 * (1 + Math.abs(k) + Math.max(...a.map(Math.abs), ...b.map(Math.abs)));
        expect(Math.abs(after.difference - before.difference)).toBeLessThan(scale);
        expect(Math.abs(after.standardError - before.standardError)).toBeLessThan(scale * 10 + 1e-6 * before.standardError);
      }),
      { numRuns: 200 },
    );
  });
});
