import type { AdjustedPValues } from '../stats/multiple-testing.js';
import type { SampleRatioCheck } from '../stats/srm.js';
import { formatCount } from './numbers.js';
import { formatTable } from './terminal-style.js';

export const SRM_JSON_FORMAT = 'plumbline.srm/1';
export const ADJUST_JSON_FORMAT = 'plumbline.adjusted-p/1';

function formatP(p: number): string {
  if (p < 1e-12) return '< 1e-12';
  return p < 0.001 ? p.toExponential(2) : p.toFixed(4);
}

export function renderSrmText(check: SampleRatioCheck, observed: readonly number[], weights: readonly number[], threshold: number): string {
  const total = observed.reduce((a, b) => a + b, 0);
  const weightSum = weights.reduce((a, b) => a + b, 0);
  const rows = observed.map((o, i) => [
    `arm ${i + 1}`,
    `${((weights[i]! / weightSum) * 100).toFixed(1)}%`,
    formatCount(o),
    formatCount(check.expected[i]!),
    `${((o / total) * 100).toFixed(2)}%`,
  ]);
  const verdict = check.mismatch
    ? `Sample ratio mismatch: p = ${formatP(check.pValue)} < ${threshold}. Do not read the results: find out why assignment or logging lost units first.`
    : `No sample ratio mismatch: p = ${formatP(check.pValue)} (alarm below ${threshold}).`;
  return [formatTable(['ARM', 'PLANNED', 'OBSERVED', 'EXPECTED', 'SHARE'], rows), '', `chi-square = ${check.statistic.toFixed(3)} on ${check.degreesOfFreedom} df. ${verdict}`].join('\n');
}

export function renderAdjustedText(pValues: readonly number[], adjusted: AdjustedPValues, q: number): string {
  const { benjaminiHochberg: bh, holm, bonferroni } = adjusted;
  const rows = pValues.map((p, i) => [String(i + 1), formatP(p), formatP(bh[i]!), bh[i]! <= q ? 'yes' : 'no', formatP(holm[i]!), holm[i]! <= q ? 'yes' : 'no', formatP(bonferroni[i]!), bonferroni[i]! <= q ? 'yes' : 'no']);
  const found = (list: readonly number[]) => list.filter((x) => x <= q).length;
  return [
    formatTable(['#', 'P', 'BH-ADJUSTED', `BH ≤ ${q}`, 'HOLM', `HOLM ≤ ${q}`, 'BONFERRONI', `BONF ≤ ${q}`], rows),
    '',
    `At ${q}: Benjamini-Hochberg (false discovery rate) finds ${found(bh)} of ${pValues.length} significant; Holm (any false alarm, step-down) finds ${found(holm)}; Bonferroni (any false alarm) finds ${found(bonferroni)}.`,
  ].join('\n');
}
