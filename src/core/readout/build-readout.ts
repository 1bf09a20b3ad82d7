import type { Direction, Metric, Plan } from '../plan/schema.js';
import { normalCdf, normalUpper } from '../stats/distributions.js';
import { benjaminiHochberg } from '../stats/multiple-testing.js';
import { SRM_ALARM_P, sampleRatioMismatch } from '../stats/srm.js';
import type { ArmTotalsFile, MetricTotals, TotalsGroup } from '../totals/schema.js';
import { addTotals } from './combine.js';
import { compareArms, type Comparison } from './compare.js';
import { cupedAdjustment, estimateArm, type CupedAdjustment } from './estimate.js';
import type { RuleSource } from './launch-note.js';
import { readoutTiming, type Timing } from './timing.js';
import { countOf } from '../report/numbers.js';

/**
 * A test read out against its plan: the sample ratio first, then every metric as registered, the
 * primary outcome classified mechanically, guardrails as non-inferiority, secondaries and segments
 * as exploratory (Benjamini–Hochberg), and the timing. Pure: totals and plan in, a value out.
 */

export type PrimaryClass = 'win' | 'loss' | 'flat' | 'inconclusive';
export type GuardrailClass = 'breach' | 'harm-ruled-out' | 'harm-not-ruled-out';
export type Verdict = PrimaryClass | 'guardrail-breach' | 'not-read';
export type MetricRole = 'primary' | 'guardrail' | 'secondary' | 'segment';

export interface ArmRead {
  /** The treatment arm compared with the control. */
  arm: string;
  ok: boolean;
  /** Why no figures could be computed, when ok is false. */
  reason?: string;
  comparison?: Comparison;
  /** Bonferroni across arms (primary, guardrails) or Benjamini–Hochberg (secondaries, segments). */
  adjustedP?: number;
  /** Primary: the class the registered rule gives; guardrail: the non-inferiority class. */
  primaryClass?: PrimaryClass;
  guardrailClass?: GuardrailClass;
  /** Guardrails: the harm (movement against the desired direction) and its one-sided upper bound. */
  harm?: { estimate: number; upperBound: number };
  /** Secondaries and segments: the adjusted p-value is at or below α (a lead to confirm, never a result). */
  exploratorySignal?: boolean;
}

export interface MetricRead {
  metric: string;
  kind: Metric['kind'];
  role: MetricRole;
  segment?: string;
  direction: Direction;
  /** Absolute thresholds in the metric's units, resolved against the control's value. */
  minDetectableEffect?: number;
  tolerance?: number;
  cuped?: { theta: number; varianceReduction: number };
  arms: ArmRead[];
}

export type FindingSeverity = 'block' | 'warn' | 'note';
export interface ReadoutFinding {
  severity: FindingSeverity;
  code: string;
  message: string;
}

export interface SrmRead {
  threshold: number;
  arms: { arm: string; weight: number; units: number; expected: number }[];
  statistic: number;
  degreesOfFreedom: number;
  pValue: number;
  mismatch: boolean;
  /** Days whose split alone raises the alarm. */
  days: { date: string; units: number[]; pValue: number }[];
  daysChecked: number;
}

export interface Readout {
  planId: string;
  title: string;
  planCommit: string;
  dataThrough: string;
  control: string;
  treatments: string[];
  alpha: number;
  sides: 1 | 2;
  /** α per comparison after Bonferroni across the treatment arms. */
  alphaPerComparison: number;
  srm?: SrmRead;
  timing: Timing;
  primary: MetricRead;
  guardrails: MetricRead[];
  secondary: MetricRead[];
  segments: MetricRead[];
  verdict: Verdict;
  /** Arms the verdict names (the winners of a win; the arms in breach of a breach). */
  verdictArms: string[];
  /** The decision the plan registered for this verdict, quoted as written. */
  decision?: { rule: 'win' | 'loss' | 'flat' | 'guardrail-breach'; text: string };
  findings: ReadoutFinding[];
  /** Which plan's rule was applied: the one at the totals' plan-commit, an amended one, or today's (set by withLaunchRule). */
  rule?: RuleSource;
}

/** Significance level of the test that week 1 differs from the later weeks (common practice, no source). */
export const NOVELTY_P = 0.01;
/**
 * Units seen in two or more arms are left out of the totals; above this share of the units exposed the
 * readout blocks: dropping them is no longer a small loss but a sign that assignment is not sticky,
 * and the arms left may no longer be comparable (common practice, no source).
 */
export const SEVERAL_ARMS_BLOCK_SHARE = 0.01;
/** Below this power a significant estimate is likely inflated (common practice, no source). */
export const LOW_POWER = 0.5;

interface Context {
  plan: Plan;
  totals: ArmTotalsFile;
  control: string;
  treatments: string[];
  alphaPerComparison: number;
  cupedRegistered: boolean;
  boundaryZ?: number;
}

function resolveThreshold(effect: { relative?: number; absolute?: number } | undefined, controlValue: number | undefined): number | undefined {
  if (!effect) return undefined;
  if (effect.absolute !== undefined) return effect.absolute;
  if (effect.relative !== undefined && controlValue !== undefined && controlValue !== 0) return effect.relative * Math.abs(controlValue);
  return undefined;
}

/** The totals of one metric in every arm of a group (overall, a segment). */
function metricTotalsOf(groups: Record<string, TotalsGroup | undefined>, metric: string): Record<string, MetricTotals | undefined> {
  return Object.fromEntries(Object.entries(groups).map(([arm, g]) => [arm, g?.metrics[metric]]));
}

function readMetric(
  ctx: Context,
  metric: Metric,
  role: MetricRole,
  byArm: Record<string, MetricTotals | undefined>,
  settings: { alpha: number; sides: 1 | 2; direction: Direction; boundaryZ?: number; useCuped: boolean },
  segment?: string,
): MetricRead | undefined {
  const controlTotals = byArm[ctx.control];
  if (!controlTotals) return undefined;
  let cuped: CupedAdjustment | undefined;
  if (settings.useCuped && controlTotals.kind !== 'ratio') {
    const all = [ctx.control, ...ctx.treatments].map((a) => byArm[a]);
    if (all.every((t): t is Exclude<MetricTotals, { kind: 'ratio' }> => t !== undefined && t.kind !== 'ratio')) cuped = cupedAdjustment(all);
  }
  const controlEstimate = estimateArm(controlTotals, cuped);
  const controlValue = controlEstimate.ok ? controlEstimate.estimate.value : undefined;
  const arms: ArmRead[] = ctx.treatments.flatMap((arm): ArmRead[] => {
    const totals = byArm[arm];
    if (!totals) return role === 'segment' ? [] : [{ arm, ok: false, reason: `no totals for arm "${arm}"` }];
    const treatment = estimateArm(totals, cuped);
    if (!controlEstimate.ok) return [{ arm, ok: false, reason: `control: ${controlEstimate.reason}` }];
    if (!treatment.ok) return [{ arm, ok: false, reason: treatment.reason }];
    const compared = compareArms(controlEstimate.estimate, treatment.estimate, {
      alpha: settings.alpha,
      sides: settings.sides,
      direction: settings.direction,
      ...(settings.boundaryZ !== undefined ? { boundaryZ: settings.boundaryZ } : {}),
    });
    return [compared.ok ? { arm, ok: true, comparison: compared.comparison } : { arm, ok: false, reason: compared.reason }];
  });
  if (arms.length === 0) return undefined;
  return {
    metric: metric.name,
    kind: metric.kind,
    role,
    ...(segment !== undefined ? { segment } : {}),
    direction: metric.direction,
    ...(cuped ? { cuped: { theta: cuped.theta, varianceReduction: cuped.varianceReduction } } : {}),
    arms,
  };
}

function good(direction: Direction): 1 | -1 {
  return direction === 'increase' ? 1 : -1;
}

function classifyPrimary(read: MetricRead, mde: number | undefined, early: boolean): void {
  const s = good(read.direction);
  for (const arm of read.arms) {
    const c = arm.comparison;
    if (!c) continue;
    const lowGood = s === 1 ? c.interval.low : -c.interval.high;
    const highGood = s === 1 ? c.interval.high : -c.interval.low;
    if (lowGood > 0) arm.primaryClass = 'win';
    else if (highGood < 0) arm.primaryClass = 'loss';
    // Flat needs the planned sample: an early interval that excludes the effect has not been designed for.
    else if (!early && mde !== undefined && c.interval.low > -mde && c.interval.high < mde) arm.primaryClass = 'flat';
    else arm.primaryClass = 'inconclusive';
  }
}

function classifyGuardrail(read: MetricRead, tolerance: number | undefined): void {
  // The comparison was made one-sided towards harm, so its interval's ends are the one-sided bounds.
  const harmSign = -good(read.direction);
  for (const arm of read.arms) {
    const c = arm.comparison;
    if (!c) continue;
    const estimate = harmSign * c.difference;
    const lower = harmSign === 1 ? c.interval.low : -c.interval.high;
    const upper = harmSign === 1 ? c.interval.high : -c.interval.low;
    arm.harm = { estimate, upperBound: upper };
    arm.guardrailClass = lower > 0 ? 'breach' : tolerance !== undefined && upper < tolerance ? 'harm-ruled-out' : 'harm-not-ruled-out';
  }
}

function bonferroni(read: MetricRead, k: number): void {
  for (const arm of read.arms) if (arm.comparison) arm.adjustedP = Math.min(1, arm.comparison.pValue * k);
}

function checkSampleRatio(ctx: Context): SrmRead | undefined {
  const arms = [ctx.control, ...ctx.treatments];
  const weights = arms.map((a) => ctx.plan.design.arms.find((p) => p.name === a)!.weight);
  const units = arms.map((a) => ctx.totals.arms[a]?.units ?? 0);
  const overall = sampleRatioMismatch(units, weights, SRM_ALARM_P);
  if (!overall.ok) return undefined;
  const dates = [...new Set(arms.flatMap((a) => (ctx.totals.arms[a]?.days ?? []).map((d) => d.date)))].sort();
  const days: SrmRead['days'] = [];
  let daysChecked = 0;
  for (const date of dates) {
    const counts = arms.map((a) => ctx.totals.arms[a]?.days.find((d) => d.date === date)?.units);
    if (counts.some((c) => c === undefined)) continue;
    const check = sampleRatioMismatch(counts as number[], weights, SRM_ALARM_P);
    if (!check.ok) continue;
    daysChecked++;
    if (check.value.mismatch) days.push({ date, units: counts as number[], pValue: check.value.pValue });
  }
  return {
    threshold: SRM_ALARM_P,
    arms: arms.map((arm, i) => ({ arm, weight: weights[i]!, units: units[i]!, expected: overall.value.expected[i]! })),
    statistic: overall.value.statistic,
    degreesOfFreedom: overall.value.degreesOfFreedom,
    pValue: overall.value.pValue,
    mismatch: overall.value.mismatch,
    days,
    daysChecked,
  };
}

/** Week 1 against the later weeks pooled: a first-week effect far from the rest is a novelty (or learning) effect. */
function noveltyCheck(ctx: Context, metric: Metric): ReadoutFinding[] {
  const findings: ReadoutFinding[] = [];
  const weeksOf = (arm: string) => [...(ctx.totals.arms[arm]?.weeks ?? [])].sort((a, b) => a.starting.localeCompare(b.starting));
  const control = weeksOf(ctx.control);
  if (control.length < 2) return findings;
  for (const arm of ctx.treatments) {
    const treatment = weeksOf(arm);
    const split = (weeks: typeof control) => {
      const first = weeks[0]?.metrics[metric.name];
      const later = addTotals(weeks.slice(1).map((w) => w.metrics[metric.name]).filter((m): m is MetricTotals => m !== undefined));
      return first && later ? { first, later } : undefined;
    };
    const c = split(control);
    const t = split(treatment);
    if (!c || !t || treatment[0]?.starting !== control[0]?.starting) continue;
    const effect = (a: MetricTotals, b: MetricTotals) => {
      const ea = estimateArm(a);
      const eb = estimateArm(b);
      if (!ea.ok || !eb.ok) return undefined;
      return { value: eb.estimate.value - ea.estimate.value, variance: ea.estimate.variance + eb.estimate.variance };
    };
    const first = effect(c.first, t.first);
    const later = effect(c.later, t.later);
    if (!first || !later) continue;
    const se = Math.sqrt(first.variance + later.variance);
    if (!(se > 0)) continue;
    const p = 2 * normalUpper(Math.abs(first.value - later.value) / se);
    if (p < NOVELTY_P) {
      findings.push({
        severity: 'note',
        code: 'readout/novelty',
        message: `${arm}: the first week's effect on ${metric.name} (${signed(first.value)}) differs from the later weeks' (${signed(later.value)}), p = ${formatP(p)}: a novelty or learning effect; the later weeks say more about the lasting effect.`,
      });
    }
  }
  return findings;
}

function signed(x: number): string {
  const text = Number(x.toPrecision(3)).toString();
  return x > 0 ? `+${text}` : text;
}

function formatP(p: number): string {
  return p < 0.001 ? p.toExponential(1) : p.toFixed(3);
}

export function buildReadout(plan: Plan, totals: ArmTotalsFile): Readout {
  const control = plan.design.control;
  const treatments = plan.design.arms.map((a) => a.name).filter((a) => a !== control);
  const k = Math.max(1, treatments.length);
  const alphaPerComparison = plan.design.alpha / k;
  const unitsSeen = Object.values(totals.arms).reduce((s, a) => s + a.units, 0);
  const timing = readoutTiming(plan, totals.dataThrough, unitsSeen, alphaPerComparison);
  const cupedRegistered = plan.design.prePeriodCorrelation > 0;
  const ctx: Context = {
    plan,
    totals,
    control,
    treatments,
    alphaPerComparison,
    cupedRegistered,
    ...(timing.boundary ? { boundaryZ: timing.boundary.z } : {}),
  };
  const findings: ReadoutFinding[] = [];
  const overall: Record<string, TotalsGroup | undefined> = Object.fromEntries([control, ...treatments].map((a) => [a, totals.arms[a]]));

  const srm = checkSampleRatio(ctx);
  if (srm?.mismatch) {
    findings.push({
      severity: 'block',
      code: 'readout/sample-ratio-mismatch',
      message: `Sample ratio mismatch: the units per arm do not fit the planned weights (p = ${formatP(srm.pValue)} < ${srm.threshold}). Nothing here is a result: find why assignment or logging lost units, fix it, and read again.`,
    });
  }
  findings.push(...excludedUnitsFindings(totals, unitsSeen));
  if (srm && srm.days.length) {
    findings.push({
      severity: 'warn',
      code: 'readout/sample-ratio-mismatch-day',
      message: `The split alone raises the alarm on ${srm.days.length} of ${srm.daysChecked} days (${srm.days.map((d) => d.date).join(', ')}): check what changed in assignment or logging on those days.`,
    });
  }
  if (timing.readEarly && !timing.boundary) {
    findings.push({
      severity: 'block',
      code: 'readout/read-early',
      message: `Read early: the data runs through ${totals.dataThrough}, before the planned end (${timing.plannedEnd}), and the plan registered no interim looks. Looking before the end and stopping on a good day inflates false wins; wait for the planned end.`,
    });
  }

  // Primary.
  const primaryMetric = plan.metrics.primary;
  const primaryRead: MetricRead = readMetric(ctx, primaryMetric, 'primary', metricTotalsOf(overall, primaryMetric.name), {
    alpha: alphaPerComparison,
    sides: plan.design.sides,
    direction: primaryMetric.direction,
    ...(ctx.boundaryZ !== undefined ? { boundaryZ: ctx.boundaryZ } : {}),
    useCuped: cupedRegistered,
  }) ?? { metric: primaryMetric.name, kind: primaryMetric.kind, role: 'primary' as const, direction: primaryMetric.direction, arms: treatments.map((arm): ArmRead => ({ arm, ok: false, reason: 'no totals for the control arm' })) };
  const controlPrimary = primaryRead.arms.find((a) => a.comparison)?.comparison?.control.value;
  const mde = resolveThreshold(plan.design.minDetectableEffect, controlPrimary);
  if (mde !== undefined) primaryRead.minDetectableEffect = mde;
  bonferroni(primaryRead, k);
  classifyPrimary(primaryRead, mde, timing.readEarly);
  if (timing.boundary) {
    const crossed = primaryRead.arms.some((a) => a.primaryClass === 'win' || a.primaryClass === 'loss');
    findings.push({
      severity: 'note',
      code: 'readout/interim-look',
      message: `Interim analysis at ${formatShare(timing.informationFraction)} of the planned information (look ${timing.boundary.look} of ${timing.boundary.looks}): the ${plan.design.interimBoundary} boundary is |z| ≥ ${timing.boundary.z.toFixed(3)} (nominal p ${formatP(timing.boundary.nominalP)}); ${crossed ? 'crossed, so the test may stop here' : 'not crossed: keep the test running to the next look or the planned end'}.`,
    });
  }
  for (const arm of primaryRead.arms) {
    if (!arm.ok) findings.push({ severity: 'block', code: 'readout/primary-not-computed', message: `${primaryMetric.name}, ${arm.arm}: ${arm.reason}` });
  }
  if (mde === undefined) {
    findings.push({ severity: 'note', code: 'readout/no-minimum-effect', message: 'The plan registers no minimum detectable effect, so no result can be called flat; a non-significant result is inconclusive.' });
  }
  if (cupedRegistered) {
    if (!primaryRead.cuped) {
      findings.push({ severity: 'warn', code: 'readout/cuped-missing', message: `The plan was sized with variance reduction (pre-period correlation ${plan.design.prePeriodCorrelation}), but the totals give no usable pre-period sums for ${primaryMetric.name}: the interval is wider than planned.` });
    }
  } else if (Object.values(totals.arms).some((a) => Object.values(a.metrics).some((m) => m.kind !== 'ratio' && m.pre))) {
    findings.push({ severity: 'note', code: 'readout/cuped-not-registered', message: 'The totals carry pre-period sums, but the plan did not register variance reduction (design.pre-period-correlation), so they are not used: a method chosen after the data is in is not the registered test.' });
  }

  // Guardrails: one-sided towards harm at α split across arms.
  const guardrails: MetricRead[] = [];
  for (const metric of plan.metrics.guardrails) {
    const harm: Direction = metric.direction === 'increase' ? 'decrease' : 'increase';
    const read = readMetric(ctx, metric, 'guardrail', metricTotalsOf(overall, metric.name), { alpha: alphaPerComparison, sides: 1, direction: harm, useCuped: cupedRegistered });
    if (!read) {
      findings.push({ severity: 'block', code: 'readout/guardrail-missing', message: `No totals for the guardrail ${metric.name}: a launch cannot show it did no harm.` });
      continue;
    }
    const controlValue = read.arms.find((a) => a.comparison)?.comparison?.control.value;
    const tolerance = resolveThreshold(metric.tolerance, controlValue);
    if (tolerance !== undefined) read.tolerance = tolerance;
    else findings.push({ severity: 'warn', code: 'readout/no-tolerance', message: `The guardrail ${metric.name} has no tolerance, so harm can never be ruled out; only a breach can be seen.` });
    bonferroni(read, k);
    classifyGuardrail(read, tolerance);
    guardrails.push(read);
  }

  // Secondaries and segments: exploratory, Benjamini–Hochberg across all of them together.
  const secondary: MetricRead[] = [];
  for (const metric of plan.metrics.secondary) {
    const read = readMetric(ctx, metric, 'secondary', metricTotalsOf(overall, metric.name), { alpha: plan.design.alpha, sides: plan.design.sides, direction: metric.direction, useCuped: cupedRegistered });
    if (read) secondary.push(read);
    else findings.push({ severity: 'note', code: 'readout/secondary-missing', message: `No totals for the secondary metric ${metric.name}.` });
  }
  const segments: MetricRead[] = [];
  const allMetrics = [primaryMetric, ...plan.metrics.guardrails, ...plan.metrics.secondary];
  const segmentNames = [...new Set((totals.arms[control]?.segments ?? []).map((s) => s.segment))];
  for (const name of segmentNames) {
    const groups = Object.fromEntries([control, ...treatments].map((a) => [a, totals.arms[a]?.segments.find((s) => s.segment === name)]));
    for (const metric of allMetrics) {
      const read = readMetric(ctx, metric, 'segment', metricTotalsOf(groups, metric.name), { alpha: plan.design.alpha, sides: plan.design.sides, direction: metric.direction, useCuped: false }, name);
      if (read) segments.push(read);
    }
  }
  const exploratory = [...secondary, ...segments].flatMap((m) => m.arms.filter((a) => a.comparison));
  const adjusted = benjaminiHochberg(exploratory.map((a) => a.comparison!.pValue));
  if (adjusted.ok) {
    exploratory.forEach((arm, i) => {
      arm.adjustedP = adjusted.value[i]!;
      arm.exploratorySignal = adjusted.value[i]! <= plan.design.alpha;
    });
  }

  // The verdict: per arm, a breach overrides the primary's class.
  const perArm = treatments.map((arm) => {
    const breached = guardrails.some((g) => g.arms.some((a) => a.arm === arm && a.guardrailClass === 'breach'));
    const primaryClass = primaryRead.arms.find((a) => a.arm === arm)?.primaryClass ?? 'inconclusive';
    return { arm, verdict: (breached ? 'guardrail-breach' : primaryClass) as Verdict };
  });
  let verdict: Verdict;
  const armsWith = (v: Verdict) => perArm.filter((a) => a.verdict === v).map((a) => a.arm);
  if (srm?.mismatch) verdict = 'not-read';
  else if (armsWith('win').length) verdict = 'win';
  else if (armsWith('guardrail-breach').length) verdict = 'guardrail-breach';
  else if (armsWith('loss').length) verdict = 'loss';
  else if (perArm.length && perArm.every((a) => a.verdict === 'flat')) verdict = 'flat';
  else verdict = 'inconclusive';
  const verdictArms = verdict === 'not-read' ? [] : armsWith(verdict);

  for (const g of guardrails) {
    for (const a of g.arms) {
      if (a.guardrailClass === 'breach') findings.push({ severity: 'block', code: 'readout/guardrail-breach', message: `${a.arm} harms the guardrail ${g.metric} significantly${armsWith('guardrail-breach').includes(a.arm) && primaryRead.arms.find((p) => p.arm === a.arm)?.primaryClass === 'win' ? ', which overrides its win on the primary metric' : ''}.` });
    }
  }
  const primaryFlatOverall = verdict === 'flat' || verdict === 'inconclusive';
  if (primaryFlatOverall) {
    for (const s of segments) {
      if (s.metric !== primaryMetric.name) continue;
      for (const a of s.arms) {
        const c = a.comparison;
        if (a.exploratorySignal && c && good(s.direction) * c.difference > 0) {
          findings.push({
            severity: 'note',
            code: 'readout/segment-pattern',
            message: `Flat overall, but ${a.arm} wins in the segment "${s.segment}" (Benjamini–Hochberg adjusted p = ${formatP(a.adjustedP!)}): a pattern to confirm with a new test on that segment, not a result.`,
          });
        }
      }
    }
  }
  findings.push(...noveltyCheck(ctx, primaryMetric));
  if (verdict === 'win' || verdict === 'loss') {
    for (const arm of primaryRead.arms) {
      const c = arm.comparison;
      if (!c || (arm.primaryClass !== 'win' && arm.primaryClass !== 'loss')) continue;
      const effect = mde ?? Math.abs(c.difference);
      const power = normalCdf(effect / c.standardError - c.critical);
      if (power < LOW_POWER) {
        findings.push({
          severity: 'note',
          code: 'readout/winners-curse',
          message: `${arm.arm}: this readout had ${formatShare(power)} power at ${mde !== undefined ? 'the minimum detectable effect' : 'the observed effect'}; a significant estimate from an underpowered test usually overstates the true effect (the winner's curse). Expect a smaller effect after launch.`,
        });
      }
    }
  }
  if (plan.sensitive.length && (verdict === 'win' || verdict === 'loss')) {
    findings.push({
      severity: 'note',
      code: 'readout/sensitive',
      message: `This test touches ${plan.sensitive.map((s) => s.area).join(', ')}: before acting on the result, take it to ${plan.sensitive.map((s) => s.review ?? `the ${s.area} review`).join(', ')}; local law and licensed practice come before this rule.`,
    });
  }

  const rule = verdict === 'win' ? 'win' : verdict === 'loss' ? 'loss' : verdict === 'guardrail-breach' ? 'guardrail-breach' : verdict === 'not-read' ? undefined : 'flat';
  const text = rule === 'win' ? plan.decisions.win : rule === 'loss' ? plan.decisions.loss : rule === 'guardrail-breach' ? plan.decisions.guardrailBreach : rule === 'flat' ? plan.decisions.flat : undefined;

  return {
    planId: plan.id,
    title: plan.title,
    planCommit: totals.planCommit,
    dataThrough: totals.dataThrough,
    control,
    treatments,
    alpha: plan.design.alpha,
    sides: plan.design.sides,
    alphaPerComparison,
    ...(srm ? { srm } : {}),
    timing,
    primary: primaryRead,
    guardrails,
    secondary,
    segments,
    verdict,
    verdictArms,
    ...(rule && text ? { decision: { rule, text } } : {}),
    findings,
  };
}

/** What the totals left out: units in several arms (randomization broken for them) and arms the plan does not have. */
function excludedUnitsFindings(totals: ArmTotalsFile, unitsKept: number): ReadoutFinding[] {
  const findings: ReadoutFinding[] = [];
  const several = totals.excluded?.severalArms ?? 0;
  if (several > 0) {
    const share = several / (several + unitsKept);
    const block = share > SEVERAL_ARMS_BLOCK_SHARE;
    findings.push({
      severity: block ? 'block' : 'warn',
      code: 'readout/units-in-several-arms',
      message: `${countOf(several, 'unit')} (${formatShare(share)} of those exposed) ${several === 1 ? 'was' : 'were'} seen in more than one arm and are left out of every total: assignment was not sticky for them, which breaks randomization${
        block ? `. Above ${formatShare(SEVERAL_ARMS_BLOCK_SHARE)} the arms left may not be comparable: find why units switch arms (ids reused across devices, a flag re-evaluated with other attributes, a changed split), fix it, and read again.` : '; a small share costs little, but find out why.'
      }`,
    });
  }
  const unknown = totals.excluded?.unknownArm ?? 0;
  if (unknown > 0) {
    findings.push({
      severity: 'warn',
      code: 'readout/unknown-arm',
      message: `${countOf(unknown, 'unit')} ${unknown === 1 ? 'has' : 'have'} exposures under an arm name the plan does not have; those exposures are left out. Check the flag's variations against the plan's arms.`,
    });
  }
  return findings;
}

function formatShare(x: number | undefined): string {
  if (x === undefined || !Number.isFinite(x)) return 'an unknown share';
  return `${(x * 100).toFixed(x < 0.1 ? 1 : 0)}%`;
}

/** The arms a readout's class says to ship: a win ships its winners; every other class keeps the control (nothing, unread). */
export function armsToShip(read: Pick<Readout, 'verdict' | 'verdictArms' | 'control'>): string[] {
  if (read.verdict === 'not-read') return [];
  return read.verdict === 'win' ? read.verdictArms : [read.control];
}
