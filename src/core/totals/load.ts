import { z } from 'zod';
import type { Plan } from '../plan/schema.js';
import { checkWritten, type JsonSchemaNode } from '../source/check-written.js';
import type { Problem } from '../source/problem.js';
import { runRules } from '../source/rule-context.js';
import { readYaml, type YamlLimits, type YamlSource } from '../source/yaml-source.js';
import { TOTALS_PLAN_RULES, TOTALS_RULES } from './rules.js';
import { totalsSchema, writtenTotalsSchema, type ArmTotalsFile } from './schema.js';

/** Totals are a few kilobytes; a megabyte allows a year of days and many segments. */
export const TOTALS_LIMITS: YamlLimits = { maxBytes: 1024 * 1024, maxAliases: 100 };

export const TOTALS_SCHEMA_ID = 'https://plumbline.dev/schema/totals.schema.json';

let cached: JsonSchemaNode | undefined;
export function totalsJsonSchema(): JsonSchemaNode {
  cached ??= {
    $id: TOTALS_SCHEMA_ID,
    title: 'Plumbline arm totals',
    ...(z.toJSONSchema(writtenTotalsSchema, { io: 'input', target: 'draft-2020-12' }) as JsonSchemaNode),
  };
  return cached;
}

/**
 * A commit id written without quotes is read by YAML as a number when its digits happen to form one (`1234567`,
 * `12e4567`, about one short id in ten): the id is the text as written, so take it back from the source.
 */
function commitAsWritten(text: string, source: YamlSource): void {
  const value = source.value as Record<string, unknown> | null;
  if (!value || typeof value !== 'object' || typeof value['plan-commit'] !== 'number') return;
  const at = source.locate(['plan-commit']);
  const line = text.split(/\r?\n/)[at.line - 1] ?? '';
  const written = /^[0-9a-fA-F.eE+-]+/.exec(line.slice(at.column - 1))?.[0];
  if (written) value['plan-commit'] = written;
}

export type TotalsLoadResult = { ok: true; totals: ArmTotalsFile; warnings: Problem[] } | { ok: false; errors: Problem[]; warnings: Problem[] };

/**
 * Text of an arm-totals file -> its totals, or the problems that stop it being read. With `plan`,
 * the arms, metrics and dates are checked against it too. Never throws for a user's mistake.
 */
export function loadTotals(text: string, file: string, plan?: Plan): TotalsLoadResult {
  const read = readYaml(text, file, TOTALS_LIMITS, 'totals');
  if (!read.ok) return { ok: false, errors: read.problems, warnings: [] };
  commitAsWritten(text, read.source);
  const checked = checkWritten(read.source, totalsSchema, totalsJsonSchema, 'totals');
  if (!checked.ok) return { ok: false, errors: checked.problems, warnings: [] };
  const problems = runRules({ totals: checked.value, ...(plan ? { plan } : {}) }, read.source, [...TOTALS_RULES, ...(plan ? TOTALS_PLAN_RULES : [])]);
  const errors = problems.filter((p) => p.severity === 'error');
  const warnings = problems.filter((p) => p.severity === 'warning');
  if (errors.length) return { ok: false, errors, warnings };
  return { ok: true, totals: checked.value, warnings };
}
