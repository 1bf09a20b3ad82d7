import type { PlanSizing } from '../stats/plan-sizing.js';
import type { AnalysisSize, MetricSizing } from '../stats/sizing.js';
import type { Duration } from '../stats/duration.js';

/** The metric that sets how long a test must run: the longest of the primary metric and the guardrails. */
export interface LengthSetter {
  metric: string;
  role: 'primary' | 'guardrail';
  duration: Duration;
}

/**
 * The longest duration among the sized metrics, for the analysis `pick` chooses (the plan's own by
 * default). A guardrail sized for a small tolerated harm often needs longer than the primary metric,
 * and the test cannot stop before every guardrail has been read.
 */
export function lengthSetter(sizing: PlanSizing, pick: (s: MetricSizing) => AnalysisSize | undefined = (s) => s.headline): LengthSetter | undefined {
  let longest: LengthSetter | undefined;
  for (const entry of sizing.metrics) {
    const duration = entry.result.ok ? pick(entry.result.value)?.duration : undefined;
    if (duration && (!longest || duration.days > longest.duration.days)) longest = { metric: entry.metric, role: entry.role, duration };
  }
  return longest;
}

/** "the primary metric sets the length" or "guardrail errors sets the length". */
export function describeSetter(setter: LengthSetter): string {
  return setter.role === 'primary' ? 'the primary metric sets the length' : `guardrail ${setter.metric} sets the length`;
}
