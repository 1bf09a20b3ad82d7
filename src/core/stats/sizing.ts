import { bonferroniAlpha, designEffect, varianceReduction } from './adjustments.js';
import type { Duration } from './duration.js';
import { normalQuantile, normalUpperQuantile, studentQuantile } from './distributions.js';
import { nonInferiorityProportionMargin, nonInferiorityProportionPower, nonInferiorityProportionSize } from './non-inferiority.js';
import { dailyCurve, uniqueUnitsCurve, unitsAmount, type TrafficCurve } from './traffic.js';
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
  /** New eligible units per day (units not seen before); absent with no uniqueUnits: no durations. */
  dailyUnits?: number;
  /** Different eligible units seen over two spans; replaces dailyUnits for days, power and detectable effect. */
  uniqueUnits?: { days: number; units: number }[];
  /** `non-inferiority`: rule out harm of the effect's size when there is no true difference (guardrails). */
  hypothesis?: 'superiority' | 'non-inferiority';
  /** Share of units with a pre-period value (CUPED); the variance left is 1 - coverage × correlation². Default 1. */
  prePeriodCoverage?: number;
  /** False: no Bonferroni correction across treatment arms (guardrails, unless the settings ask). Default true. */
  armCorrection?: boolean;
  /** Beyond this many days a test is not feasible at this traffic (default 56). */
  longestDays?: number;
  /** Share of eligible units enrolled, (0, 1]. */
  trafficShare: number;
  /** Share of exposed units that reach the changed experience, (0, 1]. */
  reach: number;
  interimLooks: number;
  boundary: BoundaryKind;
  prePeriodCorrelation: number;
  /** Group randomization with analysis over smaller units. */
  cluster?: { meanSize: number; icc: number; sizeCv: number; available?: number };
  /**
   * Stop at the sample size and its duration: no power at the planned end, no power curve, no detectable effect
   * at the longest window, no better allocation. Validation asks only whether a plan can be sized, for every plan
   * in the repository, and those extras are most of the work.
   */
  sampleSizeOnly?: boolean;
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
  /** Groups to randomize, when groups are randomized: whole groups in each arm, and their sum. */
  clusters?: number;
  clustersPerArm?: { arm: string; groups: number }[];
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
    /** Whole units enrolled by then. */
    totalUnits: number;
    power?: number;
    /** Why there is no power, when an effect was given but the units by then are too few to compute one. */
    noPower?: { reason: string; tooFewUnits?: true };
    detectable?: { absolute: number; relative: number; to: number };
    /** Why there is no detectable effect: none within the metric's range, or too few units. */
    noneDetectable?: { reason: string };
  };
  /** Power of the headline analysis by day: daily up to three weeks, weekly beyond. */
  powerByDay?: { day: number; power: number }[];
  /** How the traffic was given: new units a day, or a curve of different units. */
  traffic?: TrafficCurve['source'];
  /** Whether the test fits the longest sensible window at this traffic, and what that window can detect. */
  feasibility?: Feasibility;
  /** Several treatment arms: control at sqrt(k) times a treatment arm's share, when that saves units. */
  squareRootAllocation?: { controlWeight: number; treatmentWeight: number; totalUnits: number; unitsSaved: number };
  notes: string[];
}

export interface Feasibility {
  feasible: boolean;
  longestDays: number;
  /** Why not, when not. */
  reason?: string;
  /** What the longest window can detect. */
  detectableAtLongest?: { absolute: number; relative: number; to: number };
  /** Why the longest window can detect nothing: no change within the metric's range, or too few units. */
  noneDetectableAtLongest?: { reason: string };
}

/**
 * The values a metric can take, where the plan fixes them: a rate lies within 0 and 1. The plan
 * format puts no bound on a mean or a ratio (a mean of profit can be negative), so neither is checked.
 */
function rangeOf(kind: MetricBaseline['kind']): { low: number; high: number; text: string } | undefined {
  return kind === 'proportion' ? { low: 0, high: 1, text: '0–100%' } : undefined;
}

/** "2 units", "1 unit", or "fewer than 1 unit (0.28 expected)": whole units, honest about a fraction below one. */
export function enrolledText(expected: number): string {
  if (expected < 1) return `fewer than 1 unit (${unitsAmount(expected)} expected)`;
  const whole = Math.floor(expected);
  return `${unitsAmount(whole)} ${whole === 1 ? 'unit' : 'units'}`;
}

/** A test needing more units than this is not a test at any traffic (and beyond what a double counts exactly). */
export const ABSURD_UNITS = 1e12;
export const DEFAULT_LONGEST_DAYS = 56;

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
    if (request.hypothesis === 'non-inferiority') {
      const test = { p: p1, alpha, ratio };
      return ok({
        value: p1,
        controlUnits: (d) => nonInferiorityProportionSize(test, d, request.power),
        power: (d, n1) => nonInferiorityProportionPower(test, d, n1),
        detectable: (n1) => nonInferiorityProportionMargin(test, n1, request.power),
      });
    }
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
function chooseMethod(request: SizingRequest, normal: Comparison & { value: number }, enrolledAtEnd: number | undefined): MeanMethod {
  if (request.method === 'normal' || request.method === 'exact') return request.method;
  if (request.baseline.kind === 'proportion') return 'normal';
  let n1: number | undefined;
  if (request.effect) {
    const d = effectIn(request.effect, normal.value, request.baseline.kind);
    const size = d.ok ? normal.controlUnits(d.value * request.reach) : undefined;
    n1 = size?.ok ? size.value : undefined;
  } else if (enrolledAtEnd !== undefined) {
    n1 = enrolledAtEnd;
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
  const coverage = request.prePeriodCoverage ?? 1;
  if (!(coverage > 0 && coverage <= 1)) return fail('pre-period.coverage', `the share of units with a pre-period value must be in (0, 1]; got ${coverage}`);
  const curve = request.uniqueUnits ? uniqueUnitsCurve(request.uniqueUnits) : request.dailyUnits !== undefined ? dailyCurve(request.dailyUnits) : undefined;
  if (curve && !curve.ok) return curve;
  const traffic = curve?.value;
  const longestDays = request.longestDays ?? DEFAULT_LONGEST_DAYS;

  const totalWeight = request.arms.reduce((s, a) => s + a.weight, 0);
  const alphaPerComparison = request.armCorrection === false ? request.alpha : bonferroniAlpha(request.alpha, treatments.length);
  const sequential =
    request.interimLooks > 0
      ? sequentialInflation({ kind: request.boundary, looks: request.interimLooks + 1, alpha: alphaPerComparison, sides: request.sides }, request.power)
      : ok({ inflation: 1, boundaries: undefined });
  if (!sequential.ok) return sequential;
  const boundaries = sequential.value.boundaries;
  const de = request.cluster ? designEffect(request.cluster.meanSize, request.cluster.icc, request.cluster.sizeCv) : 1;
  const vr = varianceReduction(request.prePeriodCorrelation, coverage);
  const inflate = de * vr * sequential.value.inflation;
  /** Units enrolled by day d: different eligible units seen, times the share enrolled. */
  const enrolledBy = traffic ? (day: number) => traffic.unitsBy(day) * request.trafficShare : undefined;
  const enrolledPerDay = enrolledBy?.(1);

  const probe = comparisonFor(request, 1, alphaPerComparison, 'normal');
  if (!probe.ok) return probe;
  const method = chooseMethod(request, probe.value, request.plannedDays !== undefined && enrolledBy ? enrolledBy(request.plannedDays) : undefined);

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
  const sizeFromTotal = (total: number, reachShare: number | undefined): AnalysisSize => {
    // No arm can be analysed with fewer than two units, whatever the formula says.
    let perArm = request.arms.map((a) => ({ arm: a.name, units: Math.max(2, units((total * a.weight) / totalWeight)) }));
    let clustersPerArm: { arm: string; groups: number }[] | undefined;
    if (request.cluster) {
      const groups = wholeGroupsPerArm(perArm, request.cluster.meanSize, alphaPerComparison, request.sides, request.power);
      clustersPerArm = groups;
      perArm = groups.map((g) => ({ arm: g.arm, units: units(g.groups * request.cluster!.meanSize) }));
    }
    const totalUnits = perArm.reduce((s, a) => s + a.units, 0);
    const day = traffic && reachShare !== undefined && totalUnits < ABSURD_UNITS ? traffic.dayFor(totalUnits / (request.trafficShare * reachShare)) : undefined;
    const duration = day === undefined ? undefined : { days: day, weeks: Math.ceil(day / 7) };
    return {
      perArm,
      totalUnits,
      ...(clustersPerArm ? { clusters: clustersPerArm.reduce((s, g) => s + g.groups, 0), clustersPerArm } : {}),
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
    triggered = sizeFromTotal(trig.value, traffic ? request.reach : undefined);
    if (dilutedAnalysis) {
      // Units that never reach the change still count: the effect on all exposed units shrinks by reach.
      const dil = totalFor(d.value * request.reach);
      if (!dil.ok) return dil;
      diluted = sizeFromTotal(dil.value, traffic ? 1 : undefined);
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

  /**
   * The effect the headline analysis detects with the planned power at an expected enrolment (whole units count),
   * or why none: a detectable change past the metric's range (a rate below 0% or above 100%) is no change at all.
   */
  const range = rangeOf(request.baseline.kind);
  const detectableAt = (expected: number): { ok: true; value: { absolute: number; relative: number; to: number } } | { ok: false; reason: string } => {
    const within = range ? `no change within ${range.text}` : 'no change';
    const none = { ok: false as const, reason: `${within} is detectable with ${enrolledText(expected)}` };
    const n1 = controlAt(Math.floor(expected));
    if (!(n1 > 0)) return none;
    let detectable = 0;
    for (const c of comparisons) {
      const dd = c.detectable(n1);
      // Input 'n' means the units are too few (or even the edge of the range is not detectable); anything else is named.
      if (!dd.ok) return dd.error.input === 'n' ? none : { ok: false, reason: dd.error.message };
      detectable = Math.max(detectable, dd.value / headlineScale);
    }
    const sign = request.direction === 'increase' ? 1 : -1;
    const to = value + sign * detectable;
    if (range && !(to >= range.low && to <= range.high)) return none;
    return { ok: true, value: { absolute: sign * detectable, relative: value === 0 ? 0 : (sign * detectable) / Math.abs(value), to } };
  };

  let atPlannedEnd: MetricSizing['atPlannedEnd'];
  if (request.plannedDays !== undefined && enrolledBy && !request.sampleSizeOnly) {
    const expected = enrolledBy(request.plannedDays) * headlineReach;
    const totalUnits = Math.floor(expected);
    atPlannedEnd = { days: request.plannedDays, totalUnits };
    if (effect) {
      const p = totalUnits > 0 ? powerAt(totalUnits, Math.abs(effect.absolute)) : undefined;
      if (p?.ok) atPlannedEnd.power = p.value;
      else atPlannedEnd.noPower = p && p.error.input !== 'n' ? { reason: p.error.message } : { reason: `${enrolledText(expected)} by then, too few to analyse`, tooFewUnits: true };
    }
    const detectable = detectableAt(expected);
    if (detectable.ok) atPlannedEnd.detectable = detectable.value;
    else atPlannedEnd.noneDetectable = { reason: detectable.reason };
  }

  const headline = diluted ?? triggered;
  const available = request.cluster?.available;
  if (headline?.clusters !== undefined && available !== undefined && headline.clusters > available) {
    notes.push(`The design needs ${headline.clusters.toLocaleString('en-US')} groups, but only ${available.toLocaleString('en-US')} exist: plan for a larger effect, a pre-period adjustment, or a smaller randomization unit.`);
  }
  let powerByDay: MetricSizing['powerByDay'];
  if (effect && enrolledBy && headline?.duration && !request.sampleSizeOnly) {
    // Daily points for short tests, weekly ones beyond three weeks; one step past the longer of
    // the needed and the planned duration, and never more than 30 points.
    const horizon = Math.max(headline.duration.days, request.plannedDays ?? 0);
    const step = horizon <= 21 ? 1 : 7;
    const last = Math.min(30 * step, Math.ceil(horizon / step) * step + step);
    powerByDay = [];
    for (let day = step; day <= last; day += step) {
      const p = powerAt(enrolledBy(day) * headlineReach, Math.abs(effect.absolute));
      if (p.ok) powerByDay.push({ day, power: p.value });
    }
  }

  // Feasibility: a test that needs more than the longest sensible window, or an absurd sample, is
  // not a test at this traffic; say what the longest window can detect instead.
  let feasibility: Feasibility | undefined;
  if (headline) {
    const tooMany = headline.totalUnits >= ABSURD_UNITS;
    const tooLong = enrolledBy !== undefined && (headline.duration === undefined || headline.duration.days > longestDays);
    if (tooMany || tooLong) {
      const reason = tooMany
        ? `it needs more than ${ABSURD_UNITS.toExponential(0).replace('e+', ' × 10^')} units`
        : headline.duration
          ? `it needs ${unitsAmount(headline.duration.days)} days, beyond the longest sensible window of ${longestDays} days`
          : `the traffic never reaches its sample`;
      const atLongest = enrolledBy && !request.sampleSizeOnly ? detectableAt(enrolledBy(longestDays) * headlineReach) : undefined;
      feasibility = {
        feasible: false,
        longestDays,
        reason,
        ...(atLongest ? (atLongest.ok ? { detectableAtLongest: atLongest.value } : { noneDetectableAtLongest: { reason: atLongest.reason } }) : {}),
      };
    } else feasibility = { feasible: true, longestDays };
  }

  // Several treatment arms share one control: giving the control sqrt(k) times a treatment arm's
  // share minimizes the total for k equal comparisons (Dunnett 1955; e.g. Bretz, Hothorn & Westfall,
  // "Multiple Comparisons Using R", 2010, sec. 4.1; from memory).
  let squareRootAllocation: MetricSizing['squareRootAllocation'];
  const k = treatments.length;
  if (k >= 2 && headline && !request.cluster && !request.sampleSizeOnly) {
    const treatmentWeight = treatments.reduce((s, a) => s + a.weight, 0) / k;
    const controlWeight = Math.sqrt(k) * treatmentWeight;
    if (Math.abs(control.weight / treatmentWeight - Math.sqrt(k)) > 0.05) {
      const better = sizeMetric({ ...request, arms: [{ name: control.name, weight: controlWeight }, ...treatments.map((a) => ({ name: a.name, weight: treatmentWeight }))] });
      const betterHeadline = better.ok ? better.value.headline : undefined;
      if (betterHeadline && betterHeadline.totalUnits < headline.totalUnits) {
        squareRootAllocation = { controlWeight, treatmentWeight, totalUnits: betterHeadline.totalUnits, unitsSaved: headline.totalUnits - betterHeadline.totalUnits };
      }
    }
  }

  return ok({
    baselineValue: value,
    ...(probe.value.sd !== undefined ? { sd: probe.value.sd } : {}),
    ...(effect ? { effect } : {}),
    multipliers: {
      comparisons: request.armCorrection === false ? 1 : treatments.length,
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
    ...(traffic ? { traffic: traffic.source } : {}),
    ...(feasibility ? { feasibility } : {}),
    ...(squareRootAllocation ? { squareRootAllocation } : {}),
    notes,
  });
}

/**
 * Whole groups in each arm. Each arm's units become ceil(units / mean size) groups, and the
 * normal critical values behind those units are replaced by t quantiles with G - 2 degrees of
 * freedom (G groups in all), iterated until the counts settle: with few groups the normal
 * reference overstates power (Donner & Klar, "Design and Analysis of Cluster Randomization
 * Trials", 2000, ch. 5, from memory). With many groups the t and normal answers agree.
 */
export function wholeGroupsPerArm(perArm: readonly { arm: string; units: number }[], meanSize: number, alpha: number, sides: 1 | 2, power: number): { arm: string; groups: number }[] {
  const zSum = normalUpperQuantile(alpha / sides) + normalQuantile(power);
  let groups = perArm.map((a) => ({ arm: a.arm, groups: Math.max(2, Math.ceil(a.units / meanSize - 1e-9)) }));
  for (let round = 0; round < 50; round++) {
    const df = groups.reduce((s, g) => s + g.groups, 0) - 2;
    const tSum = studentQuantile(1 - alpha / sides, df) + studentQuantile(power, df);
    const factor = (tSum / zSum) ** 2;
    const next = perArm.map((a) => ({ arm: a.arm, groups: Math.max(2, Math.ceil((a.units * factor) / meanSize - 1e-9)) }));
    if (next.every((g, i) => g.groups === groups[i]!.groups)) return next;
    groups = next;
  }
  return groups;
}
