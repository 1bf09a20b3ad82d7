import { countOf, formatPower, formatWeeks } from '../report/numbers.js';
import type { Check } from '../review/context.js';
import { atPlanKey, metricPath } from './plan-key.js';
import { describeSetter, lengthSetter } from './test-length.js';

/** The sizing engine's verdict on each linked plan's primary metric and guardrails. */
export const sizingChecks: Check = ({ linked }) =>
  linked.flatMap(({ loaded, sizing }) => {
    const { plan } = loaded;
    const out: ReturnType<Check> = [];
    if (!plan.design.minDetectableEffect || plan.design.dailyUnits === undefined) {
      const missing = [plan.design.minDetectableEffect ? '' : 'design.min-detectable-effect', plan.design.dailyUnits === undefined ? 'design.daily-units' : ''].filter(Boolean);
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
      if (end?.power !== undefined && end.power < plan.design.power) {
        const needed = s.headline?.duration ? ` It needs ${formatWeeks(s.headline.duration)}.` : '';
        out.push({
          code: 'underpowered',
          message: `${entry.role === 'primary' ? 'The primary metric' : `Guardrail ${entry.metric}`} reaches ${formatPower(end.power)} power by the planned end, below the planned ${formatPower(plan.design.power)}.${needed}`,
          fix: 'Extend the window, enrol more traffic, or plan for a larger effect, and say which in the plan.',
          ...at,
        });
      }
    }
    const diluted = plan.exposure.reach < 1 ? dilution(sizing, plan.design.power) : undefined;
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
function dilution(sizing: Parameters<Check>[0]['linked'][number]['sizing'], plannedPower: number) {
  const asLogged = lengthSetter(sizing, (s) => s.diluted);
  const triggered = lengthSetter(sizing, (s) => s.triggered);
  if (!asLogged || !triggered) return undefined;
  const powers = sizing.metrics.flatMap((m) => (m.result.ok && m.result.value.atPlannedEnd?.power !== undefined ? [m.result.value.atPlannedEnd.power] : []));
  const weakest = powers.length ? Math.min(...powers) : undefined;
  const enough = weakest !== undefined && weakest >= plannedPower;
  const planned = sizing.plannedDays !== undefined ? countOf(sizing.plannedDays, 'day') : undefined;
  const verdict =
    weakest === undefined || planned === undefined
      ? 'Without a planned window it cannot be said whether the test runs long enough.'
      : enough
        ? `The planned ${planned} still suffice: every metric reaches at least ${formatPower(weakest)} power by the end.`
        : `The planned ${planned} do not suffice: the weakest metric reaches ${formatPower(weakest)} power by the end, below the planned ${formatPower(plannedPower)}.`;
  return { needs: formatWeeks(asLogged.duration, describeSetter(asLogged)), couldNeed: formatWeeks(triggered.duration), verdict, enough };
}
