import { describe, expect, it } from 'vitest';
import { designEffect, varianceReduction } from '../../src/core/stats/adjustments.js';
import { meanPower, meanSampleSize } from '../../src/core/stats/mean.js';
import { benjaminiHochberg, bonferroniAdjust } from '../../src/core/stats/multiple-testing.js';
import { proportionDetectable, proportionPower, proportionSampleSize } from '../../src/core/stats/proportion.js';
import { sequentialBoundaries, sequentialInflation, sequentialPower, type BoundaryKind } from '../../src/core/stats/sequential.js';
import { normalDraws, seededRandom } from '../helpers/random.js';

const value = <T>(r: { ok: true; value: T } | { ok: false }) => {
  if (!r.ok) throw new Error('expected a value');
  return r.value;
};

/** R's root finder stops at tol = .Machine$double.eps^0.25 by default; its printed n and p2 are that close. */
const R_DEFAULT_TOL = 1.22e-4;

describe("R's documented examples (example(power.prop.test), example(power.t.test); values as printed by R 4.2.2)", () => {
  const equal = { alpha: 0.05, sides: 2 as const, ratio: 1 };
  it('power.prop.test(n = 50, p1 = .50, p2 = .75) -> power 0.7401659', () => {
    expect(value(proportionPower({ ...equal, p1: 0.5, p2: 0.75 }, 50))).toBeCloseTo(0.7401659013, 9);
  });
  it('power.prop.test(p1 = .50, p2 = .75, power = .90) -> n 76.70693', () => {
    expect(Math.abs(value(proportionSampleSize({ ...equal, p1: 0.5, p2: 0.75 }, 0.9)) - 76.70693011)).toBeLessThan(R_DEFAULT_TOL * 100);
  });
  it('power.prop.test(n = 50, p1 = .5, power = .90) -> p2 0.8026141', () => {
    expect(Math.abs(value(proportionDetectable({ ...equal, p1: 0.5 }, 50, 0.9, 'increase')) - 0.8026140907)).toBeLessThan(R_DEFAULT_TOL);
  });
  it('power.t.test(n = 20, delta = 1) -> power 0.8689528', () => {
    expect(value(meanPower({ ...equal, delta: 1, sd: 1, method: 'exact' }, 20))).toBeCloseTo(0.8689528017, 7);
  });
  it('power.t.test(power = .90, delta = 1) -> n 22.02110', () => {
    expect(Math.abs(value(meanSampleSize({ ...equal, delta: 1, sd: 1, method: 'exact' }, 0.9)) - 22.0210977)).toBeLessThan(R_DEFAULT_TOL * 100);
  });
  it('power.t.test(power = .90, delta = 1, alternative = "one.sided") -> n 17.84713', () => {
    expect(Math.abs(value(meanSampleSize({ ...equal, sides: 1, delta: 1, sd: 1, method: 'exact' }, 0.9)) - 17.84712609)).toBeLessThan(R_DEFAULT_TOL * 100);
  });
});

describe("Lehr's rule of thumb: n = 16 sd^2 / delta^2 per arm at alpha 0.05 two-sided, power 0.8 (van Belle, Statistical Rules of Thumb, chapter 2; the rule from memory)", () => {
  it.each([0.1, 0.25, 0.5])('standardized effect %s lands within 5% of the rule', (d) => {
    const n = value(meanSampleSize({ alpha: 0.05, sides: 2, ratio: 1, delta: d, sd: 1, method: 'exact' }, 0.8));
    const rule = 16 / d ** 2;
    expect(n / rule).toBeGreaterThan(0.95);
    expect(n / rule).toBeLessThan(1.05);
  });
});

// Jennison & Turnbull (2000), Group Sequential Methods with Applications to Clinical Trials,
// Table 2.1 (Pocock C_P, R_P) and Table 2.3 (O'Brien & Fleming C_B, R_B), two-sided alpha = 0.05,
// equal group sizes. Values from memory, three decimals; K = 10 inflation factors are left out
// because the remembered values disagree with a Monte Carlo check (below) in the third decimal.
const JT: { kind: BoundaryKind; K: number; c: number; r80: number; r90: number }[] = [
  { kind: 'pocock', K: 2, c: 2.178, r80: 1.11, r90: 1.1 },
  { kind: 'pocock', K: 3, c: 2.289, r80: 1.166, r90: 1.151 },
  { kind: 'pocock', K: 4, c: 2.361, r80: 1.202, r90: 1.183 },
  { kind: 'pocock', K: 5, c: 2.413, r80: 1.229, r90: 1.207 },
  { kind: 'obrien-fleming', K: 2, c: 1.977, r80: 1.008, r90: 1.007 },
  { kind: 'obrien-fleming', K: 3, c: 2.004, r80: 1.017, r90: 1.016 },
  { kind: 'obrien-fleming', K: 4, c: 2.024, r80: 1.024, r90: 1.022 },
  { kind: 'obrien-fleming', K: 5, c: 2.04, r80: 1.028, r90: 1.026 },
];

describe('Jennison & Turnbull (2000) tables 2.1 and 2.3 (from memory)', () => {
  it.each(JT)('$kind K=$K: C = $c, R(0.8) = $r80, R(0.9) = $r90', ({ kind, K, c, r80, r90 }) => {
    const design = { kind, looks: K, alpha: 0.05, sides: 2 as const };
    const bounds = value(sequentialBoundaries(design));
    // Pocock's boundary is c at every look; O'Brien & Fleming's is c * sqrt(K / k), so c at the last look.
    expect(bounds.z[K - 1]).toBeCloseTo(c, 2);
    expect(Math.abs(bounds.z[K - 1]! - c)).toBeLessThan(0.0006);
    expect(Math.abs(value(sequentialInflation(design, 0.8)).inflation - r80)).toBeLessThan(0.0006);
    expect(Math.abs(value(sequentialInflation(design, 0.9)).inflation - r90)).toBeLessThan(0.0006);
  });

  it('K = 10 critical values: Pocock 2.555, O’Brien-Fleming 2.087', () => {
    expect(value(sequentialBoundaries({ kind: 'pocock', looks: 10, alpha: 0.05, sides: 2 })).z[0]).toBeCloseTo(2.555, 3);
    expect(value(sequentialBoundaries({ kind: 'obrien-fleming', looks: 10, alpha: 0.05, sides: 2 })).z[9]).toBeCloseTo(2.087, 3);
  });
});

describe('Lan-DeMets spending boundaries, K = 5, two-sided alpha 0.05 (values widely tabulated; from memory)', () => {
  it("O'Brien-Fleming type: 4.877, 3.357, 2.680, 2.290, 2.031", () => {
    const z = value(sequentialBoundaries({ kind: 'obrien-fleming-spending', looks: 5, alpha: 0.05, sides: 2 })).z;
    [4.877, 3.357, 2.68, 2.29, 2.031].forEach((expected, i) => expect(Math.abs(z[i]! - expected)).toBeLessThan(0.0006));
  });
  it('Pocock type: 2.438, 2.427, 2.410, 2.397, 2.386', () => {
    const z = value(sequentialBoundaries({ kind: 'pocock-spending', looks: 5, alpha: 0.05, sides: 2 })).z;
    [2.438, 2.427, 2.41, 2.397, 2.386].forEach((expected, i) => expect(Math.abs(z[i]! - expected)).toBeLessThan(0.0006));
  });
});

describe('group sequential designs against a Monte Carlo simulation of the test itself', () => {
  // Brownian motion observed at k/K; a crossing of +b_k or -b_k stops the test. 400,000 runs: SE of a
  // probability near 0.05 is 0.00034, near 0.8 is 0.00063; the bounds allow four standard errors.
  function simulate(z: number[], eta: number, runs: number, seed: number): { upper: number; any: number } {
    const draw = normalDraws(seededRandom(seed));
    const K = z.length;
    let upper = 0;
    let any = 0;
    for (let r = 0; r < runs; r++) {
      let s = 0;
      for (let k = 1; k <= K; k++) {
        s += eta / K + Math.sqrt(1 / K) * draw();
        const zk = s / Math.sqrt(k / K);
        if (zk >= z[k - 1]!) {
          upper++;
          any++;
          break;
        }
        if (zk <= -z[k - 1]!) {
          any++;
          break;
        }
      }
    }
    return { upper: upper / runs, any: any / runs };
  }

  it.each(['pocock', 'obrien-fleming', 'obrien-fleming-spending', 'pocock-spending'] as const)('%s, K = 4: size 0.05 and power 0.9 at the inflated sample', (kind) => {
    const design = { kind, looks: 4, alpha: 0.05, sides: 2 as const };
    const { boundaries, inflation } = value(sequentialInflation(design, 0.9));
    const underNull = simulate(boundaries.z, 0, 400_000, 11);
    expect(Math.abs(underNull.any - 0.05)).toBeLessThan(4 * 0.00034);
    const eta = Math.sqrt(inflation) * (1.959963984540054 + 1.2815515655446004);
    const underAlternative = simulate(boundaries.z, eta, 400_000, 12);
    expect(Math.abs(underAlternative.upper - 0.9)).toBeLessThan(4 * 0.00047);
    expect(sequentialPower(boundaries.z, 2, eta)).toBeCloseTo(0.9, 8);
  });
});

describe('Benjamini & Hochberg (1995): the 15 p-values of the worked example (counts from memory)', () => {
  // The paper's example: BH at q = 0.05 rejects the four smallest; Bonferroni at 0.05 rejects three.
  const p = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1.0];
  it('Benjamini-Hochberg rejects 4', () => {
    expect(value(benjaminiHochberg(p)).filter((q) => q <= 0.05)).toHaveLength(4);
  });
  it('Bonferroni rejects 3', () => {
    expect(value(bonferroniAdjust(p)).filter((q) => q <= 0.05)).toHaveLength(3);
  });
  it('adjusted values as R prints p.adjust(p, "BH") (R 4.2.2)', () => {
    const expected = [0.0015, 0.003, 0.0095, 0.035625, 0.0603, 0.06385714286, 0.06385714286, 0.0645, 0.0765, 0.486, 0.5811818182, 0.714875, 0.7532307692, 0.8132142857, 1];
    value(benjaminiHochberg(p)).forEach((q, i) => expect(q).toBeCloseTo(expected[i]!, 9));
  });
});

describe('design effect and variance reduction', () => {
  it('Kish: 1 + (m - 1) icc, e.g. m = 20, icc = 0.05 -> 1.95 (common practice, no source)', () => {
    expect(designEffect(20, 0.05)).toBeCloseTo(1.95, 12);
  });
  it('Eldridge, Ashby & Kerry (2006): 1 + ((cv^2 + 1) m - 1) icc reduces to Kish at cv = 0 and grows with cv', () => {
    expect(designEffect(20, 0.05, 0)).toBeCloseTo(designEffect(20, 0.05), 12);
    expect(designEffect(20, 0.05, 0.6)).toBeCloseTo(1 + (1.36 * 20 - 1) * 0.05, 12);
  });
  it('CUPED: rho = 0.5 leaves 75% of the variance (Deng, Xu, Kohavi & Walker 2013)', () => {
    expect(varianceReduction(0.5)).toBeCloseTo(0.75, 12);
  });
});
