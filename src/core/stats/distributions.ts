import jstatModule from 'jstat';

const { jStat } = jstatModule;

/**
 * The distribution functions the engine uses, from jstat except where its precision falls short.
 * Tails are computed as tails, never as 1 - cdf, which would lose every digit of a small tail
 * probability.
 */

/**
 * P(Z > x) for a standard normal Z, to about 1e-14 relative for every x until it underflows
 * (x near 38). jstat's erfc is exact to 1e-13 below x = 3 but loses digits beyond (1.5e-5
 * relative at x = 7, 0 beyond x = 8.5), so the far tail comes from Laplace's continued fraction
 * for the Mills ratio, Q(x) = phi(x) / (x + 1/(x + 2/(x + 3/(x + ...)))), evaluated by the
 * modified Lentz method (Press et al., Numerical Recipes, 3rd ed., sec. 5.2); it converges in a
 * few dozen terms from x = 3 on. Checked against R's pnorm(lower.tail = FALSE) in
 * test/stats/practice-r.test.ts.
 */
export function normalUpper(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  if (x < 3) return 0.5 * jStat.erfc(x / Math.SQRT2);
  const mills = continuedFraction(x, (i) => i, () => x);
  return Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI) / mills;
}

/**
 * b0 + a1 / (b1 + a2 / (b2 + ...)) by the modified Lentz method (Press et al., Numerical Recipes,
 * 3rd ed., sec. 5.2), until a term changes the value by less than a double can show.
 */
function continuedFraction(b0: number, a: (i: number) => number, b: (i: number) => number): number {
  const tiny = 1e-300;
  let f = b0 === 0 ? tiny : b0;
  let c = f;
  let d = 0;
  for (let i = 1; i < 10_000; i++) {
    d = b(i) + a(i) * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = b(i) + a(i) / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const step = c * d;
    f *= step;
    if (Math.abs(step - 1) < 1e-16) break;
  }
  return f;
}

export function normalCdf(x: number): number {
  return x < 0 ? normalUpper(-x) : 1 - normalUpper(x);
}

/** The standard normal quantile: P(Z <= q) = p. */
export function normalQuantile(p: number): number {
  return jStat.normal.inv(p, 0, 1);
}

/** The point with upper tail p: P(Z > q) = p, from p itself rather than from 1 - p. */
export function normalUpperQuantile(p: number): number {
  return -normalQuantile(p);
}

/** The Student t quantile with `df` degrees of freedom. */
export function studentQuantile(p: number, df: number): number {
  return jStat.studentt.inv(p, df);
}

/**
 * P(T > x) for a noncentral t with `df` degrees of freedom and noncentrality `ncp`.
 * jstat sums the series of Lenth (1989) AS 243; measured against R's pt() to ~4e-8 relative
 * over df 4..1e6 and ncp 0.5..40 (test/stats/r-crosscheck.test.ts). The series gives the lower
 * tail only, so this one upper tail is a difference; it is only ever asked for a power (an upper
 * tail above the significance level), never for a small p-value, where the difference is exact
 * to the digits shown.
 */
export function noncentralTUpper(x: number, df: number, ncp: number): number {
  return 1 - jStat.noncentralt.cdf(x, df, ncp);
}

/** P(X > x) for a chi-square with `df` degrees of freedom. */
export function chiSquareUpper(x: number, df: number): number {
  if (x <= 0) return 1;
  // With one degree of freedom the normal tail keeps full precision for tiny p-values.
  if (df === 1) return 2 * normalUpper(Math.sqrt(x));
  return upperRegularizedGamma(df / 2, x / 2);
}

/**
 * Q(a, x) = Gamma(a, x) / Gamma(a), the upper regularized incomplete gamma function. Below
 * x = a + 1 the lower series converges fast and its complement loses nothing (Q is then above
 * about 0.3); beyond, Q comes straight from Legendre's continued fraction, evaluated by the
 * modified Lentz method (Press et al., Numerical Recipes, 3rd ed., sec. 6.2), so a tail of 1e-40
 * keeps its digits.
 */
export function upperRegularizedGamma(a: number, x: number): number {
  if (x <= 0) return 1;
  if (x < a + 1) return Math.max(0, 1 - jStat.lowRegGamma(a, x));
  // 1 / (x + 1 - a - 1(1 - a) / (x + 3 - a - 2(2 - a) / (x + 5 - a - ...))), Numerical Recipes' gcf.
  const h = continuedFraction(0, (i) => (i === 1 ? 1 : -(i - 1) * (i - 1 - a)), (i) => x + 1 - a + 2 * (i - 1));
  return Math.exp(-x + a * Math.log(x) - (jStat as unknown as { gammaln(a: number): number }).gammaln(a)) * h;
}

/** P(T > x) for a Student t with `df` degrees of freedom (a normal tail when df is very large). */
export function studentUpper(x: number, df: number): number {
  if (df > 1e7) return normalUpper(x);
  return x < 0 ? 1 - jStat.studentt.cdf(-x, df) : jStat.studentt.cdf(-x, df);
}
