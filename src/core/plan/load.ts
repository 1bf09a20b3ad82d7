import { checkWritten, formatFieldPath } from '../source/check-written.js';
import type { Problem } from '../source/problem.js';
import { runRules } from '../source/rule-context.js';
import { readYaml, type FieldPath, type YamlLimits } from '../source/yaml-source.js';
import { planJsonSchema } from './json-schema.js';
import { renamedSurfaceKeys } from './renamed-keys.js';
import { PLAN_RULES } from './rules.js';
import { planSchema, type Plan } from './schema.js';

/** A plan is small; anything bigger than this is a pasted data dump or an attack. */
export const PLAN_LIMITS: YamlLimits = { maxBytes: 256 * 1024, maxAliases: 100 };

/** A loaded plan with where it came from. */
export interface LoadedPlan {
  plan: Plan;
  file: string;
  /** 1-based line of the plan's `id`, for links and annotations. */
  line: number;
  /** 1-based line of every written key, by dotted field path (`window.end`, `metrics.guardrails[0]`). */
  keyLines: ReadonlyMap<string, number>;
}

/**
 * The line a finding about `path` should point at: the key itself when written, else its nearest
 * written parent (a missing `window.end` points at `window:`), else the plan's `id` line.
 */
export function lineOfKey(loaded: Pick<LoadedPlan, 'line' | 'keyLines'>, path: FieldPath): number {
  for (let depth = path.length; depth > 0; depth--) {
    const line = loaded.keyLines.get(formatFieldPath(path.slice(0, depth)));
    if (line !== undefined) return line;
  }
  return loaded.line;
}

export type PlanLoadResult = { ok: true; loaded: LoadedPlan; warnings: Problem[] } | { ok: false; errors: Problem[]; warnings: Problem[] };

/** Text of one plan file -> a normalized plan, or the problems that stop it being used. Never throws for user mistakes. */
export function loadPlan(text: string, file: string): PlanLoadResult {
  const read = readYaml(text, file, PLAN_LIMITS, 'plan');
  if (!read.ok) return { ok: false, errors: read.problems, warnings: [] };
  const checked = checkWritten(read.source, planSchema, planJsonSchema, 'plan');
  if (!checked.ok) return { ok: false, errors: checked.problems, warnings: [] };
  const problems = [...renamedSurfaceKeys(read.source, [['surface']], 'plan'), ...runRules(checked.value, read.source, PLAN_RULES)];
  const errors = problems.filter((p) => p.severity === 'error');
  const warnings = problems.filter((p) => p.severity === 'warning');
  if (errors.length) return { ok: false, errors, warnings };
  return { ok: true, loaded: { plan: checked.value, file, line: read.source.locate(['id']).line, keyLines: read.source.keyLines() }, warnings };
}
