import type { MetricTotals } from '../totals/schema.js';

/** Sums of several groups of the same metric (later weeks pooled, for instance): sufficient statistics add. */
export function addTotals(parts: readonly MetricTotals[]): MetricTotals | undefined {
  const [first, ...rest] = parts;
  if (!first || rest.some((p) => p.kind !== first.kind)) return undefined;
  if (first.kind === 'ratio') {
    const ratios = parts as Extract<MetricTotals, { kind: 'ratio' }>[];
    const sum = (pick: (r: (typeof ratios)[number]) => number) => ratios.reduce((s, r) => s + pick(r), 0);
    return {
      kind: 'ratio',
      n: sum((r) => r.n),
      numerator: { sum: sum((r) => r.numerator.sum), sumSquares: sum((r) => r.numerator.sumSquares) },
      denominator: { sum: sum((r) => r.denominator.sum), sumSquares: sum((r) => r.denominator.sumSquares) },
      sumProducts: sum((r) => r.sumProducts),
    };
  }
  const simple = parts as Exclude<MetricTotals, { kind: 'ratio' }>[];
  return {
    kind: first.kind,
    n: simple.reduce((s, p) => s + p.n, 0),
    sum: simple.reduce((s, p) => s + p.sum, 0),
    sumSquares: simple.reduce((s, p) => s + p.sumSquares, 0),
  };
}
