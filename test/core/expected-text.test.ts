import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parse, stringify } from 'yaml';
import { planJsonSchema } from '../../src/core/plan/json-schema.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { formatFieldPath, knownKeysAt } from '../../src/core/source/check-written.js';
import { formatProblem } from '../../src/core/source/problem.js';

/**
 * Every field's "expected ..." phrase is printed after the word "expected". A phrase that begins with
 * the word itself ("expected new eligible units per day") must not read "expected expected". This walks
 * every key the plan schema allows under the full fixture, writes a wrong-typed value there and checks
 * each problem the plan gives.
 */

const full = parse(readFileSync(new URL('../fixtures/plans/valid/full.yaml', import.meta.url), 'utf8')) as Record<string, unknown>;
type Path = (string | number)[];

function fieldPaths(value: unknown, path: Path = []): Path[] {
  if (Array.isArray(value)) return value.flatMap((item, i) => fieldPaths(item, [...path, i]));
  if (value === null || typeof value !== 'object') return [];
  const record = value as Record<string, unknown>;
  return knownKeysAt(planJsonSchema(), full, path).flatMap((key) => [[...path, key], ...(key in record ? fieldPaths(record[key], [...path, key]) : [])]);
}

function withValue(path: Path, replacement: unknown): Record<string, unknown> {
  const copy = structuredClone(full);
  let node = copy as Record<string | number, unknown>;
  for (const segment of path.slice(0, -1)) node = node[segment] as Record<string | number, unknown>;
  node[path[path.length - 1]!] = replacement;
  return copy;
}

describe('the expected text of every plan field reads once', () => {
  const paths = fieldPaths(full);

  it('walks every field of the plan schema under the full fixture', () => {
    expect(paths.length).toBeGreaterThan(100);
    expect(paths.map((p) => formatFieldPath(p))).toContain('design.daily-units');
  });

  it.each(paths.map((p) => [formatFieldPath(p), p] as const))('%s with a wrong-typed value', (field, path) => {
    const problems = ['lots', 12345, [true]].flatMap((wrong) => {
      const result = loadPlan(stringify(withValue(path, wrong)), 'plan.yaml');
      return result.ok ? [] : result.errors;
    });
    expect(problems.some((p) => p.field === field || p.field.startsWith(`${field}.`) || p.field.startsWith(`${field}[`))).toBe(true);
    for (const problem of problems) {
      expect(problem.expected ?? '').not.toMatch(/^expected\b/i);
      expect(formatProblem(problem)).not.toMatch(/expected expected/i);
    }
  });

  it('design.daily-units: "expected new eligible units per day", once', () => {
    const result = loadPlan(stringify(withValue(['design', 'daily-units'], 'lots')), 'plan.yaml');
    expect(result.ok).toBe(false);
    const problem = result.ok ? undefined : result.errors.find((p) => p.field === 'design.daily-units');
    expect(problem?.expected).toBe('new eligible units per day (units not seen before), e.g. 12000');
    expect(formatProblem(problem!)).toContain('has the wrong type (expected new eligible units per day (units not seen before), e.g. 12000; found the text "lots")');
  });
});
