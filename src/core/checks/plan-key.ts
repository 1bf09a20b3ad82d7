import { lineOfKey, type LoadedPlan } from '../plan/load.js';
import type { Plan } from '../plan/schema.js';
import type { FieldPath } from '../source/yaml-source.js';

/**
 * Where a finding about a plan points: the key the fix goes to (`decisions:`, `window:`, a
 * metric), so that an annotation lands on the line to edit rather than on the plan's `id`.
 */
export function atPlanKey(loaded: LoadedPlan, path: FieldPath): { plan: string; file: string; line: number } {
  return { plan: loaded.plan.id, file: loaded.file, line: lineOfKey(loaded, path) };
}

/** The written path of a metric, by name: the primary, a guardrail or a secondary metric. */
export function metricPath(plan: Plan, name: string): FieldPath {
  if (plan.metrics.primary.name === name) return ['metrics', 'primary'];
  const guardrail = plan.metrics.guardrails.findIndex((m) => m.name === name);
  if (guardrail >= 0) return ['metrics', 'guardrails', guardrail];
  const secondary = plan.metrics.secondary.findIndex((m) => m.name === name);
  return secondary >= 0 ? ['metrics', 'secondary', secondary] : ['metrics'];
}
