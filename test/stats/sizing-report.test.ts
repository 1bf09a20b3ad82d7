import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { MetricRead } from '../../src/core/readout/build-readout.js';
import { metricDifference } from '../../src/core/report/readout-figures.js';
import { changeSize, withArticle } from '../../src/core/report/sizing.js';

describe('sizing words', () => {
  // English usage: "an" before a number whose spoken form starts with a vowel sound (eight, eleven, eighteen,
  // eighty-…, eight hundred, eleven thousand); common practice, no source.
  it.each([
    ['8.0%', 'an'],
    ['11.7%', 'an'],
    ['18%', 'an'],
    ['80.5%', 'an'],
    ['89.9%', 'an'],
    ['800', 'an'],
    ['11,000', 'an'],
    ['1.5%', 'a'],
    ['110%', 'a'],
    ['181%', 'a'],
    ['28.0%', 'a'],
    ['>99.9%', 'a'],
    ['<0.1%', 'a'],
  ])('%s takes "%s"', (text, article) => {
    expect(withArticle(text)).toBe(`${article} ${text}`);
  });

  it('prints the size of a change with the digits the readout gives its minimum detectable effect', () => {
    const read = (kind: MetricRead['kind']) => ({ kind }) as MetricRead;
    // The demo ship pull request: the readout's 0.821 pp beside the sizing's figure.
    expect(changeSize('proportion', 0.00821)).toBe('0.821 pp');
    expect(changeSize('proportion', 0.0082)).toBe('0.82 pp');
    fc.assert(
      fc.property(fc.double({ min: 1e-7, max: 0.99, noNaN: true }), fc.constantFrom<MetricRead['kind']>('proportion', 'mean', 'ratio'), (value, kind) => {
        const readout = metricDifference(read(kind), value).replace(/^\+/, '');
        const sizing = changeSize(kind, value);
        // The readout gives means four digits and the sizing table formatValue's four: the same text either way.
        expect(sizing).toBe(readout);
      }),
    );
  });
});
