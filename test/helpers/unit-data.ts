import type { MetricTotals } from '../../src/core/totals/schema.js';
import { normalDraws, seededRandom } from './random.js';

/** Unit-level data of one arm with known effects: a conversion, a value with a pre-period covariate, and a ratio. */
export interface UnitRow {
  arm: string;
  conv: number;
  y: number;
  pre: number;
  num: number;
  den: number;
}

export interface ArmSpec {
  arm: string;
  n: number;
  rate: number;
  /** Mean of y; y = mean + slope·(pre − 20) + noise. */
  mean: number;
  slope?: number;
}

/** Deterministic unit rows for each arm (seeded), as a data job would see them. */
export function generateUnits(seed: number, arms: readonly ArmSpec[]): UnitRow[] {
  const random = seededRandom(seed);
  const normal = normalDraws(random);
  const rows: UnitRow[] = [];
  for (const spec of arms) {
    for (let i = 0; i < spec.n; i++) {
      const pre = 20 + 6 * normal();
      const y = spec.mean + (spec.slope ?? 0.8) * (pre - 20) + 5 * normal();
      const den = 1 + Math.floor(random() * 5);
      const num = Math.max(0, Math.round(den * (spec.rate * 3 + 0.5 * normal())));
      rows.push({ arm: spec.arm, conv: random() < spec.rate ? 1 : 0, y, pre, num, den });
    }
  }
  return rows;
}

/** The sufficient statistics of one arm's rows, as the totals file would hold them. */
export function totalsOf(rows: readonly UnitRow[], arm: string): { proportion: MetricTotals; mean: MetricTotals; ratio: MetricTotals } {
  const mine = rows.filter((r) => r.arm === arm);
  const n = mine.length;
  const sum = (f: (r: UnitRow) => number) => mine.reduce((s, r) => s + f(r), 0);
  const x = sum((r) => r.conv);
  const pre = { sum: sum((r) => r.pre), sumSquares: sum((r) => r.pre * r.pre), sumProducts: sum((r) => r.y * r.pre) };
  return {
    proportion: { kind: 'proportion', n, sum: x, sumSquares: x },
    mean: { kind: 'mean', n, sum: sum((r) => r.y), sumSquares: sum((r) => r.y * r.y), pre },
    ratio: {
      kind: 'ratio',
      n,
      numerator: { sum: sum((r) => r.num), sumSquares: sum((r) => r.num * r.num) },
      denominator: { sum: sum((r) => r.den), sumSquares: sum((r) => r.den * r.den) },
      sumProducts: sum((r) => r.num * r.den),
    },
  };
}
