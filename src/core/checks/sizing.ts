import { countOf, formatCount, formatPower, formatWeeks } from '../report/numbers.js';
import type { Settings } from '../config/schema.js';
import { inclusiveDays } from '../calendar.js';
import type { Plan } from '../plan/schema.js';
import type { Check } from '../review/context.js';
import type { PlanSizing } from '../stats/plan-sizing.js';
import { atPlanKey, metricPath } from './plan-key.js';
import { describeSetter, lengthSetter } from './test-length.js';

/** The sizing engine's verdict on each linked plan's primary metric and guardrails. */
export const sizingChecks: Check = ({ linked, settings }) =>
  linked.flatMap(({ loaded, sizing }) => {
    const { plan } = loaded;
    const out: ReturnType<Check> = [];
    const noTraffic = plan.design.dailyUnits === undefined && plan.design.uniqueUnits === undefined;
    if (!plan.design.minDetectableEffect || noTraffic) {
      const missing = [plan.design.minDetectableEffect ? '' : 'design.min-detectable-effect', noTraffic ? 'design.daily-units (or design.unique-units)' : ''].filter(Boolean);
      const key = plan.design.minDetectableEffect ? 'daily-units' : 'min-detectable-effect';
      out.push({ code: 'sizing-incomplete', message: `The test cannot be sized without ${missing.join(' and ')}.`, fix: `Add ${missing.join(' and ')}; then Plumbline says how many units and days the test needs.`, ...atPlanKey(loaded, ['design', key]) });
    }
    for (const entry of sizing.metrics) {
      const at = atPlanKey(loaded, metricPath(plan, entry.metric));
      if (!entry.result.ok) {
        out.push({ code: 'sizing-impossible', message: `${entry.metric} cannot be sized: ${entry.result.error.input}: ${entry.result.error.message}.`, fix: 'Check the metric’s baseline figures and the effect to detect.', ...at });
        continue;
      }
      const s = entry.result.value;
      const end = s.atPlannedEnd;
      if (end?.power !== undefined && end.power < entry.power) {
        const needed = s.headline?.duration ? ` It needs ${formatWeeks(s.headline.duration)}.` : '';
        out.push({
          code: 'underpowered',
          message: `${entry.role === 'primary' ? 'The primary metric' : `Guardrail ${entry.metric}`} reaches ${formatPower(end.power)} power by the planned end, below the planned ${formatPower(entry.power)}.${needed}`,
          fix: 'Extend the window, enrol more traffic, or plan for a larger effect, and say which in the plan.',
          ...at,
        });
      }
    }
    const atDesign = atPlanKey(loaded, ['design']);
    out.push(...practiceFindings(plan, sizing, settings).map((f) => ({ ...f, ...atDesign })));
    const diluted = plan.exposure.reach < 1 ? dilution(sizing) : undefined;
    if (diluted) {
      out.push({
        code: 'exposure-diluted',
        message: `Only ${Math.round(plan.exposure.reach * 100)}% of exposed units reach the change, so the effect is diluted: the test needs ${diluted.needs} instead of ${diluted.couldNeed} with exposure logged where the change is seen. ${diluted.verdict}`,
        fix: diluted.enough
          ? 'Nothing is needed for this test; logging exposure where the change is seen (or analysing only the units that reach it) would make the next one shorter.'
          : 'Log the exposure event where the change is actually seen (or analyse only the units that reach it), or extend the window.',
        ...atPlanKey(loaded, ['exposure', 'reach']),
      });
    }
    return out;
  });

/** What dilution costs, and whether the planned window still gives every sized metric its power. */
function dilution(sizing: PlanSizing) {
  const asLogged = lengthSetter(sizing, (s) => s.diluted);
  const triggered = lengthSetter(sizing, (s) => s.triggered);
  if (!asLogged || !triggered) return undefined;
  // Each metric is held to its own planned power (guardrails may have their own).
  const ends = sizing.metrics.flatMap((m) => (m.result.ok && m.result.value.atPlannedEnd?.power !== undefined ? [{ power: m.result.value.atPlannedEnd.power, target: m.power }] : []));
  const shortest = ends.length ? ends.reduce((a, b) => (b.power - b.target < a.power - a.target ? b : a)) : undefined;
  const weakest = shortest?.power;
  const plannedPower = shortest?.target ?? 0;
  const enough = shortest !== undefined && ends.every((e) => e.power >= e.target);
  const planned = sizing.plannedDays !== undefined ? countOf(sizing.plannedDays, 'day') : undefined;
  const verdict =
    weakest === undefined || planned === undefined
      ? 'Without a planned window it cannot be said whether the test runs long enough.'
      : enough
        ? `The planned ${planned} still suffice: every metric reaches at least ${formatPower(weakest)} power by the end.`
        : `The planned ${planned} do not suffice: the weakest metric reaches ${formatPower(weakest)} power by the end, below the planned ${formatPower(plannedPower)}.`;
  return { needs: formatWeeks(asLogged.duration, describeSetter(asLogged)), couldNeed: formatWeeks(triggered.duration), verdict, enough };
}

/** Words that say a population comes back: returning customers, weekly shoppers, past orders. */
const RETURNING = /\b(returning|repeat|regulars?|existing|loyal|weekly|monthly|past orders?|subscribers?|members?|logged[- ]in)\b/i;

export function populationReturns(plan: Plan): boolean {
  return RETURNING.test(`${plan.population.segment ?? ''} ${plan.hypothesis.change}`);
}

type Raised = Omit<ReturnType<Check>[number], 'plan' | 'file' | 'line'>;

/** Findings about the practice of sizing: feasibility, returning units, groups, ratios, periods. */
function practiceFindings(plan: Plan, sizing: PlanSizing, settings: Settings): Raised[] {
  const out: Raised[] = [];
  for (const entry of sizing.metrics) {
    if (!entry.result.ok) continue;
    const f = entry.result.value.feasibility;
    if (f && !f.feasible) {
      out.push({
        code: 'not-feasible',
        message: `${entry.role === 'primary' ? 'The primary metric' : `Guardrail ${entry.metric}`} is not feasible at this traffic: ${f.reason}.`,
        fix: 'Plan for a larger effect, pick a more sensitive metric, or ship as a guarded rollout without a test; the sizing shows what the longest window can detect.',
      });
    }
  }
  if (populationReturns(plan) && plan.design.dailyUnits !== undefined && !plan.design.uniqueUnits) {
    out.push({
      code: 'returning-units',
      message: 'The population comes back (returning or regular users), but traffic is given only as design.daily-units, which sizing reads as new units each day.',
      fix: 'Give design.unique-units: the different units seen in the first 7 days and over the planned window, e.g. [{ days: 7, units: 40000 }, { days: 28, units: 60000 }].',
    });
  }
  const primary = sizing.metrics[0]?.result;
  const groups = primary?.ok ? primary.value.headline?.clusters : undefined;
  if (groups !== undefined && plan.design.groupsAvailable !== undefined && groups > plan.design.groupsAvailable) {
    out.push({
      code: 'groups-short',
      message: `The design needs ${countOf(groups, 'group')}, but only ${formatCount(plan.design.groupsAvailable)} exist.`,
      fix: 'Plan for a larger effect, reduce the intra-cluster correlation with a pre-period adjustment, or randomize a smaller unit if spillover allows.',
    });
  }
  const metrics = [plan.metrics.primary, ...plan.metrics.guardrails];
  for (const metric of metrics) {
    if (metric.kind !== 'ratio' || !metric.denominatorMayMove) continue;
    const secondaryEvents = new Set(plan.metrics.secondary.flatMap((m) => m.events));
    const covered = plan.metrics.secondary.filter((m) => m.events.every((e) => metric.events.includes(e))).length >= 2 && metric.events.every((e) => secondaryEvents.has(e));
    if (!covered) {
      out.push({
        code: 'ratio-denominator',
        message: `${metric.name} is a ratio whose denominator the change may move: a ratio can rise because its denominator falls.`,
        fix: `List the numerator and the denominator of ${metric.name} as secondary metrics (each from its events), so the readout shows which moved.`,
      });
    }
  }
  const { start, end } = plan.window;
  if (start && end) {
    for (const period of settings.sizing.atypicalPeriods) {
      if (period.start <= end && period.end >= start) {
        out.push({
          code: 'atypical-period',
          message: `The planned window overlaps ${period.name} (${period.start} to ${period.end}), when behaviour is unusual.`,
          fix: 'Move or extend the window so that typical weeks dominate, or say in the plan why the period is the one to test.',
        });
      }
    }
    if (populationReturns(plan) && end >= start && inclusiveDays(start, end) < 14) {
      out.push({
        code: 'novelty-window',
        message: `The change is aimed at returning users and the window is ${countOf(inclusiveDays(start, end), 'day')}: early reactions to something new fade.`,
        fix: 'Plan at least two weeks so that the novelty effect can wear off, and compare the first week with the second at the readout.',
      });
    }
  }
  return out;
}
