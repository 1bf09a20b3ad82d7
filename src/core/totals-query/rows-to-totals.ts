import { Document, isMap, isSeq, visit } from 'yaml';
import { addDays, daysBetween } from '../calendar.js';
import type { Metric, Plan } from '../plan/schema.js';
import { DECIMAL_TEXT } from '../source/decimal.js';
import type { Problem } from '../source/problem.js';
import type { WrittenTotals } from '../totals/schema.js';
import { countOf } from '../report/numbers.js';
import { EXCLUDED_REASONS, GRAINS, NO_EXPOSURE_TIME, type RowColumn } from './build-query.js';
import { planMetrics } from './metric-spec.js';
import type { ResultRow } from './rows-csv.js';

/**
 * The query's long rows -> the arm-totals file. Each metric row becomes the totals of its kind (a
 * proportion's Σy is its units with the event; a ratio's y is the numerator and x the denominator),
 * days and segments are sorted, weeks are the days added up seven at a time from the window's start,
 * and an arm with no units gets zeros rather than going missing.
 */

export interface RowsToTotalsInput {
  plan: Plan;
  planCommit: string;
  dataThrough: string;
  rows: readonly ResultRow[];
  /** The file (or engine) the rows came from, for error positions. */
  file: string;
  /** Free text for the totals' notes: where the rows came from. */
  notes?: string;
}

/** Exposure rows of the plan that had no exposure time, left out of every total (units among them, and rows). */
export interface Untimed {
  units: number;
  rows: number;
  /** The result row that said so (its line in a rows file). */
  line?: number;
}

export type RowsToTotalsResult = { ok: true; totals: WrittenTotals; text: string; untimed: Untimed } | { ok: false; problems: Problem[] };

/** The sentence the totals' notes and the command's report use for untimed exposures; empty when there were none. */
export function untimedSentence(untimed: Untimed): string {
  if (!untimed.rows) return '';
  return `Left out: ${countOf(untimed.rows, 'exposure row')} (${countOf(untimed.units, 'unit')}) with no exposure time, so in no day of the window; units seen only there are in no total.`;
}

type WrittenMetric = NonNullable<WrittenTotals['arms'][string]['metrics']>[string];
interface Group {
  units: number;
  metrics: Record<string, WrittenMetric>;
}

function rowProblem(file: string, row: ResultRow, column: RowColumn, message: string, expected: string): Problem {
  const cell = row[column];
  return { severity: 'error', code: 'rows/invalid', file, line: cell.line, column: cell.column, field: column, message, expected, ...(cell.value !== null ? { found: JSON.stringify(cell.value) } : {}) };
}

export function rowsToTotals(input: RowsToTotalsInput): RowsToTotalsResult {
  const { plan, file } = input;
  const problems: Problem[] = [];
  const kinds = new Map<string, Metric['kind']>(planMetrics(plan).map(({ metric }) => [metric.name, metric.kind]));
  const armNames = plan.design.arms.map((a) => a.name);
  const groups = new Map<string, { arm: Group; days: Map<string, Group>; segments: Map<string, Group> }>(armNames.map((a) => [a, { arm: { units: 0, metrics: {} }, days: new Map(), segments: new Map() }]));
  const excluded = { 'several-arms': 0, 'unknown-arm': 0 };
  const untimed: Untimed = { units: 0, rows: 0 };

  const whole = (row: ResultRow, column: RowColumn): number | undefined => {
    const text = row[column].value;
    if (text === null) return void problems.push(rowProblem(file, row, column, 'is empty', 'a whole number of 0 or more'));
    const value = Number(text);
    if (!DECIMAL_TEXT.test(text) || !Number.isSafeInteger(value) || value < 0) return void problems.push(rowProblem(file, row, column, 'is not a whole number of 0 or more', 'a whole number of 0 or more, e.g. 1520'));
    return value;
  };
  const number = (row: ResultRow, column: RowColumn): number | undefined => {
    const text = row[column].value;
    if (text === null) return void problems.push(rowProblem(file, row, column, 'is empty', 'a number'));
    const value = Number(text);
    if (!DECIMAL_TEXT.test(text) || !Number.isFinite(value)) return void problems.push(rowProblem(file, row, column, 'is not a number', 'a decimal number, e.g. 10250.5'));
    return value;
  };
  const prePeriod = (row: ResultRow) => {
    if (row.sum_pre.value === null) return {};
    const [sum, squares, products] = [number(row, 'sum_pre'), number(row, 'sum_pre2'), number(row, 'sum_ypre')];
    return sum === undefined || squares === undefined || products === undefined ? {} : { 'pre-period': { sum, 'sum-of-squares': squares, 'sum-of-products': products } };
  };
  const metricTotals = (row: ResultRow, kind: Metric['kind'], units: number): WrittenMetric | undefined => {
    const n = whole(row, 'n');
    const sumY = kind === 'proportion' ? whole(row, 'sum_y') : number(row, 'sum_y');
    const sumY2 = number(row, 'sum_y2');
    if (n === undefined || sumY === undefined || sumY2 === undefined) return undefined;
    if (kind === 'proportion') return { 'units-with-event': sumY, ...(n !== units ? { n } : {}), ...prePeriod(row) };
    if (kind === 'mean') return { n, sum: sumY, 'sum-of-squares': sumY2, ...prePeriod(row) };
    const [sumX, sumX2, sumXY] = [number(row, 'sum_x'), number(row, 'sum_x2'), number(row, 'sum_xy')];
    if (sumX === undefined || sumX2 === undefined || sumXY === undefined) return undefined;
    return { n, numerator: { sum: sumY, 'sum-of-squares': sumY2 }, denominator: { sum: sumX, 'sum-of-squares': sumX2 }, 'sum-of-products': sumXY };
  };

  for (const row of input.rows) {
    const grain = row.grain.value;
    if (grain === null || !(GRAINS as readonly string[]).includes(grain)) {
      problems.push(rowProblem(file, row, 'grain', 'is not a grain of the totals query', GRAINS.join(', ')));
      continue;
    }
    if (grain === 'excluded') {
      const reason = row.bucket.value;
      if (reason === NO_EXPOSURE_TIME) {
        // Rows of result files written before this row existed simply lack it: none counted.
        const [units, rows] = [whole(row, 'units'), whole(row, 'n')];
        if (units !== undefined && rows !== undefined) Object.assign(untimed, { units: untimed.units + units, rows: untimed.rows + rows, line: row.line });
        continue;
      }
      if (reason === null || !(EXCLUDED_REASONS as readonly string[]).includes(reason)) {
        problems.push(rowProblem(file, row, 'bucket', 'is not a reason for leaving units out', [...EXCLUDED_REASONS, NO_EXPOSURE_TIME].join(', ')));
        continue;
      }
      const units = whole(row, 'units');
      if (units !== undefined) excluded[reason as (typeof EXCLUDED_REASONS)[number]] += units;
      continue;
    }
    const arm = row.arm.value;
    const target = arm === null ? undefined : groups.get(arm);
    if (!target) {
      problems.push(rowProblem(file, row, 'arm', arm === null ? 'is empty' : 'is not an arm of the plan', `one of ${armNames.join(', ')}`));
      continue;
    }
    let group: Group;
    if (grain === 'arm') group = target.arm;
    else {
      const bucket = row.bucket.value;
      const map = grain === 'day' ? target.days : target.segments;
      if (bucket === null || (grain === 'day' && !/^\d{4}-\d{2}-\d{2}$/.test(bucket))) {
        problems.push(rowProblem(file, row, 'bucket', grain === 'day' ? 'is not a day' : 'is empty', grain === 'day' ? 'the day of first exposure written YYYY-MM-DD' : 'the segment written "column: value"'));
        continue;
      }
      group = map.get(bucket) ?? { units: 0, metrics: {} };
      map.set(bucket, group);
    }
    const units = whole(row, 'units');
    if (units === undefined) continue;
    const metric = row.metric.value;
    if (metric === null) {
      group.units = units;
      continue;
    }
    const kind = kinds.get(metric);
    if (!kind) {
      problems.push(rowProblem(file, row, 'metric', 'is not a metric of the plan', `one of ${[...kinds.keys()].join(', ')}`));
      continue;
    }
    const totals = metricTotals(row, kind, units);
    if (totals) group.metrics[metric] = totals;
  }
  if (problems.length) return { ok: false, problems };

  // An arm without units still gets its metrics (as zeros), so the file says so rather than omitting it.
  for (const { arm } of groups.values()) {
    for (const [name, kind] of kinds) {
      if (arm.metrics[name]) continue;
      arm.metrics[name] = kind === 'proportion' ? { 'units-with-event': 0 } : kind === 'mean' ? { n: 0, sum: 0, 'sum-of-squares': 0 } : { n: 0, numerator: { sum: 0, 'sum-of-squares': 0 }, denominator: { sum: 0, 'sum-of-squares': 0 }, 'sum-of-products': 0 };
    }
  }
  const start = plan.window.start;
  const notes = [input.notes, untimedSentence(untimed)].filter(Boolean).join(' ');
  const totals: WrittenTotals = {
    plan: plan.id,
    'plan-commit': input.planCommit,
    'data-through': input.dataThrough,
    arms: Object.fromEntries(
      [...groups].map(([name, g]) => {
        const days = [...g.days].sort(([a], [b]) => a.localeCompare(b));
        return [
          name,
          {
            units: g.arm.units,
            metrics: g.arm.metrics,
            days: days.map(([date, day]) => ({ date, ...day })),
            ...(start ? { weeks: weeksOf(days, start, kinds) } : {}),
            segments: [...g.segments].sort(([a], [b]) => a.localeCompare(b)).map(([segment, s]) => ({ segment, ...s })),
          },
        ];
      }),
    ),
    excluded,
    ...(notes ? { notes } : {}),
  };
  return { ok: true, totals, text: totalsYaml(totals), untimed };
}

/** Days of first exposure added up by week from the window's start (the weeks the novelty check compares). */
function weeksOf(days: [string, Group][], start: string, kinds: Map<string, Metric['kind']>): { starting: string; units: number; metrics: Record<string, WrittenMetric> }[] {
  const weeks = new Map<string, Group[]>();
  for (const [date, day] of days) {
    const starting = addDays(start, Math.floor(daysBetween(start, date) / 7) * 7);
    weeks.set(starting, [...(weeks.get(starting) ?? []), day]);
  }
  return [...weeks].map(([starting, parts]) => ({
    starting,
    units: parts.reduce((s, p) => s + p.units, 0),
    metrics: Object.fromEntries([...kinds.keys()].flatMap((name) => {
      // A proportion's n defaults to its group's units: make it explicit before adding groups of different sizes.
      const present = parts.flatMap((p) => {
        const m = p.metrics[name];
        return m === undefined ? [] : ['units-with-event' in m ? { n: p.units, ...m } : m];
      });
      if (!present.length) return [];
      const sum = addWritten(present);
      const units = parts.reduce((s, p) => s + p.units, 0);
      if ('units-with-event' in sum && sum.n === units) delete sum.n;
      return [[name, sum]];
    })),
  }));
}

/** Sums of written metric totals of one kind (numbers add field by field; a proportion's missing n is its group's units). */
function addWritten(parts: WrittenMetric[]): WrittenMetric {
  const add = (a: unknown, b: unknown): unknown => {
    if (typeof a === 'number' && typeof b === 'number') return a + b;
    if (a && b && typeof a === 'object' && typeof b === 'object') {
      const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
      return Object.fromEntries([...keys].map((k) => [k, add((a as Record<string, unknown>)[k] ?? 0, (b as Record<string, unknown>)[k] ?? 0)]));
    }
    return a;
  };
  return parts.reduce((s, p) => add(s, p) as WrittenMetric);
}

const HEADER = '# Arm totals written by `plumbline totals` (docs/totals-from-sql.md): sums per arm, day, week and segment; no unit-level data.\n';

/** The totals as YAML: metric totals and list items on one line each, the way the hand-written files read. */
export function totalsYaml(totals: WrittenTotals): string {
  const doc = new Document(totals);
  visit(doc, {
    Pair(_, pair, path) {
      const key = (pair.key as { value?: unknown } | null)?.value;
      if (key === 'metrics' && isMap(pair.value)) for (const item of pair.value.items) if (isMap(item.value)) item.value.flow = true;
      if ((key === 'days' || key === 'weeks' || key === 'segments') && isSeq(pair.value) && path.length) for (const item of pair.value.items) if (isMap(item)) item.flow = true;
      if (key === 'excluded' && isMap(pair.value)) pair.value.flow = true;
    },
  });
  return HEADER + doc.toString({ lineWidth: 0 });
}
