import { formatPower, plural } from '../report/numbers.js';
import type { Check } from '../review/context.js';

/** The statistics engine's verdict on each linked plan's primary metric and guardrails. */
export const sizingChecks: Check = ({ linked }) =>
  linked.flatMap(({ loaded, sizing }) => {
    const { plan } = loaded;
    const at = { plan: plan.id, file: loaded.file, line: loaded.line };
    const out: ReturnType<Check> = [];
    if (!plan.design.minDetectableEffect || plan.design.dailyUnits === undefined) {
      const missing = [plan.design.minDetectableEffect ? '' : 'design.min-detectable-effect', plan.design.dailyUnits === undefined ? 'design.daily-units' : ''].filter(Boolean);
      out.push({ code: 'sizing-incomplete', message: `The test cannot be sized without ${missing.join(' and ')}.`, fix: `Add ${missing.join(' and ')}; then Plumbline says how many units and days the test needs.`, ...at });
    }
    for (const entry of sizing.metrics) {
      if (!entry.result.ok) {
        out.push({ code: 'sizing-impossible', message: `${entry.metric} cannot be sized: ${entry.result.error.input}: ${entry.result.error.message}.`, fix: 'Check the metric’s baseline figures and the effect to detect.', ...at });
        continue;
      }
      const s = entry.result.value;
      const end = s.atPlannedEnd;
      if (end?.power !== undefined && end.power < plan.design.power) {
        const needed = s.headline?.duration ? ` It needs ${plural(s.headline.duration.weeks, 'week')} (${plural(s.headline.duration.days, 'day')}).` : '';
        out.push({
          code: 'underpowered',
          message: `${entry.role === 'primary' ? 'The primary metric' : `Guardrail ${entry.metric}`} reaches ${formatPower(end.power)} power by the planned end, below the planned ${formatPower(plan.design.power)}.${needed}`,
          fix: 'Extend the window, enrol more traffic, or plan for a larger effect, and say which in the plan.',
          ...at,
        });
      }
    }
    const primary = sizing.metrics[0];
    if (plan.exposure.reach < 1 && primary?.result.ok && primary.result.value.diluted && primary.result.value.triggered) {
      const s = primary.result.value;
      const days = (a: typeof s.diluted) => (a?.duration ? `${a.duration.days} days` : `${a?.totalUnits.toLocaleString('en-US')} units`);
      out.push({
        code: 'exposure-diluted',
        message: `Only ${Math.round(plan.exposure.reach * 100)}% of exposed units reach the change, so the effect is diluted: the test needs ${days(s.diluted)} instead of ${days(s.triggered)}.`,
        fix: 'Log the exposure event where the change is actually seen (or analyse only the units that reach it).',
        ...at,
      });
    }
    return out;
  });
