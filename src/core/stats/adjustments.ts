/**
 * Multipliers on the sample a design needs. Each is >= 1 (or <= 1 for variance reduction) and
 * multiplies the number of analysis units that an individually randomized, fixed-horizon test
 * without covariates would need.
 */

/**
 * Design effect of randomizing groups of mean size m with intra-cluster correlation icc:
 * Kish (1965): 1 + (m - 1) * icc; with cluster sizes of coefficient of variation cv,
 * Eldridge, Ashby & Kerry (2006): 1 + ((cv^2 + 1) * m - 1) * icc, which is Kish's at cv = 0.
 */
export function designEffect(meanSize: number, icc: number, sizeCv = 0): number {
  return Math.max(1, 1 + ((sizeCv * sizeCv + 1) * meanSize - 1) * icc);
}

/**
 * Variance left after adjusting for a pre-period covariate with correlation rho
 * (CUPED; Deng, Xu, Kohavi & Walker 2013): 1 - rho^2 when every unit has a pre-period value.
 * Units without one (new users) gain nothing, so with a share f covered the variance left is
 * 1 - f rho^2 (the covered units' variance shrinks by rho^2, the rest keep theirs).
 */
export function varianceReduction(rho: number, coverage = 1): number {
  return 1 - coverage * rho * rho;
}

/**
 * Bonferroni: with k treatment arms each compared with the control, each comparison is tested
 * at alpha / k so that the chance of any false alarm stays at most alpha.
 */
export function bonferroniAlpha(alpha: number, comparisons: number): number {
  return alpha / Math.max(1, comparisons);
}
