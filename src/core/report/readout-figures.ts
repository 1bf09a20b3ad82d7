import type { ArmRead, MetricRead, Readout, Verdict } from '../readout/build-readout.js';
import type { Interval } from '../readout/compare.js';
import { formatCount, formatRate, formatValue } from './numbers.js';

/**
 * The figures of a readout as words and cells, shared by the text and Markdown renderers.
 * Absolute beside relative, always, with the units behind them: percentage points for proportions,
 * the metric's own units for means and ratios.
 */

export const VERDICT_LABEL: Record<Verdict, string> = {
  win: 'win',
  loss: 'loss',
  flat: 'flat',
  inconclusive: 'inconclusive',
  'guardrail-breach': 'guardrail breach',
  'not-read': 'not read',
};

/** A p-value as a table cell: "0.012", "3.1e-5", or "< 1e-12" below what the tail computations resolve. */
export function formatP(p: number, decimals = 3): string {
  if (p < 1e-12) return '< 1e-12';
  return p < 0.001 ? p.toExponential(decimals - 2) : p.toFixed(decimals);
}

/** A p-value in a sentence: "p = 0.012", or "p < 1e-12" (one comparison, never "p = < 1e-12"). */
export function statePValue(p: number, decimals = 3): string {
  return p < 1e-12 ? 'p < 1e-12' : `p = ${formatP(p, decimals)}`;
}

function sig(x: number, digits = 3): string {
  if (x === 0) return '0';
  const text = Math.abs(x) < 1e-3 ? x.toExponential(2) : Number(x.toPrecision(digits)).toLocaleString('en-US', { maximumFractionDigits: 8 });
  return x > 0 ? `+${text}` : text;
}

/** A value of the metric: a rate for proportions, the metric's units otherwise. */
export function metricValue(read: MetricRead, value: number): string {
  return read.kind === 'proportion' ? formatRate(value) : formatValue(value);
}

/** A difference of the metric with its unit: percentage points for proportions. */
export function metricDifference(read: MetricRead, value: number): string {
  return read.kind === 'proportion' ? `${sig(value * 100)} pp` : sig(value, 4);
}

function intervalOf(read: MetricRead, interval: Interval): string {
  const ends = read.kind === 'proportion' ? [interval.low * 100, interval.high * 100] : [interval.low, interval.high];
  return `[${sig(ends[0]!)}, ${sig(ends[1]!)}]`;
}

export function relativeText(value: number): string {
  return `${sig(value * 100)}%`;
}

/** Cells for one treatment arm of one metric: control, treatment, difference [interval], relative [interval], p, adjusted p. */
export function armCells(read: MetricRead, arm: ArmRead): string[] {
  const c = arm.comparison;
  if (!c) return [arm.arm, '—', '—', `not computed: ${arm.reason ?? 'no data'}`, '', '', ''];
  const relative = c.relative ? `${relativeText(c.relative.value)} [${relativeText(c.relative.interval.low)}, ${relativeText(c.relative.interval.high)}]` : 'none (control is 0)';
  return [
    arm.arm,
    `${metricValue(read, c.control.value)} (n ${formatCount(c.control.n)})`,
    `${metricValue(read, c.treatment.value)} (n ${formatCount(c.treatment.n)})`,
    `${metricDifference(read, c.difference)} ${intervalOf(read, c.interval)}`,
    relative,
    formatP(c.pValue),
    arm.adjustedP !== undefined ? formatP(arm.adjustedP) : formatP(c.pValue),
  ];
}

export function confidenceOf(read: MetricRead): string {
  const c = read.arms.find((a) => a.comparison)?.comparison;
  return c ? `${Number((c.confidence * 100).toPrecision(4))}%` : '';
}

export function guardrailClassText(arm: ArmRead, read: MetricRead): string {
  if (!arm.guardrailClass || !arm.harm) return 'not computed';
  const bound = `harm at most ${metricDifference(read, arm.harm.upperBound)}`;
  const tolerance = read.tolerance !== undefined ? ` (tolerance ${metricDifference(read, read.tolerance).replace(/^\+/, '')})` : ' (no tolerance registered)';
  if (arm.guardrailClass === 'breach') return `BREACH: harm is significant; ${bound}`;
  if (arm.guardrailClass === 'harm-ruled-out') return `harm ruled out: ${bound}${tolerance}`;
  return `harm not ruled out: ${bound}${tolerance}`;
}

/** The one-line statement of the rule applied, without markup. */
export function ruleLine(readout: Readout): { label: string; arms: string; quote?: string } {
  const arms = readout.verdictArms.length && readout.treatments.length > 1 ? ` (${readout.verdictArms.join(', ')})` : '';
  return { label: VERDICT_LABEL[readout.verdict], arms, ...(readout.decision ? { quote: readout.decision.text } : {}) };
}

export function srmLine(readout: Readout): string | undefined {
  const srm = readout.srm;
  if (!srm) return undefined;
  const split = srm.arms.map((a) => formatCount(a.units)).join(' / ');
  const weights = srm.arms.map((a) => formatValue(a.weight)).join(' / ');
  const days = srm.daysChecked ? `; ${srm.daysChecked} days checked, ${srm.days.length} alarmed` : '';
  return `Sample ratio: ${split} units against weights ${weights}: chi-square ${srm.statistic.toFixed(2)} on ${srm.degreesOfFreedom} df, ${statePValue(srm.pValue)}, ${srm.mismatch ? 'MISMATCH' : 'no mismatch'} (alarm below ${srm.threshold})${days}.`;
}

export function timingLine(readout: Readout): string {
  const t = readout.timing;
  const end = t.plannedEnd ? `planned end ${t.plannedEnd}` : 'no planned end';
  const fraction = t.informationFraction !== undefined ? `; ${formatCount(Object.values(readout.srm?.arms ?? []).reduce((s, a) => s + a.units, 0))} units, ${Math.round(t.informationFraction * 100)}% of the ${formatCount(t.plannedUnits!)} planned` : '';
  return `Data through ${t.dataThrough} (${end}${t.readEarly ? ', READ EARLY' : ''})${fraction}.`;
}

export function primaryClassText(arm: ArmRead): string {
  return arm.primaryClass ?? 'not computed';
}

/** Which plan's rule the readout applied, around its commit (so each renderer marks the commit its own way). */
export function planSource(readout: Readout): { before: string; commit: string; after: string } {
  const commit = readout.rule?.commit ?? readout.planCommit;
  switch (readout.rule?.status) {
    case undefined:
      return { before: 'Plan as launched: ', commit, after: '.' };
    case 'same':
      return { before: 'Rule as registered at launch (', commit, after: ').' };
    case 'amended':
      return { before: 'Rule as amended after launch (', commit, after: '): see the note below.' };
    case 'changed':
      return { before: 'Rule as registered at launch (', commit, after: '); the plan was changed since without an amendment.' };
    case 'unavailable':
      return { before: "Today's plan: the plan at ", commit, after: ' cannot be read.' };
  }
}
