import { inclusiveDays } from '../calendar.js';
import { GROUP_UNITS, type Metric, type Plan } from '../plan/schema.js';
import { normalUpperQuantile } from './distributions.js';
import type { StatsResult } from './result.js';
import { sequentialPower } from './sequential.js';
import { sizeMetric, DEFAULT_LONGEST_DAYS, type MetricBaseline, type SizingRequest, type MetricSizing } from './sizing.js';

/**
 * Sizes a plan's primary metric and each guardrail from the plan itself.
 *
 * The primary metric is sized for the plan's minimum detectable effect in its desired direction,
 * with the plan's sides, α, power and interim boundaries; several treatment arms share one control
 * under Bonferroni.
 *
 * A guardrail is a non-inferiority question: can the test rule out harm as large as the tolerance
 * when the change does no harm? It is sized one-sided at the guardrail's own α and power (the
 * metric's, else the settings', else 0.05 and 80%), without a correction for several arms unless
 * the settings ask for one (a correction makes a safety check less sensitive, the wrong way round).
 * The interim boundaries belong to the primary: at each look a guardrail's harm check is its own
 * one-sided test at its α, so "stop at once" can fire at the first look. Checking K times at α
 * raises the chance of a false alarm at some look above α; `guardrailLooks.falseAlarm` is that
 * chance, computed exactly by the same integration as the boundaries.
 */
export interface SizingPolicy {
  guardrailAlpha: number;
  guardrailPower: number;
  /** Bonferroni across treatment arms for guardrails too. */
  guardrailArmCorrection: boolean;
  longestDays: number;
}

export const DEFAULT_SIZING_POLICY: SizingPolicy = { guardrailAlpha: 0.05, guardrailPower: 0.8, guardrailArmCorrection: false, longestDays: DEFAULT_LONGEST_DAYS };

export interface MetricSizingEntry {
  metric: string;
  role: 'primary' | 'guardrail';
  kind: Metric['kind'];
  /** The direction sized for: the desired one for the primary, the harmful one for a guardrail. */
  direction: 'increase' | 'decrease';
  sides: 1 | 2;
  /** The level and power this metric was sized at. */
  alpha: number;
  power: number;
  /** Guardrails: the harm check at each analysis and the chance of a false alarm at some look. */
  guardrailLooks?: { looks: number; falseAlarm: number };
  result: StatsResult<MetricSizing>;
}

export interface PlanSizing {
  planId: string;
  /** Days in the planned window, both ends included, when it has both dates. */
  plannedDays?: number;
  dailyUnits?: number;
  uniqueUnits?: { days: number; units: number }[];
  metrics: MetricSizingEntry[];
  /**
   * The chance that the primary wins and no guardrail raises a false alarm (and, stricter, that
   * every guardrail also rules out its harm), metrics taken as independent, at the planned end.
   */
  family?: { primaryPower: number; noFalseAlarm: number; allGuardrailsClear: number };
  /** Why there is no family figure although the plan has guardrails: a power that is not known is not replaced by the planned one. */
  familyOmitted?: { reason: string };
}

function baselineOf(metric: Metric): MetricBaseline {
  if (metric.kind === 'proportion') return { kind: 'proportion', rate: metric.baseline.rate };
  if (metric.kind === 'mean') return { kind: 'mean', mean: metric.baseline.mean, sd: metric.baseline.sd };
  return { kind: 'ratio', ...metric.baseline };
}

/** Pre-period settings: the metric's own, else the design's correlation for the primary only. */
function prePeriodOf(metric: Metric, plan: Plan, role: 'primary' | 'guardrail'): { prePeriodCorrelation: number; prePeriodCoverage: number } {
  if (metric.prePeriod) return { prePeriodCorrelation: metric.prePeriod.correlation, prePeriodCoverage: metric.prePeriod.coverage };
  return { prePeriodCorrelation: role === 'primary' ? plan.design.prePeriodCorrelation : 0, prePeriodCoverage: 1 };
}

/** `sampleSizeOnly`: see `SizingRequest.sampleSizeOnly`; for checks that only ask whether a plan can be sized. */
export function sizePlan(plan: Plan, policy: SizingPolicy = DEFAULT_SIZING_POLICY, options: { sampleSizeOnly?: boolean } = {}): PlanSizing {
  const { design } = plan;
  const plannedDays = plan.window.start && plan.window.end && plan.window.end >= plan.window.start ? inclusiveDays(plan.window.start, plan.window.end) : undefined;
  const clustered = GROUP_UNITS.includes(plan.unit.randomization) && plan.unit.analysis !== plan.unit.randomization && design.cluster;
  const common: Omit<SizingRequest, 'baseline' | 'direction' | 'sides' | 'alpha' | 'power' | 'prePeriodCorrelation'> = {
    arms: design.arms,
    control: design.control,
    trafficShare: design.trafficShare,
    reach: plan.exposure.reach,
    interimLooks: design.interimLooks,
    boundary: design.interimBoundary,
    longestDays: policy.longestDays,
    ...(options.sampleSizeOnly ? { sampleSizeOnly: true } : {}),
    ...(design.dailyUnits !== undefined ? { dailyUnits: design.dailyUnits } : {}),
    ...(design.uniqueUnits ? { uniqueUnits: design.uniqueUnits } : {}),
    ...(clustered && design.cluster ? { cluster: { ...design.cluster, ...(design.groupsAvailable !== undefined ? { available: design.groupsAvailable } : {}) } } : {}),
    ...(plannedDays !== undefined ? { plannedDays } : {}),
  };

  const primary = plan.metrics.primary;
  const primaryAlpha = primary.alpha ?? design.alpha;
  const primaryPower = primary.power ?? design.power;
  const analyses = design.interimLooks + 1;
  const entries: MetricSizingEntry[] = [
    {
      metric: primary.name,
      role: 'primary',
      kind: primary.kind,
      direction: primary.direction,
      sides: design.sides,
      alpha: primaryAlpha,
      power: primaryPower,
      result: sizeMetric({
        ...common,
        ...prePeriodOf(primary, plan, 'primary'),
        alpha: primaryAlpha,
        power: primaryPower,
        baseline: baselineOf(primary),
        direction: primary.direction,
        sides: design.sides,
        ...(design.minDetectableEffect ? { effect: design.minDetectableEffect } : {}),
      }),
    },
    ...plan.metrics.guardrails.map((metric): MetricSizingEntry => {
      const harm = metric.direction === 'increase' ? 'decrease' : 'increase';
      const alpha = metric.alpha ?? policy.guardrailAlpha;
      const power = metric.power ?? policy.guardrailPower;
      return {
        metric: metric.name,
        role: 'guardrail',
        kind: metric.kind,
        direction: harm,
        sides: 1,
        alpha,
        power,
        ...(analyses > 1 ? { guardrailLooks: { looks: analyses, falseAlarm: falseAlarmAtSomeLook(analyses, alpha) } } : {}),
        result: sizeMetric({
          ...common,
          ...prePeriodOf(metric, plan, 'guardrail'),
          interimLooks: 0,
          alpha,
          power,
          hypothesis: 'non-inferiority',
          armCorrection: policy.guardrailArmCorrection,
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
    ...(design.uniqueUnits ? { uniqueUnits: design.uniqueUnits } : {}),
    metrics: entries,
    ...familyOf(entries),
  };
}

/**
 * The chance that a one-sided harm check at `alpha`, repeated at each of `looks` analyses, raises a false alarm at
 * some look. It depends on those two numbers only, and the integration behind it costs more than sizing a metric, so
 * each pair is computed once (a registry shares a handful of designs; the cache is emptied past 1,000 pairs).
 */
const falseAlarms = new Map<string, number>();
function falseAlarmAtSomeLook(looks: number, alpha: number): number {
  const key = `${looks}:${alpha}`;
  let chance = falseAlarms.get(key);
  if (chance === undefined) {
    chance = sequentialPower(Array.from({ length: looks }, () => normalUpperQuantile(alpha)), 1, 0);
    if (falseAlarms.size >= 1000) falseAlarms.clear();
    falseAlarms.set(key, chance);
  }
  return chance;
}

/**
 * Power for the family, at the planned end when there is one, else at the sizes computed (where each metric has
 * its planned power by definition). With a planned end, a metric whose power there is unknown (too few units by
 * then) leaves the family figure out with the reason: the planned power would claim a sample the test never has.
 */
function familyOf(entries: MetricSizingEntry[]): Pick<PlanSizing, 'family' | 'familyOmitted'> {
  const [primary, ...guardrails] = entries;
  if (!primary?.result.ok || guardrails.length === 0) return {};
  const omitted = (reason: string) => ({ familyOmitted: { reason } });
  const powerOf = (entry: MetricSizingEntry, sizing: MetricSizing): number | string => {
    const end = sizing.atPlannedEnd;
    if (!end) return entry.power;
    return end.power ?? `${entry.metric} has no power by the planned end; ${end.noPower?.reason ?? 'it could not be computed'}`;
  };
  if (!primary.result.value.effect) return omitted(`the primary metric ${primary.metric} has no minimum detectable effect`);
  const primaryPower = powerOf(primary, primary.result.value);
  if (typeof primaryPower === 'string') return omitted(primaryPower);
  let noFalseAlarm = 1;
  let allClear = 1;
  for (const g of guardrails) {
    if (!g.result.ok) return omitted(`guardrail ${g.metric} cannot be sized`);
    if (!g.result.value.effect) return omitted(`guardrail ${g.metric} has no tolerance, so the harm it must rule out is not known`);
    noFalseAlarm *= 1 - (g.guardrailLooks?.falseAlarm ?? g.alpha);
    const power = powerOf(g, g.result.value);
    if (typeof power === 'string') return omitted(power);
    allClear *= power;
  }
  return { family: { primaryPower, noFalseAlarm: primaryPower * noFalseAlarm, allGuardrailsClear: primaryPower * allClear } };
}
