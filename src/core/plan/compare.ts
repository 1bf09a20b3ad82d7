import type { RegistryEntry } from '../registry/schema.js';
import type { FieldPath } from '../source/yaml-source.js';
import type { Metric, Plan } from './schema.js';

/** One field that differs between the plan at the base commit and at head, shown as written text. */
export interface FieldChange {
  /** The field as written in the plan file, e.g. `metrics.primary.name` or `design.alpha`. */
  field: string;
  before: string;
  after: string;
}

const NOT_SET = '(not set)';

/** A value as one short line: scalars as they are, lists and mappings in YAML flow style. */
export function showValue(value: unknown): string {
  if (value === undefined || value === null) return NOT_SET;
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return `[${value.map(showValue).join(', ')}]`;
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
  return `{ ${entries.map(([k, v]) => `${k}: ${showValue(v)}`).join(', ')} }`;
}

type Fields = Map<string, unknown>;

/** What of a metric decides the result; the baseline only once the test has started (before, refining it is fine). */
function metricFields(prefix: string, metric: Metric, withBaseline: boolean, into: Fields): void {
  into.set(`${prefix}.name`, metric.name);
  into.set(`${prefix}.kind`, metric.kind);
  into.set(`${prefix}.events`, metric.events);
  into.set(`${prefix}.direction`, metric.direction);
  if (metric.tolerance) into.set(`${prefix}.tolerance`, metric.tolerance);
  // How each unit's value is computed from its events: changing it after the start changes the result.
  if (metric.perUnit) into.set(`${prefix}.per-unit`, metric.perUnit);
  if (withBaseline) into.set(`${prefix}.baseline`, metric.baseline);
}

/**
 * The fields that decide a test's result, flattened to written names. Changing any of them after the
 * start is how a result gets chosen after the fact (switching the metric, widening a tolerance,
 * rewriting the loss rule), which a plan written in advance exists to prevent.
 */
export function decisiveFields(plan: Plan, started: boolean): Fields {
  const fields: Fields = new Map();
  metricFields('metrics.primary', plan.metrics.primary, started, fields);
  fields.set('metrics.guardrails', plan.metrics.guardrails.map((g) => g.name));
  for (const guardrail of plan.metrics.guardrails) metricFields(`metrics.guardrails[${guardrail.name}]`, guardrail, started, fields);
  fields.set('hypothesis.expected-direction', plan.hypothesis.direction);
  fields.set('design.min-detectable-effect', plan.design.minDetectableEffect);
  fields.set('design.alpha', plan.design.alpha);
  fields.set('design.power', plan.design.power);
  fields.set('design.sides', plan.design.sides);
  fields.set('design.arms', plan.design.arms);
  fields.set('design.control', plan.design.control);
  fields.set('design.interim-looks', plan.design.interimLooks);
  fields.set('design.interim-boundary', plan.design.interimBoundary);
  fields.set('unit.randomization', plan.unit.randomization);
  fields.set('unit.analysis', plan.unit.analysis);
  fields.set('exposure.event', plan.exposure.event);
  fields.set('decisions.win', plan.decisions.win);
  fields.set('decisions.flat', plan.decisions.flat);
  fields.set('decisions.loss', plan.decisions.loss);
  fields.set('decisions.guardrail-breach', plan.decisions.guardrailBreach);
  fields.set('decisions.launch-regardless', plan.decisions.launchRegardless?.reason);
  fields.set('window.start', plan.window.start);
  return fields;
}

/** A registry entry carries less; what it has that decides a readout: when it starts, what it reads and logs. */
export function decisiveEntryFields(entry: RegistryEntry): Fields {
  return new Map<string, unknown>([
    ['window.start', entry.window.start],
    ['flags', entry.flags],
    ['events', entry.events],
    ['traffic-share', entry.trafficShare],
  ]);
}

/**
 * The written path of a field as a FieldChange names it. A guardrail is named by its name there
 * (`metrics.guardrails[errors].tolerance`) and found by its place in the file here; one the plan no
 * longer has gives the list itself.
 */
export function writtenPathOf(field: string, guardrails: readonly string[]): FieldPath {
  const list = 'metrics.guardrails[';
  if (!field.startsWith(list)) return field.split('.');
  const index = guardrails.findIndex((name) => field.startsWith(`${list}${name}].`));
  return index < 0 ? ['metrics', 'guardrails'] : ['metrics', 'guardrails', index, ...field.slice(list.length + guardrails[index]!.length + 2).split('.')];
}

/** Fields whose shown value differs, in the order of `before` and then fields only `after` has. */
export function changedFields(before: Fields, after: Fields): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const field of new Set([...before.keys(), ...after.keys()])) {
    const was = showValue(before.get(field));
    const now = showValue(after.get(field));
    if (was !== now) changes.push({ field, before: was, after: now });
  }
  return changes;
}
