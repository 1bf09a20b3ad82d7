import type { Metric, Plan } from '../plan/schema.js';
import type { FieldPath } from '../source/yaml-source.js';

/**
 * What the query computes for one metric, with every default of `per-unit` applied. The rules
 * (docs/totals-from-sql.md): a proportion's unit value is 1 when the unit has any of the metric's events
 * after exposure; a mean's is the sum of the events' value; a ratio of two events is the first over the
 * second, each summing value; `per-unit` in the plan says otherwise where that is not the metric.
 */

/** One per-unit value from events: `sum` adds their value, `count` counts them, `any`/`none` is 1 when there is at least one/none. */
export interface EventValue {
  events: string[];
  rule: 'sum' | 'count' | 'any' | 'none';
}

export interface MetricSpec {
  name: string;
  kind: Metric['kind'];
  /** The metric value (a ratio's numerator). */
  y: EventValue;
  /** A ratio's denominator. */
  x?: EventValue;
  /** A proportion taken among the units with one of these events. */
  among?: string[];
  /** Events count only within this many hours of first exposure. */
  withinHours?: number;
  /** Capped at the percentile num/den (nearest rank), pooled over arms. */
  cap?: { numerator: number; denominator: number };
  /** Compute the pre-period value (CUPED). */
  pre: boolean;
}

export interface SpecProblem {
  path: FieldPath;
  message: string;
  expected: string;
}

export function planMetrics(plan: Plan): { metric: Metric; path: FieldPath }[] {
  return [
    { metric: plan.metrics.primary, path: ['metrics', 'primary'] },
    ...plan.metrics.guardrails.map((metric, i) => ({ metric, path: ['metrics', 'guardrails', i] as FieldPath })),
    ...plan.metrics.secondary.map((metric, i) => ({ metric, path: ['metrics', 'secondary', i] as FieldPath })),
  ];
}

/** A percentile such as 99 or 99.5 as an exact fraction of whole numbers (at most 6 decimals, so products stay in 64 bits). */
export function percentileFraction(percentile: number): { numerator: number; denominator: number } | undefined {
  for (let decimals = 0; decimals <= 6; decimals++) {
    const denominator = 100 * 10 ** decimals;
    const numerator = Math.round(percentile * 10 ** decimals);
    if (Math.abs(numerator / 10 ** decimals - percentile) < 1e-12) return { numerator, denominator };
  }
  return undefined;
}

export interface SpecOptions {
  /** Settings' pre-period days: without them no pre-period value is computed. */
  prePeriodDays?: number;
  /** Settings' default metric window. */
  metricWindowDays?: number;
}

/** Every metric of the plan as a spec, or the problems (at the plan's keys) that stop a query being written. */
export function metricSpecs(plan: Plan, options: SpecOptions): { ok: true; specs: MetricSpec[] } | { ok: false; problems: SpecProblem[] } {
  const problems: SpecProblem[] = [];
  const specs: MetricSpec[] = [];
  const cupedPlanned = plan.design.prePeriodCorrelation > 0;
  for (const { metric, path } of planMetrics(plan)) {
    const perUnit = metric.perUnit ?? {};
    const withinDays = perUnit.withinDays ?? options.metricWindowDays;
    const common = {
      name: metric.name,
      kind: metric.kind,
      ...(withinDays !== undefined ? { withinHours: withinDays * 24 } : {}),
    };
    const pre = options.prePeriodDays !== undefined && metric.kind !== 'ratio' && (cupedPlanned || (metric.prePeriod?.correlation ?? 0) > 0);
    if (metric.kind === 'proportion') {
      specs.push({
        ...common,
        y: { events: perUnit.events ?? metric.events, rule: perUnit.counts === 'without-event' ? 'none' : 'any' },
        ...(perUnit.among ? { among: perUnit.among } : {}),
        pre,
      });
    } else if (metric.kind === 'mean') {
      let cap: MetricSpec['cap'];
      if (metric.cappedAt !== undefined && metric.cappedAt < 100) {
        cap = percentileFraction(metric.cappedAt);
        if (!cap) problems.push({ path: [...path, 'capped-at'], message: `the percentile ${metric.cappedAt} has more than 6 decimals`, expected: 'a percentile with at most 6 decimals, e.g. 99 or 99.5' });
      }
      specs.push({ ...common, y: { events: perUnit.events ?? metric.events, rule: perUnit.value ?? 'sum' }, ...(cap ? { cap } : {}), pre });
    } else {
      const numerator = perUnit.numerator?.events ?? (metric.events.length === 2 ? [metric.events[0]!] : undefined);
      const denominator = perUnit.denominator?.events ?? (metric.events.length === 2 ? [metric.events[1]!] : undefined);
      if (!numerator || !denominator) {
        problems.push({
          path: [...path, perUnit.numerator || perUnit.denominator ? 'per-unit' : 'events'],
          message: `the ratio ${metric.name} has ${metric.events.length} events and does not say which make the numerator and which the denominator`,
          expected: 'per-unit: { numerator: { events: [...] }, denominator: { events: [...] } }, or exactly two events (numerator first)',
        });
        continue;
      }
      specs.push({
        ...common,
        y: { events: numerator, rule: perUnit.numerator?.value ?? 'sum' },
        x: { events: denominator, rule: perUnit.denominator?.value ?? 'sum' },
        pre: false,
      });
    }
  }
  return problems.length ? { ok: false, problems } : { ok: true, specs };
}
