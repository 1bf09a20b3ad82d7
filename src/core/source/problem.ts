/**
 * A problem found in a user's file: data, never an exception. Every loader in the core
 * returns these so that the entry points can print them, count them and decide the exit code.
 */
export type ProblemSeverity = 'error' | 'warning';

export interface SourceLocation {
  /** Path of the file as the user would type it, relative to the repository root. */
  file: string;
  /** 1-based line. */
  line: number;
  /** 1-based column. */
  column: number;
}

export interface Problem extends SourceLocation {
  /** `error`: the file cannot be used. `warning`: it can, but something is off. */
  severity: ProblemSeverity;
  /** Stable identifier, e.g. `plan/unknown-key`; safe to match on in scripts. */
  code: string;
  /** Dotted field path inside the file, e.g. `design.alpha`; empty for the whole file. */
  field: string;
  /** What is wrong, in a sentence. */
  message: string;
  /** What a valid value looks like, with an example where one helps. */
  expected?: string;
  /** What the file actually holds at that field, described for a person. */
  found?: string;
}

/**
 * The `expected` text follows the word "expected" when printed. A field's phrase may itself begin with
 * it ("expected new eligible units per day", the units one expects): drop that word, so it reads once.
 */
export function expectedText(phrase: string): string {
  return phrase.replace(/^expected\s+/i, '');
}

/** `file:line:column: severity: field: message (expected ...; found ...)`, the compiler-style line. */
export function formatProblem(problem: Problem): string {
  const where = `${problem.file}:${problem.line}:${problem.column}`;
  const field = problem.field ? `${problem.field}: ` : '';
  const detail = [
    problem.expected ? `expected ${problem.expected}` : '',
    problem.found ? `found ${problem.found}` : '',
  ]
    .filter(Boolean)
    .join('; ');
  return `${where}: ${problem.severity}: ${field}${problem.message}${detail ? ` (${detail})` : ''}`;
}

/** Stable order for reports: by file, then position, then code (code-unit order: the same in every locale, and no collator to load). */
export function sortProblems(problems: readonly Problem[]): Problem[] {
  const byUnits = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  return [...problems].sort((a, b) => byUnits(a.file, b.file) || a.line - b.line || a.column - b.column || byUnits(a.code, b.code));
}

/** Describes a parsed YAML value the way a person would say it, for the `found` part of a problem. */
export function describeValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'an empty value';
  if (typeof value === 'string') {
    const shown = value.length > 60 ? `${value.slice(0, 57)}...` : value;
    return `the text ${JSON.stringify(shown)}`;
  }
  if (typeof value === 'number') return Number.isFinite(value) ? `the number ${value}` : `${String(value)}, which is not a finite number`;
  if (typeof value === 'boolean') return `${value}`;
  if (Array.isArray(value)) return value.length === 1 ? 'a list of 1 item' : `a list of ${value.length} items`;
  if (typeof value === 'object') return 'a mapping of keys';
  return typeof value;
}
