import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatP, statePValue } from '../../src/core/report/readout-figures.js';
import { MAX_UNIT_COUNT, sampleRatioMismatch } from '../../src/core/stats/srm.js';

describe('sampleRatioMismatch refuses what is not a count of units', () => {
  it.each([[[10.5, 9.5]], [[1e308, 1e308]], [[-1, 5]], [[MAX_UNIT_COUNT + 1, 5]], [[Number.NaN, 5]]])('%j', (observed) => {
    const check = sampleRatioMismatch(observed, [1, 1]);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.error.input).toBe('observed');
  });

  it('refuses an alarm threshold outside (0, 1)', () => {
    const check = sampleRatioMismatch([10, 20], [1, 1], 1.5);
    expect(check.ok ? undefined : check.error.input).toBe('threshold');
  });

  it('gives finite figures, or names its input, for any whole counts and positive weights', () => {
    const count = fc.oneof(fc.constantFrom(0, 1, MAX_UNIT_COUNT), fc.integer({ min: 0, max: 1e9 }));
    const weight = fc.oneof(fc.constantFrom(1e-320, 1e-300, 1, 1e300, Number.MAX_VALUE), fc.double({ min: 1e-6, max: 1e6, noNaN: true }));
    fc.assert(
      fc.property(fc.array(fc.tuple(count, weight), { minLength: 2, maxLength: 6 }), (arms) => {
        const check = sampleRatioMismatch(
          arms.map(([c]) => c),
          arms.map(([, w]) => w),
        );
        if (!check.ok) {
          expect(['observed', 'weights']).toContain(check.error.input);
          return;
        }
        for (const x of [check.value.statistic, check.value.pValue, ...check.value.expected]) expect(Number.isFinite(x)).toBe(true);
      }),
    );
  });
});

describe('p-values in words', () => {
  it.each([
    [0.31731, '0.317', 'p = 0.317'],
    [3.7e-4, '3.7e-4', 'p = 3.7e-4'],
    [1.8e-74, '< 1e-12', 'p < 1e-12'],
    [0, '< 1e-12', 'p < 1e-12'],
  ])('%s is "%s" in a cell and "%s" in a sentence', (p, cell, sentence) => {
    expect(formatP(p)).toBe(cell);
    expect(statePValue(p)).toBe(sentence);
  });
});
