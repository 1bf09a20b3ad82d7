import { inclusiveDays } from '../calendar.js';
import { GROUP_UNITS, type Metric, type Plan } from '../plan/schema.js';
import type { StatsResult } from './result.js';
import { sizeMetric, type MetricBaseline, type SizingRequest, type MetricSizing } from './sizing.js';

/**
 * Sizes a plan's primary metric and each guardrail from the plan itself.
 *
 * The primary metric is sized for the plan's minimum detectable effect in its desired direction,
 * with the plan's sides. A guardrail is sized as a one-sided test for harm: to detect a movement
 * against its desired direction as large as its tolerance (a guardrail exists to catch damage, so
 * only that side matters). Several treatment arms share one control under Bonferroni.
 */
export interface MetricSizingEntry {
  metric: string;
  role: 'primary' | 'guardrail';
  kind: Metric['kind'];
  /** The direction sized for: the desired one for the primary, the harmful one for a guardrail. */
  direction: 'increase' | 'decrease';
  sides: 1 | 2;
  result: StatsResult<MetricSizing>;
}

export interface PlanSizing {
  planId: string;
  /** Days in the planned window, both ends included, when it has both dates. */
  plannedDays?: number;
  dailyUnits?: number;
  metrics: MetricSizingEntry[];
}

function baselineOf(metric: Metric): MetricBaseline {
  if (metric.kind === 'proportion') return { kind: 'proportion', rate: metric.baseline.rate };
  if (metric.kind === 'mean') return { kind: 'mean', mean: metric.baseline.mean, sd: metric.baseline.sd };
  return { kind: 'ratio', ...metric.baseline };
}

export function sizePlan(plan: Plan): PlanSizing {
  const { design } = plan;
  const plannedDays = plan.window.start && plan.window.end && plan.window.end >= plan.window.start ? inclusiveDays(plan.window.start, plan.window.end) : undefined;
  const clustered = GROUP_UNITS.includes(plan.unit.randomization) && plan.unit.analysis !== plan.unit.randomization && design.cluster;
  const common: Omit<SizingRequest, 'baseline' | 'direction' | 'sides'> = {
    arms: design.arms,
    control: design.control,
    alpha: design.alpha,
    power: design.power,
    trafficShare: design.trafficShare,
    reach: plan.exposure.reach,
    interimLooks: design.interimLooks,
    boundary: design.interimBoundary,
    prePeriodCorrelation: design.prePeriodCorrelation,
    ...(design.dailyUnits !== undefined ? { dailyUnits: design.dailyUnits } : {}),
    ...(clustered && design.cluster ? { cluster: design.cluster } : {}),
    ...(plannedDays !== undefined ? { plannedDays } : {}),
  };

  const primary = plan.metrics.primary;
  const entries: MetricSizingEntry[] = [
    {
      metric: primary.name,
      role: 'primary',
      kind: primary.kind,
      direction: primary.direction,
      sides: design.sides,
      result: sizeMetric({
        ...common,
        baseline: baselineOf(primary),
        direction: primary.direction,
        sides: design.sides,
        ...(design.minDetectableEffect ? { effect: design.minDetectableEffect } : {}),
      }),
    },
    ...plan.metrics.guardrails.map((metric): MetricSizingEntry => {
      const harm = metric.direction === 'increase' ? 'decrease' : 'increase';
      return {
        metric: metric.name,
        role: 'guardrail',
        kind: metric.kind,
        direction: harm,
        sides: 1,
        result: sizeMetric({
          ...common,
          baseline: baselineOf(metric),
          direction: harm,
          sides: 1,
          ...(metric.tolerance ? { effect: metric.tolerance } : {}),
        }),
      };
    }),
  ];
  return {
    planId: plan.id,
    ...(plannedDays !== undefined ? { plannedDays } : {}),
    ...(design.dailyUnits !== undefined ? { dailyUnits: design.dailyUnits } : {}),
    metrics: entries,
  };
}
