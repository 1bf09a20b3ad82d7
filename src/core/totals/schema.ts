import { z } from 'zod';
import { asDescription, calendarDate, finiteNumber, kebabName, nonNegativeNumber } from '../source/fields.js';
import { planId } from '../plan/schema.js';

/**
 * The arm-totals file: the sufficient statistics of one readout, per arm (and optionally per day,
 * per week and per segment). A few kilobytes, no personal data, readable in a diff; written by hand,
 * by another tool, or by one SQL query. `writtenTotalsSchema` is what is typed (kebab-case keys);
 * `totalsSchema` maps it once to the camelCase `ArmTotalsFile` the readout uses.
 */

const count = (expected: string) =>
  z.number({ error: expected }).int({ error: expected }).gte(0, { error: expected }).describe(asDescription(expected));

const sumOf = (what: string) => finiteNumber(`the sum of ${what} over the units, e.g. 10250.5`);
const squaresOf = (what: string) => nonNegativeNumber(`the sum of squares of ${what} over the units (0 or more), e.g. 84210.25`);

const prePeriod = z
  .strictObject(
    {
      sum: sumOf('each unit’s pre-period value'),
      'sum-of-squares': squaresOf('each unit’s pre-period value'),
      'sum-of-products': finiteNumber('the sum over the units of the metric value times the pre-period value, e.g. 5120.75'),
    },
    { error: 'a mapping with sum, sum-of-squares and sum-of-products of the pre-period value' },
  )
  .describe('The same metric measured on the same units before the test (for variance reduction, CUPED).');

const proportionTotals = z
  .strictObject(
    {
      'units-with-event': count('the number of units with the event, a whole number of 0 or more, e.g. 1520'),
      n: count('the number of units the share is taken over, a whole number of 0 or more (default: the units)').optional(),
      'pre-period': prePeriod.optional(),
    },
    { error: 'a mapping with units-with-event' },
  )
  .describe('A proportion metric: how many units had the event.');

const meanTotals = z
  .strictObject(
    {
      n: count('the number of units the mean is taken over, a whole number of 0 or more, e.g. 12000'),
      sum: sumOf('the metric value'),
      'sum-of-squares': squaresOf('the metric value'),
      'pre-period': prePeriod.optional(),
    },
    { error: 'a mapping with n, sum and sum-of-squares' },
  )
  .describe('A mean metric: n, the sum and the sum of squares of the per-unit values.');

const sideOfRatio = (what: string) =>
  z
    .strictObject({ sum: sumOf(`each unit’s ${what}`), 'sum-of-squares': squaresOf(`each unit’s ${what}`) }, { error: `a mapping with sum and sum-of-squares of the ${what}` })
    .describe(`Sums of each unit’s ${what}.`);

const ratioTotals = z
  .strictObject(
    {
      n: count('the number of units (the randomization unit), a whole number of 0 or more, e.g. 12000'),
      numerator: sideOfRatio('numerator'),
      denominator: sideOfRatio('denominator'),
      'sum-of-products': finiteNumber('the sum over the units of numerator times denominator, e.g. 40210'),
    },
    { error: 'a mapping with n, numerator, denominator and sum-of-products' },
  )
  .describe('A ratio metric: per-unit sums of numerator and denominator, their squares and their products.');

const metricTotals = z
  .union([proportionTotals, meanTotals, ratioTotals], {
    error: 'metric totals: { units-with-event } for a proportion, { n, sum, sum-of-squares } for a mean, or { n, numerator, denominator, sum-of-products } for a ratio',
  })
  .meta({ id: 'metricTotals', description: 'The totals of one metric in one arm (or one day, week or segment of it).' });

const metricsMap = z
  .record(kebabName('a metric name of the plan, e.g. order-completed'), metricTotals, { error: 'a mapping of metric names to their totals' })
  .default({})
  .describe('Totals per metric, keyed by the metric’s name in the plan.');

const unitsField = count('the number of units exposed, a whole number of 0 or more, e.g. 12000');

const group = { units: unitsField, metrics: metricsMap };

const armTotals = z
  .strictObject(
    {
      ...group,
      days: z
        .array(z.strictObject({ date: calendarDate('a date written YYYY-MM-DD, e.g. 2026-11-09'), ...group }, { error: 'a mapping with date, units and metrics' }), {
          error: 'a list of days, e.g. [{ date: 2026-11-09, units: 7000 }]',
        })
        .default([])
        .describe('Per day: the units first exposed that day (and, optionally, metric totals of those units).'),
      weeks: z
        .array(z.strictObject({ starting: calendarDate('the week’s first day written YYYY-MM-DD, e.g. 2026-11-09'), ...group }, { error: 'a mapping with starting, units and metrics' }), {
          error: 'a list of weeks, e.g. [{ starting: 2026-11-09, units: 49000, metrics: { ... } }]',
        })
        .default([])
        .describe('Per week of first exposure: units and metric totals (for the novelty check).'),
      segments: z
        .array(
          z.strictObject(
            { segment: z.string({ error: 'a segment name, e.g. "platform: ios"' }).trim().min(1, { error: 'a segment name, e.g. "platform: ios"' }), ...group },
            { error: 'a mapping with segment, units and metrics' },
          ),
          { error: 'a list of segments, e.g. [{ segment: "platform: ios", units: 5000, metrics: { ... } }]' },
        )
        .default([])
        .describe('Per segment: units and metric totals (exploratory).'),
    },
    { error: 'an arm’s totals: a mapping with units and metrics' },
  )
  .describe('Totals of one arm.');

export const writtenTotalsSchema = z
  .strictObject(
    {
      plan: planId.describe('The id of the plan this readout is for.'),
      'plan-commit': z
        .string({ error: 'the commit of the plan at launch, 7 to 40 hexadecimal digits, e.g. 4b1d2e7' })
        .regex(/^[0-9a-f]{7,40}$/, { error: 'the commit of the plan at launch, 7 to 40 lower-case hexadecimal digits, e.g. 4b1d2e7' })
        .describe('The commit of the plan when the test launched: the rule read out is the one registered then.'),
      'data-through': calendarDate('the last day the data covers, written YYYY-MM-DD, e.g. 2026-12-06').describe('The last day (UTC, included) the data covers.'),
      arms: z
        .record(kebabName('an arm name of the plan, e.g. control'), armTotals, { error: 'a mapping of arm names to their totals' })
        .describe('Totals per arm, keyed by the arm’s name in the plan.'),
      excluded: z
        .strictObject(
          {
            'several-arms': count('the number of units seen in two or more arms, a whole number of 0 or more, e.g. 12')
              .default(0)
              .describe('Units exposed in two or more arms, left out of every total: they break randomization.'),
            'unknown-arm': count('the number of units whose exposures name an arm the plan does not have, a whole number of 0 or more, e.g. 3')
              .default(0)
              .describe('Units with exposures under an arm name the plan does not have; those exposures are left out.'),
          },
          { error: 'a mapping with several-arms and unknown-arm, e.g. { several-arms: 12, unknown-arm: 0 }' },
        )
        .optional()
        .describe('Units left out of the totals, by reason (written by plumbline totals).'),
      notes: z.string({ error: 'free text' }).optional().describe('Free text: where the totals came from.'),
    },
    { error: 'arm totals: a mapping with plan, plan-commit, data-through and arms' },
  )
  .describe('Plumbline arm totals: the sufficient statistics of one readout.');

export type WrittenTotals = z.input<typeof writtenTotalsSchema>;
type ParsedTotals = z.output<typeof writtenTotalsSchema>;
type ParsedMetric = z.output<typeof metricTotals>;

export interface PrePeriodTotals {
  sum: number;
  sumSquares: number;
  /** Σ metric × pre-period value. */
  sumProducts: number;
}
export interface SumPair {
  sum: number;
  sumSquares: number;
}
/** Every metric kind as n, Σy and Σy²; a proportion's y is 0 or 1, so its Σy² equals Σy. */
export type MetricTotals =
  | { kind: 'proportion'; n: number; sum: number; sumSquares: number; pre?: PrePeriodTotals }
  | { kind: 'mean'; n: number; sum: number; sumSquares: number; pre?: PrePeriodTotals }
  | { kind: 'ratio'; n: number; numerator: SumPair; denominator: SumPair; sumProducts: number };

export interface TotalsGroup {
  units: number;
  metrics: Record<string, MetricTotals>;
}
export interface ArmTotals extends TotalsGroup {
  days: (TotalsGroup & { date: string })[];
  weeks: (TotalsGroup & { starting: string })[];
  segments: (TotalsGroup & { segment: string })[];
}
export interface ArmTotalsFile {
  planId: string;
  planCommit: string;
  dataThrough: string;
  /** In the order written. */
  arms: Record<string, ArmTotals>;
  /** Units left out of every total, by reason; absent when the file does not say. */
  excluded?: { severalArms: number; unknownArm: number };
  notes?: string;
}

function normalizePre(pre: { sum: number; 'sum-of-squares': number; 'sum-of-products': number } | undefined): { pre?: PrePeriodTotals } {
  return pre ? { pre: { sum: pre.sum, sumSquares: pre['sum-of-squares'], sumProducts: pre['sum-of-products'] } } : {};
}

export function normalizeMetricTotals(written: ParsedMetric, units: number): MetricTotals {
  if ('units-with-event' in written) {
    const x = written['units-with-event'];
    return { kind: 'proportion', n: written.n ?? units, sum: x, sumSquares: x, ...normalizePre(written['pre-period']) };
  }
  if ('numerator' in written) {
    return {
      kind: 'ratio',
      n: written.n,
      numerator: { sum: written.numerator.sum, sumSquares: written.numerator['sum-of-squares'] },
      denominator: { sum: written.denominator.sum, sumSquares: written.denominator['sum-of-squares'] },
      sumProducts: written['sum-of-products'],
    };
  }
  return { kind: 'mean', n: written.n, sum: written.sum, sumSquares: written['sum-of-squares'], ...normalizePre(written['pre-period']) };
}

function normalizeGroup(written: { units: number; metrics: Record<string, ParsedMetric> }): TotalsGroup {
  return {
    units: written.units,
    metrics: Object.fromEntries(Object.entries(written.metrics).map(([name, m]) => [name, normalizeMetricTotals(m, written.units)])),
  };
}

export const totalsSchema = writtenTotalsSchema.transform(
  (written: ParsedTotals): ArmTotalsFile => ({
    planId: written.plan,
    planCommit: written['plan-commit'],
    dataThrough: written['data-through'],
    arms: Object.fromEntries(
      Object.entries(written.arms).map(([name, arm]) => [
        name,
        {
          ...normalizeGroup(arm),
          days: arm.days.map((d) => ({ date: d.date, ...normalizeGroup(d) })),
          weeks: arm.weeks.map((w) => ({ starting: w.starting, ...normalizeGroup(w) })),
          segments: arm.segments.map((s) => ({ segment: s.segment, ...normalizeGroup(s) })),
        },
      ]),
    ),
    ...(written.excluded ? { excluded: { severalArms: written.excluded['several-arms'], unknownArm: written.excluded['unknown-arm'] } } : {}),
    ...(written.notes !== undefined ? { notes: written.notes } : {}),
  }),
);
