import { describe, expect, it } from 'vitest';
import { varianceReduction } from '../../src/core/stats/adjustments.js';
import { meanSampleSize } from '../../src/core/stats/mean.js';
import { nonInferiorityProportionPower, nonInferiorityProportionSize } from '../../src/core/stats/non-inferiority.js';
import { sizeMetric, wholeGroupsPerArm, type SizingRequest } from '../../src/core/stats/sizing.js';
import { sizePlan } from '../../src/core/stats/plan-sizing.js';
import { uniqueUnitsCurve } from '../../src/core/stats/traffic.js';
import { planSchema } from '../../src/core/plan/schema.js';
import { requireRInCi, runR } from '../helpers/r.js';
import { relativeError, requireRPackageInCi, WRITE_OUTPUT } from '../helpers/r-packages.js';
import { seededRandom } from '../helpers/random.js';

const rAvailable = requireRInCi();
const mvtnormAvailable = rAvailable && requireRPackageInCi('mvtnorm');

const base: SizingRequest = {
  baseline: { kind: 'proportion', rate: 0.1 },
  direction: 'increase',
  effect: { relative: 0.05 },
  arms: [
    { name: 'control', weight: 50 },
    { name: 'treatment', weight: 50 },
  ],
  control: 'control',
  alpha: 0.05,
  power: 0.8,
  sides: 2,
  trafficShare: 1,
  reach: 1,
  interimLooks: 0,
  boundary: 'obrien-fleming-spending',
  prePeriodCorrelation: 0,
};

describe('unique units by day: the power law through two points', () => {
  it('hand calculation: 20,000 in 7 days and 40,000 in 28 give exponent 1/2, 28,284.27 by day 14, 30,000 by day 16', () => {
    // b = ln(40000/20000) / ln(28/7) = ln 2 / ln 4 = 0.5; U(14) = 20000 * 2^0.5 = 28284.27;
    // U(d) = 30000 at d = 7 * 1.5^2 = 15.75, so the first whole day is 16 (worked by hand).
    const curve = uniqueUnitsCurve([{ days: 28, units: 40000 }, { days: 7, units: 20000 }]);
    expect(curve.ok).toBe(true);
    if (!curve.ok) return;
    expect(curve.value.source).toMatchObject({ exponent: 0.5 });
    expect(curve.value.unitsBy(14)).toBeCloseTo(28284.27, 2);
    expect(curve.value.unitsBy(7)).toBeCloseTo(20000, 6);
    expect(curve.value.unitsBy(28)).toBeCloseTo(40000, 6);
    expect(curve.value.dayFor(30000)).toBe(16);
  });

  it('refuses a curve that shrinks or grows faster than all-new traffic', () => {
    expect(uniqueUnitsCurve([{ days: 7, units: 50000 }, { days: 28, units: 40000 }]).ok).toBe(false);
    expect(uniqueUnitsCurve([{ days: 7, units: 10000 }, { days: 28, units: 50000 }]).ok).toBe(false);
  });

  it('returning units lower the power: 9,000 a day as new units against 60,000 different people in 28 days', () => {
    const asNew = sizeMetric({ ...base, baseline: { kind: 'proportion', rate: 0.22 }, effect: { relative: 0.03 }, sides: 1, dailyUnits: 9000, plannedDays: 28 });
    const asPeople = sizeMetric({ ...base, baseline: { kind: 'proportion', rate: 0.22 }, effect: { relative: 0.03 }, sides: 1, uniqueUnits: [{ days: 7, units: 40000 }, { days: 28, units: 60000 }], plannedDays: 28 });
    expect(asNew.ok && asPeople.ok).toBe(true);
    if (!asNew.ok || !asPeople.ok) return;
    expect(asNew.value.atPlannedEnd!.totalUnits).toBe(252000);
    expect(asPeople.value.atPlannedEnd!.totalUnits).toBe(60000);
    expect(asPeople.value.atPlannedEnd!.power!).toBeLessThan(0.8);
    expect(asNew.value.atPlannedEnd!.power!).toBeGreaterThan(0.99);
  });
});

describe('per-metric settings', () => {
  it('CUPED with a share f of units covered leaves 1 - f rho^2 (rho 0.5, f 0.6: 0.85)', () => {
    expect(varianceReduction(0.5, 0.6)).toBeCloseTo(0.85, 12);
    const full = sizeMetric({ ...base, prePeriodCorrelation: 0.5 });
    const partial = sizeMetric({ ...base, prePeriodCorrelation: 0.5, prePeriodCoverage: 0.6 });
    expect(full.ok && partial.ok).toBe(true);
    if (full.ok && partial.ok) expect(partial.value.multipliers.varianceReduction).toBeCloseTo(0.85, 12);
  });

  it('a guardrail is sized at its own alpha and power, without the arms correction, and without the interim inflation', () => {
    const plan = planSchema.parse({
      id: 'p', title: 'T', owners: ['@a'], flags: ['f'], state: 'draft', hypothesis: { change: 'c', 'expected-direction': 'increase' }, unit: { randomization: 'user' }, surface: { path: 's' },
      metrics: {
        primary: { name: 'm', kind: 'proportion', baseline: { rate: 0.1 }, events: ['e'] },
        guardrails: [
          { name: 'g', kind: 'proportion', baseline: { rate: 0.2 }, events: ['e'], direction: 'decrease', tolerance: { absolute: 0.01 } },
          { name: 'h', kind: 'proportion', baseline: { rate: 0.2 }, events: ['e'], direction: 'decrease', tolerance: { absolute: 0.01 }, alpha: 0.1, power: 0.9 },
        ],
      },
      design: { arms: [{ name: 'control', weight: 1 }, { name: 'a', weight: 1 }, { name: 'b', weight: 1 }], 'min-detectable-effect': { relative: 0.1 }, 'daily-units': 5000, 'interim-looks': 2 },
    });
    const sizing = sizePlan(plan);
    const [, g, h] = sizing.metrics;
    expect(g).toMatchObject({ alpha: 0.05, power: 0.8, sides: 1 });
    expect(h).toMatchObject({ alpha: 0.1, power: 0.9 });
    expect(g!.result.ok && g!.result.value.multipliers).toMatchObject({ alphaPerComparison: 0.05, sequential: 1 });
    // The closed form: n = (z_.95 + z_.8)^2 * 2 * 0.2 * 0.8 / 0.01^2 per arm, three arms.
    const n = Math.ceil(((1.6448536269514722 + 0.8416212335729143) ** 2 * 2 * 0.16) / 0.0001);
    expect(g!.result.ok && g!.result.value.headline!.perArm[0]!.units).toBe(n);
    expect(sizing.family!.noFalseAlarm).toBeCloseTo(sizing.family!.primaryPower * (1 - g!.guardrailLooks!.falseAlarm) * (1 - h!.guardrailLooks!.falseAlarm), 12);
  });
});

describe('several arms: control at sqrt(k) times a treatment arm', () => {
  it('three equal arms: the square-root allocation needs fewer units, and says how many fewer', () => {
    const equal = sizeMetric({ ...base, arms: [{ name: 'control', weight: 1 }, { name: 'a', weight: 1 }, { name: 'b', weight: 1 }] });
    expect(equal.ok).toBe(true);
    if (!equal.ok) return;
    const better = equal.value.squareRootAllocation!;
    expect(better.controlWeight / better.treatmentWeight).toBeCloseTo(Math.SQRT2, 12);
    expect(better.unitsSaved).toBe(equal.value.headline!.totalUnits - better.totalUnits);
    expect(better.unitsSaved).toBeGreaterThan(0);
    const already = sizeMetric({ ...base, arms: [{ name: 'control', weight: Math.SQRT2 }, { name: 'a', weight: 1 }, { name: 'b', weight: 1 }] });
    expect(already.ok && already.value.squareRootAllocation).toBeUndefined();
  });
});

describe.skipIf(!rAvailable)('against R: non-inferiority and whole groups', () => {
  const random = seededRandom(20261203);

  it('non-inferiority of proportions: the closed form of Chow, Shao & Wang sec. 4.2 (from memory), computed in R with qnorm and pnorm', () => {
    const cases = Array.from({ length: 40 }, () => ({ p: 0.02 + random() * 0.9, margin: 0.002 + random() * 0.05, alpha: 0.01 + random() * 0.1, power: 0.6 + random() * 0.35, ratio: 0.5 + random() * 2 }));
    const r = runR(`x <- read.csv("input.csv")
n <- (qnorm(x$alpha, lower.tail = FALSE) + qnorm(x$power))^2 * x$p * (1 - x$p) * (1 + 1 / x$ratio) / x$margin^2
pw <- pnorm(sqrt(2 * n) * x$margin / sqrt(x$p * (1 - x$p) * (1 + 1 / x$ratio)) - qnorm(x$alpha, lower.tail = FALSE))
out <- data.frame(n = n, power = pw)
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => {
      const test = { p: c.p, alpha: c.alpha, ratio: c.ratio };
      const n = nonInferiorityProportionSize(test, c.margin, c.power);
      const power = nonInferiorityProportionPower(test, c.margin, 2 * r[i]!.n!);
      expect(n.ok && power.ok).toBe(true);
      if (n.ok && power.ok) {
        expect(relativeError(n.value, r[i]!.n!)).toBeLessThan(1e-10);
        expect(relativeError(power.value, r[i]!.power!)).toBeLessThan(1e-10);
      }
    });
  });

  it('non-inferiority of means: power.t.test(delta = margin, alternative = "one.sided") (Chow, Shao & Wang sec. 3.2, from memory)', () => {
    const cases = Array.from({ length: 20 }, () => ({ sd: 1 + random() * 30, margin: 0.2 + random() * 3, alpha: 0.01 + random() * 0.1, power: 0.6 + random() * 0.35 }));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(n = sapply(seq_len(nrow(x)), function(i) power.t.test(delta = x$margin[i], sd = x$sd[i], sig.level = x$alpha[i], power = x$power[i], alternative = "one.sided", tol = 1e-13)$n))
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => {
      const n = meanSampleSize({ delta: c.margin, sd: c.sd, alpha: c.alpha, sides: 1, ratio: 1, method: 'exact' }, c.power);
      expect(n.ok && relativeError(n.value, r[i]!.n!)).toBeLessThan(1e-6);
    });
  });

  it('whole groups per arm: the design-effect formula with t quantiles on groups − 2 degrees of freedom, iterated in R', () => {
    const cases = Array.from({ length: 30 }, () => ({ units: Math.ceil(50 + random() * 4000), m: 2 + Math.floor(random() * 40), alpha: 0.05, power: 0.8 }));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(g = sapply(seq_len(nrow(x)), function(i) {
  zs <- qnorm(x$alpha[i] / 2, lower.tail = FALSE) + qnorm(x$power[i])
  g <- max(2, ceiling(x$units[i] / x$m[i] - 1e-9))
  repeat {
    df <- 2 * g - 2
    f <- ((qt(x$alpha[i] / 2, df, lower.tail = FALSE) + qt(x$power[i], df)) / zs)^2
    g2 <- max(2, ceiling(x$units[i] * f / x$m[i] - 1e-9))
    if (g2 == g) break
    g <- g2
  }
  g
}))
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => {
      const groups = wholeGroupsPerArm([{ arm: 'control', units: c.units }, { arm: 'treatment', units: c.units }], c.m, c.alpha, 2, c.power);
      expect(groups.map((g) => g.groups)).toEqual([r[i]!.g!, r[i]!.g!]);
    });
  });
});

describe.skipIf(!mvtnormAvailable)("a guardrail's harm check at each look: the false-alarm rate against mvtnorm", () => {
  it('checked at one-sided 0.05 at 3 and 5 equally spaced analyses: P(some look crosses) from pmvnorm (Miwa)', () => {
    const sizing = (looks: number) =>
      sizePlan(
        planSchema.parse({
          id: 'p', title: 'T', owners: ['@a'], flags: ['f'], state: 'draft', hypothesis: { change: 'c', 'expected-direction': 'increase' }, unit: { randomization: 'user' }, surface: { path: 's' },
          metrics: { primary: { name: 'm', kind: 'proportion', baseline: { rate: 0.1 }, events: ['e'] }, guardrails: [{ name: 'g', kind: 'proportion', baseline: { rate: 0.2 }, events: ['e'], direction: 'decrease', tolerance: { absolute: 0.01 } }] },
          design: { 'interim-looks': looks - 1 },
        }),
      ).metrics[1]!.guardrailLooks!.falseAlarm;
    const r = runR(`library(mvtnorm)
x <- read.csv("input.csv")
out <- data.frame(p = sapply(x$k, function(k) { t <- (1:k) / k; corr <- sqrt(outer(t, t, pmin) / outer(t, t, pmax))
  1 - pmvnorm(lower = rep(-Inf, k), upper = rep(qnorm(0.95), k), corr = corr, algorithm = Miwa(steps = 256)) }))
${WRITE_OUTPUT}`, [{ k: 3 }, { k: 5 }]);
    expect(relativeError(sizing(3), r[0]!.p!)).toBeLessThan(1e-5);
    expect(relativeError(sizing(5), r[1]!.p!)).toBeLessThan(1e-5);
  });
});

describe("a guardrail's false-alarm rate is computed once per design", () => {
  // Sizing remembers the rate for each (analyses, α) pair; a remembered rate must be the one for that pair only.
  // Checking at every one of K looks can only raise the chance of a false alarm above α, and more looks or a larger α
  // raise it further (common practice, no source).
  const falseAlarm = (looks: number, alpha: number) =>
    sizePlan(
      planSchema.parse({
        id: 'p', title: 'T', owners: ['@a'], flags: ['f'], state: 'draft', hypothesis: { change: 'c', 'expected-direction': 'increase' }, unit: { randomization: 'user' }, surface: { path: 's' },
        metrics: { primary: { name: 'm', kind: 'proportion', baseline: { rate: 0.1 }, events: ['e'] }, guardrails: [{ name: 'g', kind: 'proportion', baseline: { rate: 0.2 }, events: ['e'], direction: 'decrease', tolerance: { absolute: 0.01 }, alpha }] },
        design: { 'interim-looks': looks - 1 },
      }),
    ).metrics[1]!.guardrailLooks!.falseAlarm;
  it('keeps the rates of different designs apart, in any order', () => {
    const first = [falseAlarm(3, 0.05), falseAlarm(3, 0.1), falseAlarm(4, 0.05), falseAlarm(3, 0.05)];
    expect(first[3]).toBe(first[0]);
    expect(first[0]).toBeGreaterThan(0.05);
    expect(first[1]).toBeGreaterThan(first[0]!);
    expect(first[2]).toBeGreaterThan(first[0]!);
    expect([falseAlarm(4, 0.05), falseAlarm(3, 0.1)]).toEqual([first[2], first[1]]);
  });
});
