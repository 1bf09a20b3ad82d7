import { bonferroniAlpha, designEffect, varianceReduction } from './adjustments.js';
import { durationFor, type Duration } from './duration.js';
import { meanDetectable, meanPower, meanSampleSize, type MeanMethod } from './mean.js';
import { proportionDetectable, proportionPower, proportionSampleSize } from './proportion.js';
import { ratioMoments, type RatioBaseline } from './ratio.js';
import { fail, ok, type StatsResult } from './result.js';
import { sequentialInflation, type BoundaryKind } from './sequential.js';

/**
 * Sizing one metric of a design: units per arm and in total, days and weeks, power and detectable
 * effect by a planned end, with every multiplier that applied. Pure: the caller supplies every
 * figure, including the planned number of days.
 */

export type MetricBaseline =
  | { kind: 'proportion'; rate: number }
  | { kind: 'mean'; mean: number; sd: number }
  | ({ kind: 'ratio' } & RatioBaseline);

export interface EffectSize {
  relative?: number;
  absolute?: number;
}

export interface SizingRequest {
  baseline: MetricBaseline;
  /** Which way the effect to detect goes. */
  direction: 'increase' | 'decrease';
  /** The effect to detect; absent: only the detectable effect by the planned end is computed. */
  effect?: EffectSize;
  /** Relative weights, control first or named by `control`. */
  arms: { name: string; weight: number }[];
  control: string;
  alpha: number;
  power: number;
  sides: 1 | 2;
  /** Expected new eligible units per day; absent: no durations. */
  dailyUnits?: number;
  /** Share of eligible units enrolled, (0, 1]. */
  trafficShare: number;
  /** Share of exposed units that reach the changed experience, (0, 1]. */
  reach: number;
  interimLooks: number;
  boundary: BoundaryKind;
  prePeriodCorrelation: number;
  /** Group randomization with analysis over smaller units. */
  cluster?: { meanSize: number; icc: number; sizeCv: number };
  /** Days in the planned window, both ends included. */
  plannedDays?: number;
  /** `auto` (the default): exact t below EXACT_T_LIMIT control units, normal above. Proportions always use the z test. */
  method?: MeanMethod | 'auto';
}

export interface Multipliers {
  /** Bonferroni: significance level per comparison when several treatment arms face one control. */
  comparisons: number;
  alphaPerComparison: number;
  designEffect: number;
  varianceReduction: number;
  /** Maximum-sample-size inflation for the interim looks. */
  sequential: number;
  /** Diluted analysis over all exposed units, against the triggered analysis: on units and on days. */
  dilutionUnits: number;
  dilutionDays: number;
}

export interface AnalysisSize {
  /** Units needed in each arm, rounded up. */
  perArm: { arm: string; units: number }[];
  totalUnits: number;
  /** Groups to randomize, when groups are randomized. */
  clusters?: number;
  duration?: Duration;
}

export interface MetricSizing {
  baselineValue: number;
  /** Per-unit standard deviation (means and ratios). */
  sd?: number;
  /** The effect sized for, among units that reach the change. */
  effect?: { absolute: number; relative: number; from: number; to: number };
  multipliers: Multipliers;
  /** With interim looks: the critical |z| and nominal p-value at each analysis, in order. */
  boundaries?: { kind: BoundaryKind; z: number[]; nominalP: number[] };
  /** Analysis of the units that reach the change (exposure logged where the change is). */
  triggered?: AnalysisSize;
  /** Analysis of every exposed unit, as logged; present when reach < 1. */
  diluted?: AnalysisSize;
  /** The analysis the plan's logging gives: diluted when reach < 1, else triggered. */
  headline?: AnalysisSize;
  /** At the planned end, for the headline analysis. */
  atPlannedEnd?: {
    days: number;
    totalUnits: number;
    power?: number;
    detectable?: { absolute: number; relative: number; to: number };
  };
  /** Power of the headline analysis by day: daily up to three weeks, weekly beyond. */
  powerByDay?: { day: number; power: number }[];
  notes: string[];
}

interface Comparison {
  /** Control units needed for the target power, before multipliers. */
  controlUnits(effect: number): StatsResult<number>;
  power(effect: number, controlUnits: number): StatsResult<number>;
  detectable(controlUnits: number): StatsResult<number>;
}

/** Builds the two-sample calculation for one treatment arm against the control. */
function comparisonFor(request: SizingRequest, ratio: number, alpha: number, method: MeanMethod): StatsResult<Comparison & { value: number; sd?: number }> {
  const settings = { alpha, sides: request.sides, ratio };
  const sign = request.direction === 'increase' ? 1 : -1;
  const { baseline } = request;
  if (baseline.kind === 'proportion') {
    const p1 = baseline.rate;
    if (!(p1 > 0 && p1 < 1)) return fail('baseline.rate', `a baseline rate must be strictly between 0 and 1; got ${p1}`);
    return ok({
      value: p1,
      controlUnits: (d) => proportionSampleSize({ ...settings, p1, p2: p1 + sign * d }, request.power),
      power: (d, n1) => proportionPower({ ...settings, p1, p2: p1 + sign * d }, n1),
      detectable: (n1) => {
        const p2 = proportionDetectable({ ...settings, p1 }, n1, request.power, request.direction);
        return p2.ok ? ok(Math.abs(p2.value - p1)) : p2;
      },
    });
  }
  if (baseline.kind === 'mean' && !(baseline.sd > 0)) return fail('baseline.sd', `the standard deviation must be above 0; got ${baseline.sd}`);
  const moments = baseline.kind === 'mean' ? ok({ ratio: baseline.mean, sd: baseline.sd }) : ratioMoments(baseline);
  if (!moments.ok) return moments;
  const { ratio: value, sd } = moments.value;
  const chosen = method;
  return ok({
    value,
    sd,
    controlUnits: (d) => meanSampleSize({ ...settings, delta: d, sd, method: chosen }, request.power),
    power: (d, n1) => meanPower({ ...settings, delta: d, sd, method: chosen }, n1),
    detectable: (n1) => meanDetectable({ ...settings, sd, method: chosen }, n1, request.power),
  });
}

function effectIn(effect: EffectSize, value: number, kind: MetricBaseline['kind']): StatsResult<number> {
  if (effect.absolute !== undefined) return effect.absolute > 0 ? ok(effect.absolute) : fail('effect', 'the effect must be above 0');
  if (effect.relative === undefined) return fail('effect', 'give the effect as relative or absolute');
  if (!(effect.relative > 0)) return fail('effect', 'the effect must be above 0');
  if (value === 0) return fail('effect', `a relative effect of a ${kind} whose baseline is 0 is 0; give an absolute effect`);
  return ok(Math.abs(value) * effect.relative);
}

/**
 * Above this many control units the normal calculation is used for means and ratios. The exact
 * answer exceeds the normal one by about z^2 / 4 units per arm whatever the sample (0.96 at
 * alpha 0.05 two-sided; test/stats/sizing.test.ts), which is nothing at a thousand units, while
 * the exact series costs a hundred times more.
 */
export const EXACT_T_LIMIT = 1_000;

/** `auto`: the exact noncentral-t calculation for small samples, the normal one beyond EXACT_T_LIMIT. */
function chooseMethod(request: SizingRequest, normal: Comparison & { value: number }, enrolledPerDay: number | undefined): MeanMethod {
  if (request.method === 'normal' || request.method === 'exact') return request.method;
  if (request.baseline.kind === 'proportion') return 'normal';
  let n1: number | undefined;
  if (request.effect) {
    const d = effectIn(request.effect, normal.value, request.baseline.kind);
    const size = d.ok ? normal.controlUnits(d.value * request.reach) : undefined;
    n1 = size?.ok ? size.value : undefined;
  } else if (request.plannedDays !== undefined && enrolledPerDay !== undefined) {
    n1 = request.plannedDays * enrolledPerDay;
  }
  return n1 !== undefined && n1 > EXACT_T_LIMIT ? 'normal' : 'exact';
}

/** Rounds a unit count up, guarding the report from NaN and Infinity. */
function units(n: number): number {
  return Math.ceil(n - 1e-9);
}

export function sizeMetric(request: SizingRequest): StatsResult<MetricSizing> {
  const control = request.arms.find((a) => a.name === request.control);
  if (!control) return fail('arms', `the control arm "${request.control}" is not one of the arms`);
  const treatments = request.arms.filter((a) => a !== control);
  if (treatments.length === 0) return fail('arms', 'at least one treatment arm is needed');
  if (request.arms.some((a) => !(a.weight > 0))) return fail('arms', 'every arm weight must be above 0');
  if (!(request.trafficShare > 0 && request.trafficShare <= 1)) return fail('traffic-share', `the share of traffic must be in (0, 1]; got ${request.trafficShare}`);
  if (!(request.reach > 0 && request.reach <= 1)) return fail('exposure.reach', `reach must be in (0, 1]; got ${request.reach}`);
  if (request.dailyUnits !== undefined && !(request.dailyUnits > 0)) return fail('daily-units', 'zero traffic: no test can reach its sample');

  const totalWeight = request.arms.reduce((s, a) => s + a.weight, 0);
  const alphaPerComparison = bonferroniAlpha(request.alpha, treatments.length);
  const sequential =
    request.interimLooks > 0
      ? sequentialInflation({ kind: request.boundary, looks: request.interimLooks + 1, alpha: alphaPerComparison, sides: request.sides }, request.power)
      : ok({ inflation: 1, boundaries: undefined });
  if (!sequential.ok) return sequential;
  const boundaries = sequential.value.boundaries;
  const de = request.cluster ? designEffect(request.cluster.meanSize, request.cluster.icc, request.cluster.sizeCv) : 1;
  const vr = varianceReduction(request.prePeriodCorrelation);
  const inflate = de * vr * sequential.value.inflation;
  const enrolledPerDay = request.dailyUnits === undefined ? undefined : request.dailyUnits * request.trafficShare;

  const probe = comparisonFor(request, 1, alphaPerComparison, 'normal');
  if (!probe.ok) return probe;
  const method = chooseMethod(request, probe.value, enrolledPerDay);

  const comparisons: (Comparison & { weight: number })[] = [];
  for (const arm of treatments) {
    const built = comparisonFor(request, arm.weight / control.weight, alphaPerComparison, method);
    if (!built.ok) return built;
    comparisons.push({ ...built.value, weight: arm.weight });
  }
  const value = probe.value.value;
  const notes: string[] = [];

  /** Total units for effect d: the comparison that needs the most decides. */
  const totalFor = (d: number): StatsResult<number> => {
    let worst = 0;
    for (const c of comparisons) {
      const n1 = c.controlUnits(d);
      if (!n1.ok) return n1;
      worst = Math.max(worst, (n1.value * totalWeight) / control.weight);
    }
    return ok(worst * inflate);
  };
  const sizeFromTotal = (total: number, perDay: number | undefined): AnalysisSize => {
    // No arm can be analysed with fewer than two units, whatever the formula says.
    const perArm = request.arms.map((a) => ({ arm: a.name, units: Math.max(2, units((total * a.weight) / totalWeight)) }));
    const totalUnits = perArm.reduce((s, a) => s + a.units, 0);
    const duration = perDay === undefined ? undefined : durationFor(totalUnits, perDay);
    return {
      perArm,
      totalUnits,
      ...(request.cluster ? { clusters: units(totalUnits / request.cluster.meanSize) } : {}),
      ...(duration ? { duration } : {}),
    };
  };

  const dilutedAnalysis = request.reach < 1;
  let effect: MetricSizing['effect'];
  let triggered: AnalysisSize | undefined;
  let diluted: AnalysisSize | undefined;
  let dilutionUnits = 1;
  let dilutionDays = 1;
  if (request.effect) {
    const d = effectIn(request.effect, value, request.baseline.kind);
    if (!d.ok) return d;
    const sign = request.direction === 'increase' ? 1 : -1;
    effect = { absolute: sign * d.value, relative: value === 0 ? 0 : (sign * d.value) / Math.abs(value), from: value, to: value + sign * d.value };
    const trig = totalFor(d.value);
    if (!trig.ok) return trig;
    triggered = sizeFromTotal(trig.value, enrolledPerDay === undefined ? undefined : enrolledPerDay * request.reach);
    if (dilutedAnalysis) {
      // Units that never reach the change still count: the effect on all exposed units shrinks by reach.
      const dil = totalFor(d.value * request.reach);
      if (!dil.ok) return dil;
      diluted = sizeFromTotal(dil.value, enrolledPerDay);
      dilutionUnits = dil.value / trig.value;
      dilutionDays = dilutionUnits * request.reach;
    }
  }

  const headlineReach = dilutedAnalysis ? 1 : request.reach;
  const headlineScale = dilutedAnalysis ? request.reach : 1;
  /** Control units at a total enrolment, after the multipliers. */
  const controlAt = (totalEnrolled: number) => (totalEnrolled * control.weight) / totalWeight / inflate;
  const powerAt = (totalEnrolled: number, d: number): StatsResult<number> => {
    let weakest = 1;
    const n1 = controlAt(totalEnrolled);
    for (const c of comparisons) {
      const p = c.power(d * headlineScale, n1);
      if (!p.ok) return p;
      weakest = Math.min(weakest, p.value);
    }
    return ok(weakest);
  };

  let atPlannedEnd: MetricSizing['atPlannedEnd'];
  if (request.plannedDays !== undefined && enrolledPerDay !== undefined) {
    const totalUnits = Math.floor(request.plannedDays * enrolledPerDay * headlineReach);
    const n1 = controlAt(totalUnits);
    atPlannedEnd = { days: request.plannedDays, totalUnits };
    if (effect) {
      const p = powerAt(totalUnits, Math.abs(effect.absolute));
      if (p.ok) atPlannedEnd.power = p.value;
    }
    let detectable = 0;
    let failed: string | undefined;
    for (const c of comparisons) {
      const dd = c.detectable(n1);
      if (!dd.ok) {
        failed = dd.error.message;
        break;
      }
      detectable = Math.max(detectable, dd.value / headlineScale);
    }
    if (failed) notes.push(`No effect is detectable by the planned end: ${failed}.`);
    else {
      const sign = request.direction === 'increase' ? 1 : -1;
      atPlannedEnd.detectable = { absolute: sign * detectable, relative: value === 0 ? 0 : (sign * detectable) / Math.abs(value), to: value + sign * detectable };
    }
    if (atPlannedEnd.power !== undefined && atPlannedEnd.power < request.power) {
      notes.push(`The planned ${request.plannedDays} days give ${(atPlannedEnd.power * 100).toFixed(0)}% power, below the planned ${(request.power * 100).toFixed(0)}%.`);
    }
  }

  const headline = diluted ?? triggered;
  let powerByDay: MetricSizing['powerByDay'];
  if (effect && enrolledPerDay !== undefined && headline?.duration) {
    // Daily points for short tests, weekly ones beyond three weeks; one step past the longer of
    // the needed and the planned duration, and never more than 30 points.
    const horizon = Math.max(headline.duration.days, request.plannedDays ?? 0);
    const step = horizon <= 21 ? 1 : 7;
    const last = Math.min(30 * step, Math.ceil(horizon / step) * step + step);
    powerByDay = [];
    for (let day = step; day <= last; day += step) {
      const p = powerAt(day * enrolledPerDay * headlineReach, Math.abs(effect.absolute));
      if (p.ok) powerByDay.push({ day, power: p.value });
    }
  }

  return ok({
    baselineValue: value,
    ...(probe.value.sd !== undefined ? { sd: probe.value.sd } : {}),
    ...(effect ? { effect } : {}),
    multipliers: {
      comparisons: treatments.length,
      alphaPerComparison,
      designEffect: de,
      varianceReduction: vr,
      sequential: sequential.value.inflation,
      dilutionUnits,
      dilutionDays,
    },
    ...(boundaries ? { boundaries: { kind: request.boundary, z: boundaries.z, nominalP: boundaries.nominalP } } : {}),
    ...(triggered ? { triggered } : {}),
    ...(diluted ? { diluted } : {}),
    ...(headline ? { headline } : {}),
    ...(atPlannedEnd ? { atPlannedEnd } : {}),
    ...(powerByDay ? { powerByDay } : {}),
    notes,
  });
}
