import { describe, expect, it } from 'vitest';
import { chiSquareUpper, noncentralTUpper, normalQuantile, studentQuantile } from '../../src/core/stats/distributions.js';
import { meanPower, meanSampleSize } from '../../src/core/stats/mean.js';
import { benjaminiHochberg } from '../../src/core/stats/multiple-testing.js';
import { proportionPower, proportionSampleSize } from '../../src/core/stats/proportion.js';
import { sampleRatioMismatch } from '../../src/core/stats/srm.js';
import { requireRInCi, runR } from '../helpers/r.js';
import { seededRandom } from '../helpers/random.js';

/**
 * Cross-checks against R itself (Debian's r-base-core, installed by .ci/run): R's stats functions
 * compute the reference value for every random parameter set. R's root finder is run with a tight
 * tolerance (tol = 1e-13) so that its answers are exact to the digits compared.
 */
const rAvailable = requireRInCi();
const TOLERANCE = 1e-6;

function relativeError(ours: number, theirs: number): number {
  return Math.abs(ours - theirs) / Math.max(Math.abs(theirs), 1e-300);
}

const WRITE_OUTPUT = `
out[] <- lapply(out, function(x) sprintf("%.17g", x))
write.csv(out, "output.csv", row.names = FALSE, quote = FALSE)
`;

describe.skipIf(!rAvailable)('against R', () => {
  const random = seededRandom(20261201);
  const uniform = (lo: number, hi: number) => lo + (hi - lo) * random();

  it('power.prop.test: n for a power, and power for an n, over 120 random designs', () => {
    const cases = [];
    while (cases.length < 120) {
      const p1 = uniform(0.01, 0.9);
      const p2 = p1 * (1 + (random() < 0.5 ? -1 : 1) * uniform(0.02, 0.6));
      if (!(p2 > 0.001 && p2 < 0.999)) continue;
      cases.push({ p1, p2, alpha: uniform(0.005, 0.2), power: uniform(0.55, 0.99), sides: random() < 0.5 ? 1 : 2, scale: uniform(0.3, 2) });
    }
    const r = runR(
      `x <- read.csv("input.csv")
out <- data.frame(n = numeric(nrow(x)), power = numeric(nrow(x)))
for (i in seq_len(nrow(x))) {
  alt <- if (x$sides[i] == 2) "two.sided" else "one.sided"
  n <- power.prop.test(p1 = x$p1[i], p2 = x$p2[i], sig.level = x$alpha[i], power = x$power[i], alternative = alt, tol = 1e-13)$n
  out$n[i] <- n
  out$power[i] <- power.prop.test(n = n * x$scale[i], p1 = x$p1[i], p2 = x$p2[i], sig.level = x$alpha[i], alternative = alt)$power
}
${WRITE_OUTPUT}`,
      cases,
    );
    let worst = 0;
    cases.forEach((c, i) => {
      const test = { p1: c.p1, p2: c.p2, alpha: c.alpha, sides: c.sides as 1 | 2, ratio: 1 };
      const n = proportionSampleSize(test, c.power);
      const power = proportionPower(test, r[i]!.n! * c.scale);
      expect(n.ok && power.ok).toBe(true);
      if (!n.ok || !power.ok) return;
      worst = Math.max(worst, relativeError(n.value, r[i]!.n!), relativeError(power.value, r[i]!.power!));
    });
    expect(worst).toBeLessThan(TOLERANCE);
  });

  it('power.t.test (two-sample, exact noncentral t): n for a power, and power for an n, over 100 random designs', () => {
    const cases = Array.from({ length: 100 }, () => {
      const sd = uniform(0.5, 50);
      return { delta: sd * uniform(0.08, 1.5), sd, alpha: uniform(0.005, 0.2), power: uniform(0.55, 0.99), sides: random() < 0.5 ? 1 : 2, scale: uniform(0.3, 2) };
    });
    const r = runR(
      `x <- read.csv("input.csv")
out <- data.frame(n = numeric(nrow(x)), power = numeric(nrow(x)))
for (i in seq_len(nrow(x))) {
  alt <- if (x$sides[i] == 2) "two.sided" else "one.sided"
  n <- power.t.test(delta = x$delta[i], sd = x$sd[i], sig.level = x$alpha[i], power = x$power[i], alternative = alt, tol = 1e-13)$n
  out$n[i] <- n
  out$power[i] <- power.t.test(n = max(2, n * x$scale[i]), delta = x$delta[i], sd = x$sd[i], sig.level = x$alpha[i], alternative = alt)$power
}
${WRITE_OUTPUT}`,
      cases,
    );
    let worst = 0;
    cases.forEach((c, i) => {
      const test = { delta: c.delta, sd: c.sd, alpha: c.alpha, sides: c.sides as 1 | 2, ratio: 1, method: 'exact' as const };
      const n = meanSampleSize(test, c.power);
      const power = meanPower(test, Math.max(2, r[i]!.n! * c.scale));
      expect(n.ok && power.ok).toBe(true);
      if (!n.ok || !power.ok) return;
      worst = Math.max(worst, relativeError(n.value, r[i]!.n!), relativeError(power.value, r[i]!.power!));
    });
    expect(worst).toBeLessThan(TOLERANCE);
  });

  it('unequal allocation: the pooled t test power from R’s pt and qt, over 40 random designs', () => {
    // R's power.t.test has no unequal arms; the reference is the same test written with R's own
    // noncentral t: df = n1 + n2 - 2, ncp = delta / (sd * sqrt(1/n1 + 1/n2)).
    const cases = Array.from({ length: 40 }, () => ({ n1: Math.round(uniform(5, 5000)), ratio: uniform(0.2, 4), d: uniform(0.05, 1), alpha: uniform(0.01, 0.1), sides: random() < 0.5 ? 1 : 2 }));
    const r = runR(
      `x <- read.csv("input.csv")
n2 <- x$n1 * x$ratio
df <- x$n1 + n2 - 2
ncp <- x$d / sqrt(1 / x$n1 + 1 / n2)
out <- data.frame(power = pt(qt(x$alpha / x$sides, df, lower.tail = FALSE), df, ncp = ncp, lower.tail = FALSE))
${WRITE_OUTPUT}`,
      cases,
    );
    cases.forEach((c, i) => {
      const p = meanPower({ delta: c.d, sd: 1, alpha: c.alpha, sides: c.sides as 1 | 2, ratio: c.ratio, method: 'exact' }, c.n1);
      expect(p.ok && relativeError(p.value, r[i]!.power!)).toBeLessThan(TOLERANCE);
    });
  });

  it('chisq.test goodness of fit (sample ratio mismatch), over 60 random splits', () => {
    const cases = Array.from({ length: 60 }, () => {
      const arms = 2 + Math.floor(random() * 4);
      const weights = Array.from({ length: 5 }, (_, i) => (i < arms ? Math.round(uniform(1, 100)) : 0));
      const total = Math.round(uniform(200, 200000));
      const skew = uniform(0, 0.03);
      const counts = weights.map((w, i) => (i < arms ? Math.max(0, Math.round(((total * w) / weights.reduce((a, b) => a + b, 0)) * (1 + (random() - 0.5) * 2 * skew))) : 0));
      return { arms, w1: weights[0]!, w2: weights[1]!, w3: weights[2]!, w4: weights[3]!, w5: weights[4]!, c1: counts[0]!, c2: counts[1]!, c3: counts[2]!, c4: counts[3]!, c5: counts[4]! };
    });
    const r = runR(
      `x <- read.csv("input.csv")
out <- data.frame(p = numeric(nrow(x)), stat = numeric(nrow(x)))
for (i in seq_len(nrow(x))) {
  k <- x$arms[i]
  counts <- as.numeric(x[i, c("c1", "c2", "c3", "c4", "c5")])[1:k]
  w <- as.numeric(x[i, c("w1", "w2", "w3", "w4", "w5")])[1:k]
  t <- chisq.test(counts, p = w / sum(w))
  out$p[i] <- t$p.value
  out$stat[i] <- t$statistic
}
${WRITE_OUTPUT}`,
      cases,
    );
    cases.forEach((c, i) => {
      const counts = [c.c1, c.c2, c.c3, c.c4, c.c5].slice(0, c.arms);
      const weights = [c.w1, c.w2, c.w3, c.w4, c.w5].slice(0, c.arms);
      const ours = sampleRatioMismatch(counts, weights);
      expect(ours.ok).toBe(true);
      if (!ours.ok) return;
      expect(relativeError(ours.value.statistic, r[i]!.stat!)).toBeLessThan(TOLERANCE);
      // Relative agreement where the p-value is representable; below 1e-8 both are "certainly a mismatch".
      const reference = r[i]!.p!;
      if (reference > 1e-8) expect(relativeError(ours.value.pValue, reference)).toBeLessThan(TOLERANCE);
      else expect(ours.value.pValue).toBeLessThan(1e-7);
    });
  });

  it('chi-square upper tail against pchisq for df 1 to 30', () => {
    const cases = Array.from({ length: 60 }, () => ({ df: 1 + Math.floor(random() * 30), x: uniform(0.01, 60) }));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(p = pchisq(x$x, x$df, lower.tail = FALSE))
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => {
      const reference = r[i]!.p!;
      if (reference > 1e-8) expect(relativeError(chiSquareUpper(c.x, c.df), reference)).toBeLessThan(TOLERANCE);
    });
  });

  it('jstat’s noncentral t, t quantile and normal quantile against pt, qt and qnorm', () => {
    const cases = [4, 10, 38, 100, 1000, 1e4, 1e5, 1e6].flatMap((df) => [0.5, 2, 3.5, 8].map((ncp) => ({ df, ncp, p: uniform(0.0001, 0.9999) })));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(upper = pt(qt(0.975, x$df), x$df, ncp = x$ncp, lower.tail = FALSE), qt = qt(x$p, x$df), qnorm = qnorm(x$p))
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => {
      expect(relativeError(noncentralTUpper(studentQuantile(0.975, c.df), c.df, c.ncp), r[i]!.upper!)).toBeLessThan(TOLERANCE);
      expect(relativeError(studentQuantile(c.p, c.df), r[i]!.qt!)).toBeLessThan(TOLERANCE);
      expect(relativeError(normalQuantile(c.p), r[i]!.qnorm!)).toBeLessThan(1e-9);
    });
  });

  it('p.adjust(method = "BH") over 20 random sets of p-values', () => {
    const sets = Array.from({ length: 20 }, () => Array.from({ length: 12 }, () => random() ** 3));
    const rows = sets.flatMap((set, s) => set.map((p) => ({ set: s, p })));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(adj = ave(x$p, x$set, FUN = function(p) p.adjust(p, "BH")))
${WRITE_OUTPUT}`, rows);
    sets.forEach((set, s) => {
      const ours = benjaminiHochberg(set);
      expect(ours.ok).toBe(true);
      if (!ours.ok) return;
      ours.value.forEach((adj, j) => expect(relativeError(adj, r[s * 12 + j]!.adj!)).toBeLessThan(TOLERANCE));
    });
  });
});
