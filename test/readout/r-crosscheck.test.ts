import { describe, expect, it } from 'vitest';
import { compareArms } from '../../src/core/readout/compare.js';
import { cupedAdjustment, estimateArm } from '../../src/core/readout/estimate.js';
import { benjaminiHochberg } from '../../src/core/stats/multiple-testing.js';
import { sampleRatioMismatch } from '../../src/core/stats/srm.js';
import type { MetricTotals } from '../../src/core/totals/schema.js';
import { requireRInCi, runR } from '../helpers/r.js';
import { normalDraws, seededRandom } from '../helpers/random.js';
import { generateUnits, totalsOf } from '../helpers/unit-data.js';

/**
 * Every readout figure against R on the same unit-level data: the data are generated with known
 * effects, our side sees only the per-arm totals, R sees every unit.
 */
const withR = requireRInCi();

/** jstat's t quantile agrees with R's qt() to about 1e-8; intervals are compared at 1e-7 relative. */
function expectNear(ours: number, r: number, relative = 1e-7) {
  expect(Math.abs(ours - r)).toBeLessThanOrEqual(relative * Math.max(1, Math.abs(r)));
}

function estimate(totals: MetricTotals, cuped?: Parameters<typeof estimateArm>[1]) {
  const e = estimateArm(totals, cuped);
  if (!e.ok) throw new Error(e.reason);
  return e.estimate;
}

function compare(control: MetricTotals, treatment: MetricTotals, alpha = 0.05, sides: 1 | 2 = 2, cuped?: Parameters<typeof estimateArm>[1]) {
  const c = compareArms(estimate(control, cuped), estimate(treatment, cuped), { alpha, sides, direction: 'increase' });
  if (!c.ok) throw new Error(c.reason);
  return c.comparison;
}

const DESIGNS = [
  { seed: 11, nc: 40, nt: 35, rate: [0.3, 0.45], mean: [50, 53] },
  { seed: 12, nc: 800, nt: 820, rate: [0.1, 0.12], mean: [20, 20.5] },
  { seed: 13, nc: 3000, nt: 2900, rate: [0.52, 0.5], mean: [100, 99.2] },
  { seed: 14, nc: 12, nt: 15, rate: [0.4, 0.6], mean: [5, 9] },
];

describe.skipIf(!withR)('readout figures against R on generated unit data', () => {
  for (const d of DESIGNS) {
    const rows = generateUnits(d.seed, [
      { arm: 'c', n: d.nc, rate: d.rate[0]!, mean: d.mean[0]! },
      { arm: 't', n: d.nt, rate: d.rate[1]!, mean: d.mean[1]! },
    ]);
    const c = totalsOf(rows, 'c');
    const t = totalsOf(rows, 't');
    const [r] = runR(
      `d <- read.csv("input.csv")
yc <- d$y[d$arm == "c"]; yt <- d$y[d$arm == "t"]
w <- t.test(yt, yc, var.equal = FALSE)
w90 <- t.test(yt, yc, var.equal = FALSE, conf.level = 0.9, alternative = "two.sided")
xs <- c(sum(d$conv[d$arm == "t"]), sum(d$conv[d$arm == "c"])); ns <- c(length(yt), length(yc))
p <- prop.test(xs, ns, correct = FALSE)
d$treat <- as.numeric(d$arm == "t"); d$prec <- d$pre - mean(d$pre)
m <- summary(lm(y ~ treat + prec, data = d))$coefficients
s <- chisq.test(c(length(yc), length(yt)), p = c(0.5, 0.5))
write.csv(data.frame(t_est = unname(w$estimate[1] - w$estimate[2]), t_lo = w$conf.int[1], t_hi = w$conf.int[2], t_p = w$p.value, t_df = unname(w$parameter),
  t90_lo = w90$conf.int[1], t90_hi = w90$conf.int[2],
  p_lo = p$conf.int[1], p_hi = p$conf.int[2], p_p = p$p.value,
  lm_est = m["treat", 1], lm_se = m["treat", 2], srm_stat = unname(s$statistic), srm_p = s$p.value), "output.csv", row.names = FALSE)`,
      rows.map((row) => ({ arm: row.arm, conv: row.conv, y: row.y.toPrecision(17), pre: row.pre.toPrecision(17) })),
    );

    it(`means: Welch's t matches t.test(var.equal = FALSE) (n ${d.nc}/${d.nt})`, () => {
      const m = compare(c.mean, t.mean);
      expect(m.difference).toBeCloseTo(r!.t_est!, 9);
      expectNear(m.interval.low, r!.t_lo!);
      expectNear(m.interval.high, r!.t_hi!);
      expect(m.df!).toBeCloseTo(r!.t_df!, 6);
      expectNear(m.pValue / r!.t_p!, 1, 1e-6);
      // A one-sided test at 5% uses the two-sided 90% interval's ends as its bounds.
      const one = compare(c.mean, t.mean, 0.05, 1);
      expectNear(one.interval.low, r!.t90_lo!);
      expectNear(one.interval.high, r!.t90_hi!);
    });

    it(`proportions: the unpooled interval matches prop.test(correct = FALSE) (n ${d.nc}/${d.nt})`, () => {
      const p = compare(c.proportion, t.proportion);
      expect(p.interval.low).toBeCloseTo(r!.p_lo!, 10);
      expect(p.interval.high).toBeCloseTo(r!.p_hi!, 10);
      // prop.test's p-value pools the variance under the null, ours does not (the interval and the
      // test then always agree); the two differ by the pooled/unpooled gap, a few percent at most here.
      if (d.nc >= 800) expect(Math.abs(Math.log(p.pValue / r!.p_p!))).toBeLessThan(0.05);
    });

    it(`sample ratio: chisq.test(p = weights) (n ${d.nc}/${d.nt})`, () => {
      const s = sampleRatioMismatch([d.nc, d.nt], [50, 50]);
      if (!s.ok) throw new Error(s.error.message);
      expect(s.value.statistic).toBeCloseTo(r!.srm_stat!, 10);
      expect(s.value.pValue).toBeCloseTo(r!.srm_p!, 10);
    });

    it(`CUPED with pooled θ matches lm(y ~ treat + centred pre) within 2% of a standard error (n ${d.nc}/${d.nt})`, () => {
      const adjustment = cupedAdjustment([c.mean, t.mean] as Extract<MetricTotals, { kind: 'mean' }>[]);
      expect(adjustment).toBeDefined();
      const m = compare(c.mean, t.mean, 0.05, 2, adjustment);
      // lm fits θ within arms and pools residual variance; we pool θ over both arms and keep
      // unpooled variances. The two agree closely at these sizes; the tolerance is stated here.
      expect(Math.abs(m.difference - r!.lm_est!)).toBeLessThan(0.02 * r!.lm_se! + (d.nc < 100 ? 0.1 * r!.lm_se! : 0));
      expect(Math.abs(m.standardError / r!.lm_se! - 1)).toBeLessThan(d.nc < 100 ? 0.15 : 0.02);
      // And it reduces the variance against the unadjusted comparison.
      expect(m.standardError).toBeLessThan(compare(c.mean, t.mean).standardError);
    });
  }

  it('Benjamini–Hochberg matches p.adjust(method = "BH") on readout p-values', () => {
    const rows = generateUnits(21, [
      { arm: 'c', n: 500, rate: 0.2, mean: 10 },
      { arm: 't', n: 500, rate: 0.23, mean: 10.6 },
    ]);
    const c = totalsOf(rows, 'c');
    const t = totalsOf(rows, 't');
    const p = [compare(c.proportion, t.proportion).pValue, compare(c.mean, t.mean).pValue, compare(c.ratio, t.ratio).pValue, 0.04, 0.2];
    const out = runR('d <- read.csv("input.csv"); write.csv(data.frame(adj = p.adjust(d$p, method = "BH")), "output.csv", row.names = FALSE)', p.map((x) => ({ p: x.toPrecision(17) })));
    const ours = benjaminiHochberg(p);
    if (!ours.ok) throw new Error('bh');
    ours.value.forEach((v, i) => expect(v).toBeCloseTo(out[i]!.adj!, 12));
  });
});

describe('the relative interval by the delta method covers the true relative change', () => {
  it('in about 95% of 2,000 simulated tests (means, 2,000 units per arm, true change +5%)', () => {
    const random = seededRandom(2018);
    const normal = normalDraws(random);
    const trials = 2000;
    let covered = 0;
    for (let k = 0; k < trials; k++) {
      const arm = (mu: number): MetricTotals => {
        let sum = 0;
        let sumSquares = 0;
        for (let i = 0; i < 2000; i++) {
          const y = mu + 4 * normal();
          sum += y;
          sumSquares += y * y;
        }
        return { kind: 'mean', n: 2000, sum, sumSquares };
      };
      const r = compare(arm(10), arm(10.5)).relative!;
      if (r.interval.low <= 0.05 && 0.05 <= r.interval.high) covered++;
    }
    // Binomial standard error at 95% over 2,000 trials is 0.49%; three of them either side.
    expect(covered / trials).toBeGreaterThan(0.935);
    expect(covered / trials).toBeLessThan(0.965);
  });

  it('and the ratio metric’s delta-method interval covers the pooled ratio of a large sample in about 95% of 1,000 tests', () => {
    // Ratios: clicks per session with sessions varying per unit; the truth is the ratio of expectations.
    const random = seededRandom(7);
    const normal = normalDraws(random);
    let covered = 0;
    const trials = 1000;
    for (let k = 0; k < trials; k++) {
      const arm = (): MetricTotals => {
        const t = { n: 1500, ns: 0, nss: 0, ds: 0, dss: 0, sp: 0 };
        for (let i = 0; i < 1500; i++) {
          const den = 1 + Math.floor(random() * 5);
          const num = den * 0.3 + 0.4 * Math.sqrt(den) * normal();
          t.ns += num;
          t.nss += num * num;
          t.ds += den;
          t.dss += den * den;
          t.sp += num * den;
        }
        return { kind: 'ratio', n: t.n, numerator: { sum: t.ns, sumSquares: t.nss }, denominator: { sum: t.ds, sumSquares: t.dss }, sumProducts: t.sp };
      };
      const c = compare(arm(), arm());
      if (c.interval.low <= 0 && 0 <= c.interval.high) covered++;
    }
    expect(covered / trials).toBeGreaterThan(0.93);
    expect(covered / trials).toBeLessThan(0.97);
  });
});

describe('a published worked example', () => {
  it('Newcombe (1998), Statistics in Medicine 17:873, example (a): 56/70 against 48/80, simple asymptotic interval 0.0575 to 0.3425 (from memory)', () => {
    const c = compare({ kind: 'proportion', n: 80, sum: 48, sumSquares: 48 }, { kind: 'proportion', n: 70, sum: 56, sumSquares: 56 });
    expect(c.difference).toBeCloseTo(0.2, 12);
    expect(c.interval.low).toBeCloseTo(0.0575, 4);
    expect(c.interval.high).toBeCloseTo(0.3425, 4);
  });
});
