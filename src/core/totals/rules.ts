import { closestName } from '../source/closest-name.js';
import type { FieldPath } from '../source/yaml-source.js';
import type { Rule, RuleContext } from '../source/rule-context.js';
import type { Metric, Plan } from '../plan/schema.js';
import type { ArmTotalsFile, MetricTotals, PrePeriodTotals, TotalsGroup } from './schema.js';

/**
 * Rules over an arm-totals file. Sums that no data could produce (Σy² below (Σy)²/n, more units
 * with an event than units) are errors on their own; the plan adds the rest: the arms and metrics
 * it registered, the kind of each metric, and the window the data must fall in.
 */
export interface TotalsRuleInput {
  totals: ArmTotalsFile;
  plan?: Plan;
}

/** Rounding in a warehouse's floating-point sums is tiny relative to the sums themselves. */
const RELATIVE_SLACK = 1e-9;

/** Every group (arm, day, week, segment) with its written path. */
function* groups(totals: ArmTotalsFile): Generator<{ arm: string; path: FieldPath; group: TotalsGroup }> {
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    yield { arm, path: ['arms', arm], group: totalsOfArm };
    for (const [i, day] of totalsOfArm.days.entries()) yield { arm, path: ['arms', arm, 'days', i], group: day };
    for (const [i, week] of totalsOfArm.weeks.entries()) yield { arm, path: ['arms', arm, 'weeks', i], group: week };
    for (const [i, segment] of totalsOfArm.segments.entries()) yield { arm, path: ['arms', arm, 'segments', i], group: segment };
  }
}

/** Σ(y − ȳ)² from n, Σy, Σy²: negative beyond rounding means no real data has these sums. */
function centredSquares(n: number, sum: number, sumSquares: number): { value: number; slack: number } {
  return { value: sumSquares - (n > 0 ? (sum * sum) / n : 0), slack: RELATIVE_SLACK * Math.max(sumSquares, 1) };
}

function checkSquares(ctx: RuleContext<TotalsRuleInput>, path: FieldPath, n: number, sum: number, sumSquares: number, what: string): boolean {
  const { value, slack } = centredSquares(n, sum, sumSquares);
  if (value >= -slack) return true;
  ctx.report({
    severity: 'error',
    code: 'totals/impossible-sums',
    path,
    message: `the sum of squares of ${what} is below (Σy)²/n${Number.isFinite((sum * sum) / n) ? ` = ${Number(((sum * sum) / n).toPrecision(8))}` : ' (too large to write)'}, which no data can give`,
    expected: 'a sum of squares of at least (sum)² / n; check that it sums squares of per-unit values, not squares of the sum',
    showFound: true,
  });
  return false;
}

function checkProducts(ctx: RuleContext<TotalsRuleInput>, path: FieldPath, n: number, a: { sum: number; sumSquares: number }, b: { sum: number; sumSquares: number }, sumProducts: number) {
  if (n < 2) return;
  const saa = Math.max(0, a.sumSquares - (a.sum * a.sum) / n);
  const sbb = Math.max(0, b.sumSquares - (b.sum * b.sum) / n);
  const sab = sumProducts - (a.sum * b.sum) / n;
  const bound = Math.sqrt(saa * sbb);
  if (Math.abs(sab) <= bound + RELATIVE_SLACK * Math.max(Math.abs(sumProducts), bound, 1)) return;
  ctx.report({
    severity: 'error',
    code: 'totals/impossible-sums',
    path,
    message: 'the sum of products implies a correlation outside -1 to 1, which no data can give',
    expected: 'Σxy − ΣxΣy/n no larger in size than √((Σx² − (Σx)²/n)(Σy² − (Σy)²/n))',
    showFound: true,
  });
}

function checkPre(ctx: RuleContext<TotalsRuleInput>, path: FieldPath, metric: { n: number; sum: number; sumSquares: number }, pre: PrePeriodTotals) {
  if (!checkSquares(ctx, [...path, 'pre-period', 'sum-of-squares'], metric.n, pre.sum, pre.sumSquares, 'the pre-period value')) return;
  checkProducts(ctx, [...path, 'pre-period', 'sum-of-products'], metric.n, metric, pre, pre.sumProducts);
}

function checkMetric(ctx: RuleContext<TotalsRuleInput>, path: FieldPath, units: number, metric: MetricTotals) {
  if (metric.n > units) {
    ctx.report({
      severity: 'error',
      code: 'totals/more-than-units',
      path: [...path, 'n'],
      message: `n is ${metric.n}, more than the ${units} units exposed`,
      expected: `at most ${units} (the units exposed)`,
    });
  }
  if (metric.kind === 'proportion') {
    if (metric.sum > metric.n) {
      ctx.report({
        severity: 'error',
        code: 'totals/more-than-units',
        path: [...path, 'units-with-event'],
        message: `${metric.sum} units with the event out of ${metric.n}`,
        expected: `at most ${metric.n} (each unit counts once however many events it has)`,
        showFound: false,
      });
    } else if (metric.pre) checkPre(ctx, path, metric, metric.pre);
    return;
  }
  if (metric.kind === 'mean') {
    if (checkSquares(ctx, [...path, 'sum-of-squares'], metric.n, metric.sum, metric.sumSquares, 'the metric value') && metric.pre) checkPre(ctx, path, metric, metric.pre);
    return;
  }
  const numeratorOk = checkSquares(ctx, [...path, 'numerator', 'sum-of-squares'], metric.n, metric.numerator.sum, metric.numerator.sumSquares, 'the numerator');
  const denominatorOk = checkSquares(ctx, [...path, 'denominator', 'sum-of-squares'], metric.n, metric.denominator.sum, metric.denominator.sumSquares, 'the denominator');
  if (numeratorOk && denominatorOk) checkProducts(ctx, [...path, 'sum-of-products'], metric.n, metric.numerator, metric.denominator, metric.sumProducts);
}

const possibleSums: Rule<TotalsRuleInput> = (ctx) => {
  for (const { path, group } of groups(ctx.value.totals)) {
    for (const [name, metric] of Object.entries(group.metrics)) checkMetric(ctx, [...path, 'metrics', name], group.units, metric);
  }
};

const atLeastTwoArms: Rule<TotalsRuleInput> = (ctx) => {
  if (Object.keys(ctx.value.totals.arms).length < 2) {
    ctx.report({ severity: 'error', code: 'totals/arm-count', path: ['arms'], message: 'a readout compares arms; fewer than two are given', expected: 'the totals of every arm of the plan' });
  }
};

const datesInOrder: Rule<TotalsRuleInput> = (ctx) => {
  const { totals } = ctx.value;
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    const seen = new Set<string>();
    totalsOfArm.days.forEach((day, i) => {
      const path = ['arms', arm, 'days', i, 'date'];
      if (day.date > totals.dataThrough) {
        ctx.report({ severity: 'error', code: 'totals/date-after-data', path, message: `${day.date} is after data-through (${totals.dataThrough})`, expected: `a day on or before ${totals.dataThrough}` });
      }
      if (seen.has(day.date)) ctx.report({ severity: 'error', code: 'totals/duplicate-date', path, message: `${day.date} is listed twice`, expected: 'each day once' });
      seen.add(day.date);
    });
    totalsOfArm.weeks.forEach((week, i) => {
      if (week.starting > totals.dataThrough) {
        ctx.report({ severity: 'error', code: 'totals/date-after-data', path: ['arms', arm, 'weeks', i, 'starting'], message: `${week.starting} is after data-through (${totals.dataThrough})`, expected: `a week starting on or before ${totals.dataThrough}` });
      }
    });
  }
};

/** Days list the units first exposed each day, so they add up to the arm's units; a gap means a lost or doubled day. */
const daysAddUp: Rule<TotalsRuleInput> = (ctx) => {
  for (const [arm, totalsOfArm] of Object.entries(ctx.value.totals.arms)) {
    if (!totalsOfArm.days.length) continue;
    const sum = totalsOfArm.days.reduce((s, d) => s + d.units, 0);
    if (sum === totalsOfArm.units) continue;
    ctx.report({
      severity: sum > totalsOfArm.units ? 'error' : 'warning',
      code: 'totals/days-sum',
      path: ['arms', arm, 'days'],
      atKey: true,
      message: `the days add up to ${sum} units, the arm to ${totalsOfArm.units}${sum > totalsOfArm.units ? ': a unit is counted on more than one day' : ': some days are missing'}`,
      expected: 'the units first exposed on each day, adding up to the arm’s units',
    });
  }
};

/** The rules that need no plan. */
export const TOTALS_RULES: readonly Rule<TotalsRuleInput>[] = [atLeastTwoArms, possibleSums, datesInOrder, daysAddUp];

function planMetrics(plan: Plan): Metric[] {
  return [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary];
}

const samePlan: Rule<TotalsRuleInput> = (ctx) => {
  const { totals, plan } = ctx.value;
  if (plan && totals.planId !== plan.id) {
    ctx.report({ severity: 'error', code: 'totals/other-plan', path: ['plan'], message: `these totals are for plan "${totals.planId}", not "${plan.id}"`, expected: `plan: ${plan.id}` });
  }
};

const armsOfThePlan: Rule<TotalsRuleInput> = (ctx) => {
  const { totals, plan } = ctx.value;
  if (!plan) return;
  const planned = plan.design.arms.map((a) => a.name);
  for (const arm of Object.keys(totals.arms)) {
    if (planned.includes(arm)) continue;
    const suggestion = closestName(arm, planned);
    ctx.report({
      severity: 'error',
      code: 'totals/unknown-arm',
      path: ['arms', arm],
      atKey: true,
      message: `arm "${arm}" is not in the plan${suggestion ? `; did you mean "${suggestion}"?` : ''}`,
      expected: `one of the plan's arms: ${planned.join(', ')}`,
    });
  }
  const missing = planned.filter((a) => !(a in totals.arms));
  if (missing.length) {
    ctx.report({ severity: 'error', code: 'totals/missing-arm', path: ['arms'], message: `no totals for ${missing.map((a) => `"${a}"`).join(', ')}`, expected: `totals for every arm of the plan: ${planned.join(', ')}` });
  }
};

const metricsOfThePlan: Rule<TotalsRuleInput> = (ctx) => {
  const { totals, plan } = ctx.value;
  if (!plan) return;
  const known = new Map(planMetrics(plan).map((m) => [m.name, m]));
  for (const { path, group } of groups(totals)) {
    for (const [name, metric] of Object.entries(group.metrics)) {
      const registered = known.get(name);
      if (!registered) {
        const suggestion = closestName(name, [...known.keys()]);
        ctx.report({
          severity: 'error',
          code: 'totals/unknown-metric',
          path: [...path, 'metrics', name],
          atKey: true,
          message: `metric "${name}" is not in the plan${suggestion ? `; did you mean "${suggestion}"?` : ''}: a metric chosen after the data is in is not a pre-registered result`,
          expected: `one of the plan's metrics: ${[...known.keys()].join(', ')}`,
        });
      } else if (registered.kind !== metric.kind) {
        ctx.report({
          severity: 'error',
          code: 'totals/metric-kind',
          path: [...path, 'metrics', name],
          message: `the plan registers "${name}" as a ${registered.kind} metric, but these are ${metric.kind} totals`,
          expected: registered.kind === 'proportion' ? '{ units-with-event }' : registered.kind === 'mean' ? '{ n, sum, sum-of-squares }' : '{ n, numerator, denominator, sum-of-products }',
        });
      }
    }
  }
  const primary = plan.metrics.primary.name;
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    if (!(primary in totalsOfArm.metrics)) {
      ctx.report({ severity: 'error', code: 'totals/missing-primary', path: ['arms', arm, 'metrics'], message: `no totals for the primary metric "${primary}" in arm "${arm}"`, expected: `metrics.${primary}` });
    }
  }
};

const insideTheWindow: Rule<TotalsRuleInput> = (ctx) => {
  const { totals, plan } = ctx.value;
  const start = plan?.window.start;
  if (!start) return;
  if (totals.dataThrough < start) {
    ctx.report({ severity: 'error', code: 'totals/before-start', path: ['data-through'], message: `the data runs through ${totals.dataThrough}, before the test started on ${start}`, expected: `a day on or after ${start}`, showFound: true });
  }
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    totalsOfArm.days.forEach((day, i) => {
      if (day.date < start) ctx.report({ severity: 'error', code: 'totals/before-start', path: ['arms', arm, 'days', i, 'date'], message: `${day.date} is before the test started on ${start}`, expected: `a day on or after ${start}`, showFound: true });
    });
  }
};

/** The rules that compare the totals with the plan they are read against. */
export const TOTALS_PLAN_RULES: readonly Rule<TotalsRuleInput>[] = [samePlan, armsOfThePlan, metricsOfThePlan, insideTheWindow];
