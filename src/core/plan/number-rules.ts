import type { Rule } from '../source/rule-context.js';
import type { FieldPath } from '../source/yaml-source.js';
import { DEFAULT_SIZING_POLICY, sizePlan } from '../stats/plan-sizing.js';
import type { Metric, Plan } from './schema.js';

/**
 * The ranges within which a plan's numbers give meaningful arithmetic, and the plans sizing can
 * never size. The schema says what kind of number a field holds; these rules say how large or
 * small it may be, so no figure a report prints can overflow to Infinity or underflow to 0. Each
 * bound says where it comes from; docs/plan-limits.md lists them for users.
 */

export interface NumberBound {
  min: number;
  max: number;
  /** Why the range is what it is, shown as the "expected" part of the problem. */
  why: string;
}

/**
 * Figures in a metric's own units (means, standard deviations, absolute effects). Sizing squares
 * their ratios (spread over effect); between 1e-12 and 1e15 the largest such square is 1e54, far
 * inside the range of a double (1.8e308, IEEE 754), and 1e15 stays below 2^53 ≈ 9.0e15, past which a
 * double no longer holds every whole number.
 */
export const METRIC_FIGURE: NumberBound = { min: 1e-12, max: 1e15, why: 'a figure from 1e-12 to 1e15 in size (or 0 where 0 is allowed)' };

/**
 * A relative effect or tolerance. Below one in a million the sample runs past 10^13 units per arm even
 * at a 50% baseline (n ≈ 16·p(1−p)/δ², common practice, no source), more than the world's population;
 * above 100 (a 101-fold change) the "effect" is no longer a test of a change.
 */
export const RELATIVE_EFFECT: NumberBound = { min: 1e-6, max: 100, why: 'a relative change from 0.000001 to 100 (one in a million to a 101-fold change)' };

/**
 * Eligible units per day. At most 10^10: more than the world's population (about 8.1e9 in 2024, UN
 * World Population Prospects, from memory). At least 0.01, one unit in a hundred days: fewer can
 * never fill a test.
 */
export const DAILY_UNITS: NumberBound = { min: 0.01, max: 1e10, why: 'from 0.01 (one unit in a hundred days) to 10,000,000,000 (more than the world’s population)' };

/** An arm's weight: weights are relative, so a million to one already says everything; larger ones only risk overflow in their sum. */
export const ARM_WEIGHT: NumberBound = { min: 1e-6, max: 1e6, why: 'a weight from 0.000001 to 1,000,000' };

/** The smallest arm's share of the units: below one in a thousand an arm is a rounding error, not an arm. */
export const SMALLEST_ARM_SHARE = 0.001;

/**
 * Units per randomized group. Ten million is a large region; beyond it a "group" is the population.
 */
export const CLUSTER_MEAN_SIZE: NumberBound = { min: 1, max: 1e7, why: 'a mean group size from 1 to 10,000,000' };

/**
 * Coefficient of variation of group sizes. Reported values in practice run from about 0.4 to 1.5
 * (Eldridge, Ashby & Kerry 2006, from memory); 10 leaves wide room and keeps the design effect
 * (1 + ((cv² + 1)·m − 1)·icc) finite.
 */
export const CLUSTER_SIZE_CV: NumberBound = { min: 0, max: 10, why: 'a coefficient of variation of group sizes from 0 to 10' };

type Report = Parameters<Rule<Plan>>[0]['report'];

function checkBound(report: Report, path: FieldPath, value: number | undefined, bound: NumberBound, zeroAllowed = false): void {
  if (value === undefined) return;
  const size = Math.abs(value);
  if (zeroAllowed && value === 0) return;
  if (size >= bound.min && size <= bound.max) return;
  report({
    severity: 'error',
    code: 'plan/number-out-of-range',
    path,
    message: `${value} is ${size < bound.min ? 'too small' : 'too large'} for sizing to give a meaningful figure`,
    expected: bound.why,
  });
}

function metricFigures(metric: Metric, path: FieldPath, report: Report): void {
  const baseline: FieldPath = [...path, 'baseline'];
  if (metric.kind === 'mean') {
    checkBound(report, [...baseline, 'mean'], metric.baseline.mean, METRIC_FIGURE, true);
    checkBound(report, [...baseline, 'sd'], metric.baseline.sd, METRIC_FIGURE);
  }
  if (metric.kind === 'ratio') {
    for (const part of ['numerator', 'denominator'] as const) {
      checkBound(report, [...baseline, part, 'mean'], metric.baseline[part].mean, METRIC_FIGURE, true);
      checkBound(report, [...baseline, part, 'sd'], metric.baseline[part].sd, METRIC_FIGURE, true);
    }
  }
  if (metric.tolerance) effectFigures(metric.tolerance, [...path, 'tolerance'], report);
}

function effectFigures(effect: { relative?: number; absolute?: number }, path: FieldPath, report: Report): void {
  checkBound(report, [...path, 'relative'], effect.relative, RELATIVE_EFFECT);
  checkBound(report, [...path, 'absolute'], effect.absolute, METRIC_FIGURE);
}

/** Every number sizing uses lies in the range where its arithmetic stays finite and meaningful. */
function numbersInRange(plan: Plan, report: Report): void {
  const { design } = plan;
  checkBound(report, ['design', 'daily-units'], design.dailyUnits, DAILY_UNITS);
  if (design.minDetectableEffect) effectFigures(design.minDetectableEffect, ['design', 'min-detectable-effect'], report);
  design.arms.forEach((arm, i) => checkBound(report, ['design', 'arms', i, 'weight'], arm.weight, ARM_WEIGHT));
  const total = design.arms.reduce((sum, arm) => sum + arm.weight, 0);
  const smallest = design.arms.reduce((min, arm, i) => (arm.weight < design.arms[min]!.weight ? i : min), 0);
  if (design.arms.length > 0 && Number.isFinite(total) && design.arms[smallest]!.weight / total < SMALLEST_ARM_SHARE) {
    report({
      severity: 'error',
      code: 'plan/number-out-of-range',
      path: ['design', 'arms', smallest, 'weight'],
      message: `arm "${design.arms[smallest]!.name}" gets ${design.arms[smallest]!.weight} of ${total} weight, less than one unit in ${1 / SMALLEST_ARM_SHARE}`,
      expected: `a weight giving every arm at least ${SMALLEST_ARM_SHARE * 100}% of the units`,
    });
  }
  if (design.cluster) {
    checkBound(report, ['design', 'cluster', 'mean-size'], design.cluster.meanSize, CLUSTER_MEAN_SIZE);
    checkBound(report, ['design', 'cluster', 'size-cv'], design.cluster.sizeCv, CLUSTER_SIZE_CV, true);
  }
  metricFigures(plan.metrics.primary, ['metrics', 'primary'], report);
  plan.metrics.guardrails.forEach((m, i) => metricFigures(m, ['metrics', 'guardrails', i], report));
  plan.metrics.secondary.forEach((m, i) => metricFigures(m, ['metrics', 'secondary', i], report));
}

/**
 * A plan whose own figures make sizing impossible (a relative effect on a baseline of 0, a ratio whose
 * numerator and denominator move in perfect step, an effect that takes a rate outside (0, 1)) fails
 * validation at the field at fault, with the very message sizing gives: the rule asks sizing itself.
 * Interim looks are left out (they cannot make an effect or a baseline impossible, and cost time).
 */
function sizeable(plan: Plan, report: Report): void {
  const sizing = sizePlan({ ...plan, design: { ...plan.design, interimLooks: 0 } }, DEFAULT_SIZING_POLICY, { sampleSizeOnly: true });
  for (const entry of sizing.metrics) {
    if (entry.result.ok) continue;
    const { input, message } = entry.result.error;
    const guardrail = plan.metrics.guardrails.findIndex((m) => m.name === entry.metric);
    if (entry.role !== 'primary' && guardrail < 0) continue;
    const metricPath: FieldPath = entry.role === 'primary' ? ['metrics', 'primary'] : ['metrics', 'guardrails', guardrail];
    const effectPath: FieldPath = entry.role === 'primary' ? ['design', 'min-detectable-effect'] : [...metricPath, 'tolerance'];
    let path: FieldPath | undefined;
    if (input === 'effect') path = effectPath;
    else if (input === 'baseline' || input.startsWith('baseline.')) path = [...metricPath, ...input.split('.')];
    if (!path) continue;
    const metric = entry.role === 'primary' ? plan.metrics.primary : plan.metrics.guardrails[guardrail]!;
    const effect = entry.role === 'primary' ? plan.design.minDetectableEffect : metric.tolerance;
    report({
      severity: 'error',
      code: 'plan/cannot-be-sized',
      path,
      message: `${entry.metric} cannot be sized: ${message}`,
      expected: input === 'effect' ? expectedEffect(metric, effect, entry.direction) : expectedBaseline(metric, input),
    });
  }
}

type Effect = { relative?: number; absolute?: number };

/** Up to four significant digits, as a plan would write them: 0.7, 2.333. */
const short = (x: number) => String(Number(x.toPrecision(4)));

/**
 * What to write instead of an effect sizing cannot use. Sizing's error names the input and says what
 * went wrong; the fix depends on why, so the cause is read again from the plan's own figures.
 */
function expectedEffect(metric: Metric, effect: Effect | undefined, direction: 'increase' | 'decrease'): string {
  if (!effect) return 'an effect, relative or absolute';
  if (metric.kind === 'proportion') {
    const rate = metric.baseline.rate;
    // The room the rate has before it reaches 1 (rising) or 0 (falling); the target must stay strictly inside.
    const room = direction === 'increase' ? 1 - rate : rate;
    const change = effect.absolute ?? (effect.relative ?? 0) * rate;
    if (change >= room) {
      return `an effect that keeps the rate inside (0, 1): ${direction === 'increase' ? 'a rise' : 'a fall'} of less than ${short(room)} absolute here (from ${short(rate)}), or less than ${short(room / rate)} relative`;
    }
  }
  const baseline = metric.kind === 'mean' ? metric.baseline.mean : metric.kind === 'ratio' ? metric.baseline.numerator.mean / metric.baseline.denominator.mean : undefined;
  if (baseline === 0 && effect.absolute === undefined) {
    return `an absolute effect in the metric's own units, as in { absolute: 0.5 }: a relative change of a baseline of 0 is 0`;
  }
  return 'an effect above 0 that sizing can use, relative or absolute';
}

/** What to write instead of baseline figures sizing cannot use, by the figure sizing names. */
function expectedBaseline(metric: Metric, input: string): string {
  if (metric.kind === 'ratio' && input === 'baseline') {
    return 'a numerator and denominator that do not move in perfect step: a correlation below 1, or standard deviations not in the proportion of the means';
  }
  if (input.endsWith('.sd')) return 'a standard deviation above 0';
  if (input === 'baseline.denominator.mean') return "a denominator's mean above 0";
  if (input === 'baseline.correlation') return 'a correlation from -1 to 1';
  if (input === 'baseline.rate') return 'a rate strictly between 0 and 1';
  return 'baseline figures sizing can use';
}

/** Numbers out of range are reported first; only a plan whose numbers are all in range is handed to sizing. */
const numbersAreSizeable: Rule<Plan> = ({ value: plan, report }) => {
  let outOfRange = 0;
  numbersInRange(plan, (problem) => {
    outOfRange++;
    report(problem);
  });
  if (outOfRange === 0) sizeable(plan, report);
};

export const NUMBER_RULES: readonly Rule<Plan>[] = [numbersAreSizeable];
