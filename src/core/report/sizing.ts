import type { MetricSizingEntry, PlanSizing } from '../stats/plan-sizing.js';
import type { AnalysisSize, MetricSizing } from '../stats/sizing.js';
import { unitsAmount } from '../stats/traffic.js';
import { formatCount, formatMultiplier, formatPower, formatRate, formatRelative, formatValue, countOf } from './numbers.js';
import { safeCell, safeText } from './markdown-safe.js';
import { formatTable } from './terminal-style.js';

/** Everything the renderers need besides the numbers. */
export interface SizingContext {
  title: string;
  /** e.g. "2 arms (control 50, shortcut 50), α 0.05 two-sided, power 80%". */
  designLine: string;
  window?: { start?: string; end?: string };
}

export const SIZING_JSON_FORMAT = 'plumbline.sizing/1';

function valueText(entry: MetricSizingEntry, value: number): string {
  return entry.kind === 'proportion' ? formatRate(value) : formatValue(value);
}

/**
 * The size of a change in the metric's units, unsigned: percentage points with three significant digits for a
 * rate ("0.821 pp"), the metric's own units otherwise. The readout's minimum detectable effect uses it too, so the
 * same effect reads the same in the sizing table and the readout.
 */
export function changeSize(kind: MetricSizingEntry['kind'], absolute: number): string {
  const size = Math.abs(absolute);
  if (kind !== 'proportion') return formatValue(size);
  const points = size * 100;
  return `${points !== 0 && points < 1e-3 ? points.toExponential(2) : Number(points.toPrecision(3)).toLocaleString('en-US', { maximumFractionDigits: 8 })} pp`;
}

/** "10.0% → 10.3% (+3% relative, +0.3 pp)": absolute numbers first, the relative change beside them. */
export function describeChange(entry: MetricSizingEntry, change: { from?: number; to: number; relative: number; absolute: number }, from: number): string {
  const absolute = `${change.absolute >= 0 ? '+' : '-'}${changeSize(entry.kind, change.absolute)}`;
  return `${valueText(entry, from)} → ${valueText(entry, change.to)} (${formatRelative(change.relative)} relative, ${absolute})`;
}

/**
 * "a" or "an" before a number as it is spoken: "an 8%", "an 11.7%", "an 18%", "an 80%", "an 800", "an 11,000",
 * but "a 1.5%", "a 110%", "a >99.9%" ("more than") (English usage, common practice, no source).
 */
export function withArticle(text: string): string {
  const lead = /^(\d{1,3})(?:,\d{3})*(?:\.\d+)?/.exec(text)?.[1];
  const an = lead !== undefined && (lead.startsWith('8') || lead === '11' || lead === '18');
  return `${an ? 'an' : 'a'} ${text}`;
}

/** What the DETECTABLE BY END cell says when nothing is: "none within 0–100%" for a rate. */
function noneDetectableCell(entry: MetricSizingEntry): string {
  return entry.kind === 'proportion' ? 'none within 0–100%' : 'none';
}

function sizeCells(size: AnalysisSize | undefined): [string, string, string, string] {
  if (!size) return ['', '', '', ''];
  const perArm = new Set(size.perArm.map((a) => a.units)).size === 1 ? formatCount(size.perArm[0]!.units) : size.perArm.map((a) => formatCount(a.units)).join(' / ');
  return [perArm, formatCount(size.totalUnits), size.duration ? formatCount(size.duration.days) : '', size.duration ? formatCount(size.duration.weeks) : ''];
}

interface Row {
  entry: MetricSizingEntry;
  cells: string[];
}

function rows(sizing: PlanSizing): Row[] {
  return sizing.metrics.map((entry) => {
    const role = entry.role === 'guardrail' ? `guardrail (non-inferiority, α ${formatValue(entry.alpha)} 1-sided)` : `primary (${entry.sides}-sided)`;
    if (!entry.result.ok) return { entry, cells: [entry.metric, role, `cannot size: ${entry.result.error.input}: ${entry.result.error.message}`, '', '', '', '', '', ''] };
    const s = entry.result.value;
    const effect = s.effect ? describeChange(entry, s.effect, s.baselineValue) : 'no effect given';
    const end = s.atPlannedEnd;
    const detectable = end?.detectable ? describeChange(entry, end.detectable, s.baselineValue) : end?.noneDetectable ? noneDetectableCell(entry) : '';
    const power = end?.power !== undefined ? formatPower(end.power) : end?.noPower ? 'unknown' : '';
    return { entry, cells: [entry.metric, role, effect, ...sizeCells(s.headline), power, detectable] };
  });
}

const HEADER = ['METRIC', 'ROLE', 'EFFECT TO DETECT', 'UNITS/ARM', 'TOTAL', 'DAYS', 'WEEKS', 'POWER AT END', 'DETECTABLE BY END'];

/** Sentences for every multiplier that changed the answer. */
export function multiplierNotes(entry: MetricSizingEntry, sizing: MetricSizing): string[] {
  const m = sizing.multipliers;
  const out: string[] = [];
  if (sizing.traffic?.kind === 'unique' && entry.role === 'primary') {
    const [a, b] = sizing.traffic.points;
    out.push(`Traffic as people arrive: ${formatCount(a!.units)} different units in ${a!.days} days and ${formatCount(b!.units)} in ${b!.days}, interpolated as a power law (exponent ${sizing.traffic.exponent.toFixed(2)}; 1 would mean every unit is new).`);
  }
  if (entry.role === 'guardrail' && sizing.effect) {
    out.push(
      `Non-inferiority: the test can rule out harm of ${describeChange(entry, sizing.effect, sizing.baselineValue)} with ${formatPower(entry.power)} power when there is none. At the readout the one-sided ${formatValue((1 - entry.alpha) * 100)}% bound on the harm reads three ways: breach (harm is significant), harm ruled out (the bound is inside the tolerance), or not ruled out (neither; more data or a judgement).`,
    );
  }
  if (entry.guardrailLooks) {
    out.push(`The interim boundaries are the primary’s; at each of the ${entry.guardrailLooks.looks} analyses this guardrail’s harm check is its own one-sided test at α ${formatValue(entry.alpha)}, so it can stop the test at the first look; checking ${entry.guardrailLooks.looks} times gives ${withArticle(formatPower(entry.guardrailLooks.falseAlarm))} chance of a false alarm at some look.`);
  }
  if (sizing.feasibility && !sizing.feasibility.feasible) {
    const f = sizing.feasibility;
    const detect = f.detectableAtLongest
      ? ` The longest window (${f.longestDays} days) can detect ${describeChange(entry, f.detectableAtLongest, sizing.baselineValue)}.`
      : f.noneDetectableAtLongest
        ? ` In the longest window (${f.longestDays} days), ${f.noneDetectableAtLongest.reason}.`
        : '';
    out.push(`Not feasible at this traffic: ${f.reason}.${detect} Alternatives: plan for a larger effect, pick a more sensitive metric (closer to the change, or with a pre-period adjustment), or ship as a guarded rollout without a test.`);
  }
  if (sizing.squareRootAllocation) {
    const a = sizing.squareRootAllocation;
    out.push(`Several arms share one control: giving the control √k times a treatment arm’s share (weights ${formatValue(a.controlWeight)} : ${formatValue(a.treatmentWeight)} each) needs ${formatCount(a.totalUnits)} units, ${formatCount(a.unitsSaved)} fewer.`);
  }
  if (m.comparisons > 1) out.push(`${m.comparisons} treatment arms against one control: α ${formatValue(m.alphaPerComparison)} per comparison (Bonferroni).`);
  if (m.designEffect > 1) {
    const perArm = sizing.headline?.clustersPerArm;
    const groups = perArm ? `, whole groups per arm ${perArm.map((g) => formatCount(g.groups)).join(' / ')} (${formatCount(sizing.headline!.clusters!)} groups in all; t reference with groups − 2 degrees of freedom)` : '';
    out.push(`Groups are randomized: design effect ${formatMultiplier(m.designEffect)} on units${groups}.`);
  }
  if (m.varianceReduction < 1) out.push(`Pre-period adjustment (CUPED): ${formatMultiplier(m.varianceReduction)} on units.`);
  if (sizing.boundaries) {
    const z = sizing.boundaries.z.map((v) => v.toFixed(3)).join(', ');
    const p = sizing.boundaries.nominalP.map((v) => (v < 0.001 ? v.toExponential(1) : v.toFixed(4))).join(', ');
    out.push(`Interim looks (${sizing.boundaries.kind}, ${sizing.boundaries.z.length} analyses): maximum sample ${formatMultiplier(m.sequential)} to keep the planned power; stop at |z| ≥ ${z} (nominal p ${p}).`);
  }
  if (sizing.diluted && sizing.triggered) {
    const triggeredDays = sizing.triggered.duration ? ` (${countOf(sizing.triggered.duration.days, 'day')})` : '';
    out.push(
      `Exposure is logged before the change is reached: the analysis of all exposed units needs ${formatMultiplier(m.dilutionUnits)} the units and ${formatMultiplier(m.dilutionDays)} the days of an analysis of reached units${triggeredDays}; log exposure where the change is seen to save the difference.`,
    );
  }
  return out.map((text) => `${entry.metric}: ${text}`);
}

/** What the planned end gives: power below the target, or why there is no power or detectable effect. */
function plannedEndNotes(entry: MetricSizingEntry, sizing: MetricSizing): string[] {
  const end = sizing.atPlannedEnd;
  if (!end) return [];
  const by = `By the planned end (${countOf(end.days, 'day')})`;
  const out: string[] = [];
  if (end.noPower?.tooFewUnits && end.noneDetectable) out.push(`${by}: no power, and ${end.noneDetectable.reason}.`);
  else {
    if (end.noPower) out.push(`${by} no power can be computed: ${end.noPower.reason}.`);
    if (end.noneDetectable) out.push(`${by}: ${end.noneDetectable.reason}.`);
  }
  if (end.power !== undefined && end.power < entry.power) out.push(`The planned ${countOf(end.days, 'day')} give ${formatPower(end.power)} power, below the planned ${formatPower(entry.power)}.`);
  return out.map((text) => `${entry.metric}: ${text}`);
}

function familyNote(sizing: PlanSizing): string[] {
  if (sizing.familyOmitted) return [`Power for the family is not computed: ${sizing.familyOmitted.reason}.`];
  if (!sizing.family) return [];
  const f = sizing.family;
  return [
    `Power for the family: ${formatPower(f.noFalseAlarm)} that the primary wins (${formatPower(f.primaryPower)} alone) and no harmless guardrail shows significant harm (a false alarm); ${formatPower(f.allGuardrailsClear)} that it wins and every guardrail rules out harm beyond its tolerance. Both figures multiply the metrics’ chances as if the metrics were independent. Neither figure bounds the other: a guardrail can show significant harm that is still within its tolerance, and it can fail to rule out harm without showing any.`,
  ];
}

function notesOf(sizing: PlanSizing): string[] {
  return [
    ...familyNote(sizing),
    ...sizing.metrics.flatMap((entry) =>
      entry.result.ok ? [...multiplierNotes(entry, entry.result.value), ...plannedEndNotes(entry, entry.result.value), ...entry.result.value.notes.map((n) => `${entry.metric}: ${n}`)] : [],
    ),
  ];
}

function windowLine(sizing: PlanSizing, context: SizingContext): string {
  if (sizing.plannedDays !== undefined) {
    const dates = context.window?.start && context.window.end ? ` (${context.window.start} to ${context.window.end})` : '';
    return `Planned window: ${countOf(sizing.plannedDays, 'day')}${dates}.`;
  }
  return 'Planned window: not set, so power and detectable effect at the end are not computed.';
}

export function renderSizingText(sizing: PlanSizing, context: SizingContext): string {
  const table = formatTable(HEADER, rows(sizing).map((r) => r.cells));
  const traffic = sizing.dailyUnits === undefined && sizing.uniqueUnits === undefined ? 'No daily-units or unique-units given, so no durations.' : '';
  const notes = notesOf(sizing);
  return [
    context.title,
    context.designLine,
    windowLine(sizing, context),
    ...(traffic ? [traffic] : []),
    '',
    table,
    ...(notes.length ? ['', ...notes.map((n) => `- ${n}`)] : []),
  ].join('\n');
}

/** A power as chart data in percent, held to what formatPower prints: never 100.0 (certainty) nor 0.0. */
function chartPower(power: number): string {
  return Math.min(99.9, Math.max(0.1, power * 100)).toFixed(1);
}

function mermaidPowerChart(entry: MetricSizingEntry, sizing: MetricSizing, target: number): string | undefined {
  const points = sizing.powerByDay;
  // A curve that is already at full power on its first day says nothing a table does not.
  if (!points || points.length < 3 || points[0]!.power > 0.99) return undefined;
  const days = points.map((p) => p.day).join(', ');
  const power = points.map((p) => chartPower(p.power)).join(', ');
  const goal = points.map(() => chartPower(target)).join(', ');
  return [
    '```mermaid',
    'xychart-beta',
    `  title "Power by day: ${entry.metric.replace(/["\r\n]/g, ' ')}"`,
    `  x-axis "day" [${days}]`,
    '  y-axis "power (%)" 0 --> 100',
    `  line [${power}]`,
    `  line [${goal}]`,
    '```',
  ].join('\n');
}

export function renderSizingMarkdown(sizing: PlanSizing, context: SizingContext & { power: number }): string {
  const table = [
    `| ${HEADER.map((h) => h.toLowerCase()).join(' | ')} |`,
    `| ${HEADER.map(() => '---').join(' | ')} |`,
    ...rows(sizing).map((r) => `| ${r.cells.map(safeCell).join(' | ')} |`),
  ];
  const primary = sizing.metrics.find((m) => m.role === 'primary');
  const chart = primary?.result.ok ? mermaidPowerChart(primary, primary.result.value, context.power) : undefined;
  const notes = notesOf(sizing);
  return [
    `### ${safeText(context.title)}`,
    '',
    [safeText(context.designLine), windowLine(sizing, context)].filter(Boolean).join(' '),
    '',
    ...table,
    ...(notes.length ? ['', ...notes.map((n) => `- ${safeText(n)}`)] : []),
    ...(chart ? ['', `<details><summary>Power by day (the flat line is the planned ${formatPower(context.power)})</summary>`, '', chart, '', '</details>'] : []),
    '',
  ].join('\n');
}

export function sizingJson(sizing: PlanSizing, context: SizingContext): object {
  return { format: SIZING_JSON_FORMAT, title: context.title, design: context.designLine, ...sizing };
}

/** One line that says which design the numbers are for. */
export function designSummary(design: {
  arms: { name: string; weight: number }[];
  alpha: number;
  sides: 1 | 2;
  power: number;
  dailyUnits?: number;
  uniqueUnits?: { days: number; units: number }[];
  trafficShare: number;
  reach: number;
}): string {
  const arms = `${design.arms.length} arms (${design.arms.map((a) => `${a.name} ${formatValue(a.weight)}`).join(', ')})`;
  const test = `α ${formatValue(design.alpha)} ${design.sides === 2 ? 'two-sided' : 'one-sided'}, power ${formatPower(design.power)}`;
  const reached = `${formatValue(design.trafficShare * 100)}% of them enrolled${design.reach < 1 ? `, ${formatValue(design.reach * 100)}% of exposed units reach the change` : ''}`;
  const traffic = design.uniqueUnits
    ? `, ${design.uniqueUnits.map((p) => `${formatCount(p.units)} different eligible units in ${p.days} days`).join(' and ')}, ${reached}`
    : design.dailyUnits === undefined
      ? ''
      : `, ${unitsAmount(design.dailyUnits)} new eligible units a day, ${reached}`;
  return `${arms}, ${test}${traffic}.`;
}

/** The metric that sets a test's length: the one of primary and guardrails that needs the most days. */
export function lengthSetter(sizing: PlanSizing): { entry: MetricSizingEntry; sizing: MetricSizing; duration: { days: number; weeks: number } } | undefined {
  let best: ReturnType<typeof lengthSetter>;
  for (const entry of sizing.metrics) {
    const duration = entry.result.ok ? entry.result.value.headline?.duration : undefined;
    if (entry.result.ok && duration && (!best || duration.days > best.duration.days)) best = { entry, sizing: entry.result.value, duration };
  }
  return best;
}

/**
 * A plan's length and its power by the planned end, both for the metric that sets the length:
 * "3 weeks (guardrail slot-booked sets the length: 15 days)" and ">99.9% by the planned end (28 days)".
 */
export function lengthSummary(sizing: PlanSizing): { length: string; power?: string } | undefined {
  const setter = lengthSetter(sizing);
  if (!setter) return undefined;
  const { entry, duration } = setter;
  const who = entry.role === 'guardrail' ? `guardrail ${entry.metric}` : `primary metric ${entry.metric}`;
  const length = `${countOf(duration.weeks, 'week')} (${who} sets the length: ${countOf(duration.days, 'day')})`;
  const end = setter.sizing.atPlannedEnd;
  return end?.power !== undefined ? { length, power: `${formatPower(end.power)} for ${entry.metric} by the planned end (${countOf(end.days, 'day')})` } : { length };
}
