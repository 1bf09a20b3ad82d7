import type { Rule } from '../source/rule-context.js';
import type { FieldPath } from '../source/yaml-source.js';
import { NUMBER_RULES } from './number-rules.js';
import { GROUP_UNITS, type Metric, type Plan } from './schema.js';

/**
 * Cross-field rules of a single plan, run after the schema accepted it. Errors make the plan
 * unusable (its numbers contradict each other); warnings mark a default that was silently taken.
 * Hygiene judgements about the experiment itself belong to the review checks, not here.
 */

const windowInOrder: Rule<Plan> = ({ value: plan, report }) => {
  const { start, end } = plan.window;
  if (start && end && end < start) {
    report({
      severity: 'error',
      code: 'plan/window-order',
      path: ['window', 'end'],
      message: `the window ends (${end}) before it starts (${start})`,
      expected: `an end date on or after ${start}`,
    });
  }
};

const liveHasStart: Rule<Plan> = ({ value: plan, report }) => {
  if ((plan.state === 'live' || plan.state === 'on-hold' || plan.state === 'concluded') && !plan.window.start) {
    report({
      severity: 'warning',
      code: 'plan/start-missing',
      path: ['window'],
      message: `the plan is ${plan.state} but has no start date, so its window cannot be checked`,
      expected: 'window.start, e.g. 2026-11-02',
    });
  }
};

const armsAreDistinct: Rule<Plan> = ({ value: plan, report }) => {
  const seen = new Set<string>();
  plan.design.arms.forEach((arm, index) => {
    if (seen.has(arm.name)) {
      report({
        severity: 'error',
        code: 'plan/duplicate-arm',
        path: ['design', 'arms', index, 'name'],
        message: `arm "${arm.name}" is listed twice`,
        expected: 'each arm name once',
      });
    }
    seen.add(arm.name);
  });
  if (!seen.has(plan.design.control)) {
    report({
      severity: 'error',
      code: 'plan/unknown-control-arm',
      path: ['design', 'control'],
      message: `the control arm "${plan.design.control}" is not one of the arms`,
      expected: `one of ${[...seen].join(', ')}`,
    });
  }
};

const rangeIsNotEmpty: Rule<Plan> = ({ value: plan, report }) => {
  const split = plan.surface.trafficSplit;
  if (!split) return;
  const width = split.range.end - split.range.start;
  if (width <= 0) {
    report({
      severity: 'error',
      code: 'plan/empty-range',
      // A file still on the old key is located at its surface (and warned about the rename).
      path: ['surface', 'traffic-split', 'range'],
      message: `the range from ${split.range.start}% up to ${split.range.end}% holds no units`,
      expected: 'a start below the end, e.g. { start: 0, end: 50 }',
    });
  } else if (plan.design.trafficShare > width / 100 + 1e-9) {
    report({
      severity: 'error',
      code: 'plan/traffic-beyond-range',
      path: ['design', 'traffic-share'],
      message: `traffic-share ${plan.design.trafficShare} is more than the traffic-split range of ${width}% allows`,
      expected: `at most ${width / 100}`,
    });
  }
};

export function allMetrics(plan: Plan): { metric: Metric; path: FieldPath; role: 'primary' | 'guardrail' | 'secondary' }[] {
  return [
    { metric: plan.metrics.primary, path: ['metrics', 'primary'], role: 'primary' as const },
    ...plan.metrics.guardrails.map((metric, i) => ({ metric, path: ['metrics', 'guardrails', i], role: 'guardrail' as const })),
    ...plan.metrics.secondary.map((metric, i) => ({ metric, path: ['metrics', 'secondary', i], role: 'secondary' as const })),
  ];
}

const metricNamesAreDistinct: Rule<Plan> = ({ value: plan, report }) => {
  const seen = new Set<string>();
  for (const { metric, path } of allMetrics(plan)) {
    if (seen.has(metric.name)) {
      report({
        severity: 'error',
        code: 'plan/duplicate-metric',
        path: [...path, 'name'],
        message: `metric "${metric.name}" is defined more than once`,
        expected: 'each metric name once across primary, guardrails and secondary',
      });
    }
    seen.add(metric.name);
  }
};

const guardrailsSayWhatHarmIs: Rule<Plan> = ({ value: plan, report }) => {
  for (const { metric, path, role } of allMetrics(plan)) {
    if (role !== 'guardrail') continue;
    if (metric.directionAssumed) {
      report({
        severity: 'warning',
        code: 'plan/direction-assumed',
        path: [...path, 'direction'],
        message: `guardrail "${metric.name}" does not say which direction is good; "increase" was assumed`,
        expected: 'direction: increase or decrease (e.g. decrease for latency or errors)',
      });
    }
    if (!metric.tolerance) {
      report({
        severity: 'warning',
        code: 'plan/tolerance-missing',
        path: [...path, 'tolerance'],
        message: `guardrail "${metric.name}" has no tolerated harm, so a breach cannot be judged`,
        expected: 'tolerance, e.g. { relative: 0.02 }',
      });
    }
  }
};

const groupUnitsDescribeClusters: Rule<Plan> = ({ value: plan, report }) => {
  const isGroup = GROUP_UNITS.includes(plan.unit.randomization);
  // Metrics averaged over the groups themselves need no design effect; over their members they do.
  if (isGroup && plan.unit.analysis !== plan.unit.randomization && !plan.design.cluster) {
    report({
      severity: 'warning',
      code: 'plan/cluster-missing',
      path: ['design', 'cluster'],
      message: `${plan.unit.randomization}s are randomized and ${plan.unit.analysis}s analysed, but the design gives no group size or intra-cluster correlation, so sizing cannot apply the design effect`,
      expected: 'design.cluster, e.g. { mean-size: 8, icc: 0.05 }',
    });
  }
  if (!isGroup && plan.design.cluster) {
    report({
      severity: 'warning',
      code: 'plan/cluster-unused',
      path: ['design', 'cluster'],
      message: `design.cluster applies only when a group (${GROUP_UNITS.join(', ')}) is randomized; it is ignored for ${plan.unit.randomization}`,
    });
  }
};

const readinessNamesTargets: Rule<Plan> = ({ value: plan, report }) => {
  const { platforms, locales, ready } = plan.population;
  ready.platforms.forEach((name, i) => {
    if (platforms.length && !platforms.includes(name)) {
      report({
        severity: 'warning',
        code: 'plan/ready-unknown-target',
        path: ['population', 'ready', 'platforms', i],
        message: `ready names platform "${name}", which is not in population.platforms`,
        expected: `one of ${platforms.join(', ')}`,
      });
    }
  });
  ready.locales.forEach((name, i) => {
    if (locales.length && !locales.includes(name)) {
      report({
        severity: 'warning',
        code: 'plan/ready-unknown-target',
        path: ['population', 'ready', 'locales', i],
        message: `ready names locale "${name}", which is not in population.locales`,
        expected: `one of ${locales.join(', ')}`,
      });
    }
  });
};

const overlapsNameOthers: Rule<Plan> = ({ value: plan, report }) => {
  plan.surface.overlapsWith.forEach((id, i) => {
    if (id === plan.id) {
      report({
        severity: 'warning',
        code: 'plan/overlaps-itself',
        path: ['surface', 'overlaps-with', i],
        message: 'a plan cannot overlap with itself; remove its own id',
      });
    }
  });
};

/** The outcomes every plan must decide on before launch; shared with the review's hygiene check. */
export const DECISION_OUTCOMES = [
  { key: 'win', field: 'win' },
  { key: 'flat', field: 'flat' },
  { key: 'loss', field: 'loss' },
  { key: 'guardrailBreach', field: 'guardrail-breach' },
] as const;

/**
 * Outcomes without a written rule. A plan that declares it launches regardless of the result
 * still owes a rule for a guardrail breach: shipping harm is never pre-approved.
 */
export function missingDecisions(plan: Plan): string[] {
  const owed = plan.decisions.launchRegardless ? DECISION_OUTCOMES.filter((o) => o.key === 'guardrailBreach') : DECISION_OUTCOMES;
  return owed.filter((o) => !plan.decisions[o.key]).map((o) => o.field);
}

const decisionsAreWritten: Rule<Plan> = ({ value: plan, report }) => {
  const missing = missingDecisions(plan);
  if (missing.length === 0) return;
  report({
    severity: 'warning',
    code: 'plan/decisions-missing',
    path: ['decisions'],
    message: `no decision rule for ${missing.join(', ')}; without rules written before launch any result can be read as a win, and the pull-request review blocks`,
    expected: `decisions with ${missing.map((m) => `${m}: "..."`).join(', ')}`,
  });
};

/**
 * `per-unit` picks among the metric's own events: an event named only there would be counted without
 * appearing in `events`, which the review searches the code for.
 */
const perUnitUsesTheMetricsEvents: Rule<Plan> = ({ value: plan, report }) => {
  for (const { metric, path } of allMetrics(plan)) {
    const perUnit = metric.perUnit;
    const lists: [FieldPath, string[] | undefined][] = [
      [['events'], perUnit?.events],
      [['among'], perUnit?.among],
      [['numerator', 'events'], perUnit?.numerator?.events],
      [['denominator', 'events'], perUnit?.denominator?.events],
    ];
    for (const [at, events] of lists) {
      events?.forEach((event, i) => {
        if (metric.events.includes(event)) return;
        report({
          severity: 'error',
          code: 'plan/per-unit-event',
          path: [...path, 'per-unit', ...at, i],
          message: `"${event}" is not one of the metric's events`,
          expected: `one of ${metric.events.join(', ')} (add it to events first)`,
        });
      });
    }
    if (metric.kind === 'ratio' && metric.events.length !== 2 && !(perUnit?.numerator?.events && perUnit.denominator?.events)) {
      report({
        severity: 'warning',
        code: 'plan/per-unit-ambiguous',
        path: [...path, 'events'],
        message: `a ratio with ${metric.events.length} events does not say which make the numerator and which the denominator, so no totals query can be written for it`,
        expected: 'per-unit: { numerator: { events: [...] }, denominator: { events: [...] } }, or exactly two events (numerator first)',
      });
    }
  }
};

export const PLAN_RULES: readonly Rule<Plan>[] = [
  perUnitUsesTheMetricsEvents,
  windowInOrder,
  liveHasStart,
  armsAreDistinct,
  rangeIsNotEmpty,
  metricNamesAreDistinct,
  guardrailsSayWhatHarmIs,
  groupUnitsDescribeClusters,
  readinessNamesTargets,
  overlapsNameOthers,
  decisionsAreWritten,
  ...NUMBER_RULES,
];
