import { fail, ok, type StatsResult } from './result.js';

/**
 * Benjamini & Hochberg (1995) step-up adjustment: adjusted p-values as R's
 * p.adjust(p, method = "BH") returns them; a hypothesis is rejected at false discovery rate q when
 * its adjusted p-value is <= q.
 */
export function benjaminiHochberg(pValues: readonly number[]): StatsResult<number[]> {
  if (pValues.some((p) => !(p >= 0 && p <= 1))) return fail('p-values', 'every p-value must lie in [0, 1]');
  const m = pValues.length;
  const order = pValues.map((p, i) => ({ p, i })).sort((a, b) => b.p - a.p);
  const adjusted = new Array<number>(m);
  let running = 1;
  order.forEach(({ p, i }, rankFromTop) => {
    const rank = m - rankFromTop;
    running = Math.min(running, (p * m) / rank);
    adjusted[i] = running;
  });
  return ok(adjusted);
}

/** Bonferroni-adjusted p-values, as p.adjust(p, method = "bonferroni"). */
export function bonferroniAdjust(pValues: readonly number[]): StatsResult<number[]> {
  if (pValues.some((p) => !(p >= 0 && p <= 1))) return fail('p-values', 'every p-value must lie in [0, 1]');
  return ok(pValues.map((p) => Math.min(1, p * pValues.length)));
}

/**
 * Holm (1979) step-down adjustment: adjusted p-values as R's p.adjust(p, method = "holm") returns
 * them. The smallest p-value is multiplied by m, the next by m - 1, and so on, each adjusted value
 * at least the one before it; it controls the family-wise error rate like Bonferroni and never
 * rejects less.
 */
export function holmAdjust(pValues: readonly number[]): StatsResult<number[]> {
  if (pValues.some((p) => !(p >= 0 && p <= 1))) return fail('p-values', 'every p-value must lie in [0, 1]');
  const m = pValues.length;
  const order = pValues.map((p, i) => ({ p, i })).sort((a, b) => a.p - b.p);
  const adjusted = new Array<number>(m);
  let running = 0;
  order.forEach(({ p, i }, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * p));
    adjusted[i] = running;
  });
  return ok(adjusted);
}

export interface AdjustedPValues {
  benjaminiHochberg: number[];
  holm: number[];
  bonferroni: number[];
}

/** Every adjustment the `adjust` command prints, or the first input problem. */
export function adjustPValues(pValues: readonly number[]): StatsResult<AdjustedPValues> {
  const bh = benjaminiHochberg(pValues);
  const holm = holmAdjust(pValues);
  const bonferroni = bonferroniAdjust(pValues);
  if (!bh.ok) return bh;
  if (!holm.ok) return holm;
  if (!bonferroni.ok) return bonferroni;
  return ok({ benjaminiHochberg: bh.value, holm: holm.value, bonferroni: bonferroni.value });
}
