import { describe, expect, it } from 'vitest';
import { chiSquareUpper, normalUpper } from '../../src/core/stats/distributions.js';
import { holmAdjust } from '../../src/core/stats/multiple-testing.js';
import { sequentialBoundaries, spentByTime } from '../../src/core/stats/sequential.js';
import { requireRInCi, runR } from '../helpers/r.js';
import { relativeError, requireRPackageInCi, WRITE_OUTPUT } from '../helpers/r-packages.js';
import { seededRandom } from '../helpers/random.js';

/**
 * Cross-checks of the sizing conventions against R (r-base-core) and R's mvtnorm package (Debian's
 * r-cran-mvtnorm, installed by .ci/run). Each reference is named beside its check.
 */
const rAvailable = requireRInCi();
const mvtnormAvailable = rAvailable && requireRPackageInCi('mvtnorm');


describe.skipIf(!rAvailable)('against R: upper tails and Holm', () => {
  const random = seededRandom(20261202);

  it('p.adjust(method = "holm") over 20 random sets of p-values, ties and ones included', () => {
    const sets = Array.from({ length: 20 }, (_, s) => Array.from({ length: 9 }, (_, j) => (s % 5 === 0 && j < 3 ? 0.01 : j === 8 ? 1 : random() ** 3)));
    const rows = sets.flatMap((set, s) => set.map((p) => ({ set: s, p })));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(adj = ave(x$p, x$set, FUN = function(p) p.adjust(p, "holm")))
${WRITE_OUTPUT}`, rows);
    sets.forEach((set, s) => {
      const ours = holmAdjust(set);
      expect(ours.ok).toBe(true);
      if (!ours.ok) return;
      ours.value.forEach((adj, j) => expect(relativeError(adj, r[s * 9 + j]!.adj!)).toBeLessThan(1e-12));
    });
  });

  it('normal upper tails from 1e-3 to 1e-300 against pnorm(lower.tail = FALSE), to 1e-12 relative', () => {
    const cases = Array.from({ length: 80 }, (_, i) => ({ x: -3 + i * 0.5 }));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(p = pnorm(x$x, lower.tail = FALSE))
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => expect(relativeError(normalUpper(c.x), r[i]!.p!)).toBeLessThan(1e-12));
  });

  it('chi-square upper tails down to 1e-200 against pchisq(lower.tail = FALSE), to 1e-9 relative', () => {
    const cases = Array.from({ length: 60 }, () => ({ df: 2 + Math.floor(random() * 30), x: 40 + random() * 900 }));
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(p = pchisq(x$x, x$df, lower.tail = FALSE))
${WRITE_OUTPUT}`, cases);
    cases.forEach((c, i) => {
      if (r[i]!.p! > 1e-300) expect(relativeError(chiSquareUpper(c.x, c.df), r[i]!.p!)).toBeLessThan(1e-9);
    });
  });
});

describe.skipIf(!mvtnormAvailable)("O'Brien-Fleming-type spending with 10 to 20 interim looks, against R", () => {
  // Analyses = interim looks + 1. With 12 interim looks the first boundary is 7.9965; with 14 to 20, 8.60 to 10.20.
  for (const looks of [11, 13, 15, 18, 21]) {
    it(`${looks - 1} interim looks (${looks} analyses), alpha 0.05 two-sided: the first boundary from qnorm, and the alpha spent from mvtnorm::pmvnorm`, () => {
      const design = sequentialBoundaries({ kind: 'obrien-fleming-spending', looks, alpha: 0.05, sides: 2 });
      expect(design.ok).toBe(true);
      if (!design.ok) return;
      const { z, nominalP } = design.value;
      // Looks 2 to 6 by Miwa's algorithm (within about 1e-10 in so few dimensions; Genz-Bretz is off by
      // several per cent there while reporting a tiny error); the last look's total by Genz-Bretz within
      // four times the error it reports.
      const checked = [2, 3, 4, 5, 6, looks];
      const r = runR(
        `library(mvtnorm)
set.seed(20261202)
z <- c(${z.map((v) => v.toPrecision(17)).join(', ')})
K <- length(z); t <- (1:K) / K
first <- qnorm(2 * pnorm(qnorm(0.0125, lower.tail = FALSE) / sqrt(t[1]), lower.tail = FALSE), lower.tail = FALSE)
x <- read.csv("input.csv")
out <- data.frame(k = x$k, spent = 0, error = 0, first = first, firstP = 2 * pnorm(first, lower.tail = FALSE))
for (i in seq_len(nrow(x))) {
  k <- x$k[i]; tt <- t[1:k]
  corr <- sqrt(outer(tt, tt, pmin) / outer(tt, tt, pmax))
  method <- if (k <= 6) Miwa(steps = 256) else GenzBretz(maxpts = 4e5, abseps = 1e-10, releps = 0)
  p <- pmvnorm(lower = -z[1:k], upper = z[1:k], corr = corr, algorithm = method)
  out$spent[i] <- 1 - p; out$error[i] <- if (k <= 6) 0 else attr(p, "error")
}
${WRITE_OUTPUT}`,
        checked.map((k) => ({ k })),
      );
      // The first look: exact values from R's qnorm and pnorm.
      expect(relativeError(z[0]!, r[0]!.first!)).toBeLessThan(1e-9);
      expect(relativeError(nominalP[0]!, r[0]!.firstP!)).toBeLessThan(1e-7);
      expect(nominalP[0]!).toBeGreaterThan(0);
      r.forEach((row) => {
        const promised = 2 * spentByTime('obrien-fleming-spending', 0.025, row.k! / looks);
        const allowed = row.k! <= 6 ? 2e-5 * promised + 1e-10 : 4 * row.error! + 1e-6;
        expect.soft(Math.abs(row.spent! - promised)).toBeLessThan(allowed);
      });
    }, 180_000);
  }

  it("the classical O'Brien-Fleming boundary with 20 looks: nominal p from the upper tail, never 0", () => {
    const design = sequentialBoundaries({ kind: 'obrien-fleming', looks: 20, alpha: 0.05, sides: 2 });
    expect(design.ok).toBe(true);
    if (!design.ok) return;
    const r = runR(`x <- read.csv("input.csv")
out <- data.frame(p = 2 * pnorm(x$z, lower.tail = FALSE))
${WRITE_OUTPUT}`, design.value.z.map((z) => ({ z: z.toPrecision(17) })));
    design.value.nominalP.forEach((p, i) => expect(relativeError(p, r[i]!.p!)).toBeLessThan(1e-9));
  });
});
