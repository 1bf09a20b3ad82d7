import type { z } from 'zod';
import { closestName } from './closest-name.js';
import { describeValue, expectedText, type Problem } from './problem.js';
import type { FieldPath, YamlSource } from './yaml-source.js';

/** The subset of JSON Schema that our generated schemas use, enough to list an object's known keys. */
export interface JsonSchemaNode {
  type?: string | string[];
  properties?: Record<string, JsonSchemaNode>;
  items?: JsonSchemaNode;
  anyOf?: JsonSchemaNode[];
  oneOf?: JsonSchemaNode[];
  const?: unknown;
  $ref?: string;
  $defs?: Record<string, JsonSchemaNode>;
  [key: string]: unknown;
}

export type CheckResult<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

/**
 * Validates a parsed YAML value against a zod schema and turns every zod issue into a Problem
 * that says where (file:line:column), which field, what was expected and what was found.
 * `jsonSchema` gives the same schema in JSON Schema form; it tells which keys an object knows,
 * so an unknown key can be answered with the closest known one. It is called only when the value
 * is invalid: generating it costs more than validating a file, and most files are valid.
 */
export function checkWritten<T>(
  source: YamlSource,
  schema: z.ZodType<T>,
  jsonSchema: () => JsonSchemaNode,
  codePrefix: string,
): CheckResult<T> {
  const parsed = schema.safeParse(source.value);
  if (parsed.success) return { ok: true, value: parsed.data };
  const problems: Problem[] = [];
  for (const issue of parsed.error.issues) {
    problems.push(...issueToProblems(issue as ZodIssueLike, source, jsonSchema(), codePrefix));
  }
  return { ok: false, problems: dedupe(problems) };
}

interface ZodIssueLike {
  code: string;
  path: PropertyKey[];
  message: string;
  keys?: string[];
  errors?: ZodIssueLike[][];
  discriminator?: string;
  note?: string;
  params?: { code?: string; summary?: string };
  origin?: string;
}

function issueToProblems(issue: ZodIssueLike, source: YamlSource, jsonSchema: JsonSchemaNode, codePrefix: string): Problem[] {
  const path = issue.path.filter((p): p is string | number => typeof p !== 'symbol');

  if (issue.code === 'unrecognized_keys') {
    const known = knownKeysAt(jsonSchema, source.value, path);
    return (issue.keys ?? []).map((key) => {
      const suggestion = closestName(key, known);
      return {
        severity: 'error' as const,
        code: `${codePrefix}/unknown-key`,
        ...source.locateKey(path, key),
        field: formatFieldPath([...path, key]),
        message: suggestion ? `unknown key "${key}"; did you mean "${suggestion}"?` : `unknown key "${key}"`,
        ...(known.length ? { expected: `one of ${known.join(', ')}` } : {}),
      };
    });
  }

  if (issue.code === 'invalid_union') {
    if (issue.discriminator) {
      // zod 4 reports a bad discriminator at the discriminator itself; older shapes stop at the object.
      const discriminatorPath = path[path.length - 1] === issue.discriminator ? path : [...path, issue.discriminator];
      return [{ ...fieldProblem(issue, discriminatorPath, source, codePrefix), message: 'is not one of the allowed kinds' }];
    }
    const branch = pickUnionBranch(issue.errors ?? []);
    // zod reports a union branch's issues relative to the union itself.
    if (branch) return branch.flatMap((inner) => issueToProblems({ ...inner, path: [...issue.path, ...inner.path] }, source, jsonSchema, codePrefix));
  }

  return [fieldProblem(issue, path, source, codePrefix)];
}

function fieldProblem(issue: ZodIssueLike, path: FieldPath, source: YamlSource, codePrefix: string): Problem {
  const found = valueAt(source.value, path);
  const missing = found === undefined;
  const customCode = issue.code === 'custom' ? issue.params?.code : undefined;
  const message = customCode
    ? (issue.params?.summary ?? 'is not valid')
    : missing
      ? 'required field is missing'
      : path.length === 0 && found === null
        ? 'the file is empty'
        : summaryFor(issue);
  return {
    severity: 'error',
    code: customCode ?? (missing ? `${codePrefix}/missing-field` : `${codePrefix}/invalid-value`),
    ...source.locate(path),
    field: formatFieldPath(path),
    message,
    expected: cleanZodMessage(issue.message),
    ...(missing ? {} : { found: describeFound(found) }),
  };
}

/** Percentages typed as text are the commonest slip in plan files; say how to write them. */
function describeFound(found: unknown): string {
  const percent = typeof found === 'string' ? /^\s*(-?\d+(?:\.\d+)?)\s*%\s*$/.exec(found) : null;
  const described = describeValue(found);
  return percent ? `${described}; write ${percent[1]}% as ${Number(percent[1]) / 100}` : described;
}

function summaryFor(issue: ZodIssueLike): string {
  switch (issue.code) {
    case 'invalid_type':
      return 'has the wrong type';
    case 'too_small':
      return issue.origin === 'array' ? 'has too few items' : issue.origin === 'string' ? 'is empty' : 'is out of range';
    case 'too_big':
      return issue.origin === 'array' ? 'has too many items' : issue.origin === 'string' ? 'is too long' : 'is out of range';
    case 'invalid_value':
      return 'is not one of the allowed values';
    case 'invalid_format':
      return 'is not in the expected format';
    default:
      return 'is not valid';
  }
}

/** zod's own fallback messages start with "Invalid input: "; ours are phrased to follow "expected". */
function cleanZodMessage(message: string): string {
  return expectedText(message.replace(/^Invalid input: /, ''));
}

/**
 * Of a union's failed branches, the one the user most likely meant: a branch whose failures are
 * all below the union's own value matched the value's shape and only got details wrong.
 */
function pickUnionBranch(branches: ZodIssueLike[][]): ZodIssueLike[] | undefined {
  const shaped = branches.filter((issues) => issues.every((i) => !(i.code === 'invalid_type' && i.path.length === 0)));
  if (shaped.length === 0) return undefined;
  return shaped.reduce((best, next) => (next.length < best.length ? next : best));
}

/** One problem per field: a value that fails two checks (format, then calendar) needs one message. */
function dedupe(problems: Problem[]): Problem[] {
  const seen = new Set<string>();
  return problems.filter((p) => {
    const key = p.code.endsWith('/unknown-key') ? `${p.field}:unknown` : p.field;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

export function formatFieldPath(path: FieldPath): string {
  return path.reduce<string>((out, segment) => (typeof segment === 'number' ? `${out}[${segment}]` : out ? `${out}.${segment}` : segment), '');
}

export function valueAt(value: unknown, path: FieldPath): unknown {
  let current: unknown = value;
  for (const segment of path) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<string | number, unknown>)[segment];
  }
  return current;
}

/** The keys that the schema allows at `path`, choosing union branches by the data's constant fields (e.g. `kind`). */
export function knownKeysAt(schema: JsonSchemaNode, data: unknown, path: FieldPath): string[] {
  const branchesFor = (node: JsonSchemaNode, value: unknown) => unionBranches(resolveRef(schema, node), value, schema);
  let nodes: JsonSchemaNode[] = [schema];
  let current: unknown = data;
  for (const segment of path) {
    nodes = nodes.flatMap((n) => branchesFor(n, current));
    const next: JsonSchemaNode[] = [];
    for (const node of nodes) {
      if (typeof segment === 'number' && node.items) next.push(resolveRef(schema, node.items));
      if (typeof segment === 'string' && node.properties?.[segment]) next.push(resolveRef(schema, node.properties[segment]!));
    }
    nodes = next;
    current = current !== null && typeof current === 'object' ? (current as Record<string | number, unknown>)[segment] : undefined;
  }
  const keys = new Set<string>();
  for (const node of nodes.flatMap((n) => branchesFor(n, current))) {
    for (const key of Object.keys(node.properties ?? {})) keys.add(key);
  }
  return [...keys];
}

/** Follows a local `#/$defs/...` reference (zod writes reused schemas there). */
function resolveRef(root: JsonSchemaNode, node: JsonSchemaNode): JsonSchemaNode {
  const ref = node.$ref;
  if (!ref?.startsWith('#/$defs/')) return node;
  return root.$defs?.[ref.slice('#/$defs/'.length)] ?? node;
}

function unionBranches(node: JsonSchemaNode, data: unknown, root: JsonSchemaNode): JsonSchemaNode[] {
  const options = node.anyOf ?? node.oneOf;
  if (!options) return [node];
  const all = options.flatMap((o) => unionBranches(resolveRef(root, o), data, root));
  const record = data !== null && typeof data === 'object' && !Array.isArray(data) ? (data as Record<string, unknown>) : undefined;
  const matching = all.filter((option) => {
    if (Array.isArray(data)) return option.items !== undefined;
    if (!record) return true;
    return Object.entries(option.properties ?? {}).every(([key, prop]) => prop.const === undefined || record[key] === prop.const);
  });
  return matching.length ? matching : all;
}
