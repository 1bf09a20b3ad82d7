import type { AdjustedPValues } from '../stats/multiple-testing.js';
import type { SampleRatioCheck } from '../stats/srm.js';
import { formatCount } from './numbers.js';
import { formatP as formatPCell, statePValue } from './readout-figures.js';
import { formatTable } from './terminal-style.js';

export const SRM_JSON_FORMAT = 'plumbline.srm/1';
export const ADJUST_JSON_FORMAT = 'plumbline.adjusted-p/1';

/** The srm and adjust commands show one more decimal than a readout's tables. */
const P_DECIMALS = 4;
const formatP = (p: number) => formatPCell(p, P_DECIMALS);

export function renderSrmText(check: SampleRatioCheck, observed: readonly number[], threshold: number): string {
  const total = observed.reduce((a, b) => a + b, 0);
  // The planned share from the expected count: summing weights near the largest double would overflow.
  const rows = observed.map((o, i) => [
    `arm ${i + 1}`,
    `${((check.expected[i]! / total) * 100).toFixed(1)}%`,
    formatCount(o),
    formatExpected(check.expected[i]!),
    `${((o / total) * 100).toFixed(2)}%`,
  ]);
  const verdict = check.mismatch
    ? `Sample ratio mismatch: ${statePValue(check.pValue, P_DECIMALS)} (alarm below ${threshold}). Do not read the results: find out why assignment or logging lost units first.`
    : `No sample ratio mismatch: ${statePValue(check.pValue, P_DECIMALS)} (alarm below ${threshold}).`;
  return [formatTable(['ARM', 'PLANNED', 'OBSERVED', 'EXPECTED', 'SHARE'], rows), '', `chi-square = ${formatStatistic(check.statistic)} on ${check.degreesOfFreedom} df. ${verdict}`].join('\n');
}

/** An expected count is rarely whole: 2.5 units, not 3. */
function formatExpected(n: number): string {
  return n < 1e15 ? n.toLocaleString('en-US', { maximumFractionDigits: 1 }) : formatCount(n);
}

/** Fixed decimals up to a billion; beyond, toFixed would write every digit of a huge statistic. */
function formatStatistic(x: number): string {
  return x < 1e9 ? x.toFixed(3) : x.toExponential(3);
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
