import type { PlanSizing } from './plan-sizing.js';
import { fail } from './result.js';

/**
 * The last guard between sizing and a report. The plan rules keep every input in a range where the
 * arithmetic stays finite (core/plan/number-rules.ts); should a combination still overflow, the metric
 * becomes a sizing error naming the figure and the input most likely at fault, instead of a null in
 * JSON, "∞" in text or "NaN" in a finding.
 */

/** Where a non-finite figure is found, and which input to look at first for it. */
const SUSPECTS: readonly { figure: RegExp; input: string; name: string }[] = [
  { figure: /duration|days|weeks|powerByDay/, input: 'daily-units', name: 'the number of days' },
  { figure: /clusters|designEffect/, input: 'cluster', name: 'the number of groups' },
  { figure: /perArm|totalUnits|units/, input: 'effect', name: 'the number of units' },
  { figure: /power|detectable/, input: 'effect', name: 'the power' },
  { figure: /./, input: 'baseline', name: 'a figure' },
];

/** The path to the first number in `value` that is NaN or infinite (iteratively: reports are shallow, but no walk should recurse on data). */
export function firstNonFinite(value: unknown): string | undefined {
  const stack: { at: string; value: unknown }[] = [{ at: '', value }];
  while (stack.length > 0) {
    const { at, value: current } = stack.pop()!;
    if (typeof current === 'number') {
      if (!Number.isFinite(current)) return at;
    } else if (current !== null && typeof current === 'object') {
      const entries = Array.isArray(current) ? current.map((v, i) => [String(i), v] as const) : Object.entries(current);
      for (const [key, child] of entries.reverse()) stack.push({ at: at ? `${at}.${key}` : key, value: child });
    }
  }
  return undefined;
}

/** A plan's sizing with every metric whose figures are not all finite turned into an error. */
export function finiteSizing(sizing: PlanSizing): PlanSizing {
  return {
    ...sizing,
    metrics: sizing.metrics.map((entry) => {
      if (!entry.result.ok) return entry;
      const at = firstNonFinite(entry.result.value);
      if (at === undefined) return entry;
      const suspect = SUSPECTS.find((s) => s.figure.test(at))!;
      return {
        ...entry,
        result: fail(suspect.input, `${suspect.name} overflows for these inputs (${at}); bring ${suspect.input} and the other figures into the ranges in docs/plan-limits.md`),
      };
    }),
  };
}
