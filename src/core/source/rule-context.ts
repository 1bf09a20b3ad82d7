import { describeValue, expectedText, type Problem, type ProblemSeverity } from './problem.js';
import { formatFieldPath, valueAt } from './check-written.js';
import type { FieldPath, YamlSource } from './yaml-source.js';

/** What a cross-field rule needs: the value it checks and a way to report at a written field. */
export interface RuleContext<T> {
  value: T;
  report(problem: { severity: ProblemSeverity; code: string; path: FieldPath; message: string; expected?: string; showFound?: boolean; atKey?: boolean }): void;
}

export type Rule<T> = (context: RuleContext<T>) => void;

/** Runs each rule in order and returns what they reported, located in the source file. */
export function runRules<T>(value: T, source: YamlSource, rules: readonly Rule<T>[]): Problem[] {
  const problems: Problem[] = [];
  const context: RuleContext<T> = {
    value,
    report({ severity, code, path, message, expected, showFound, atKey }) {
      const found = showFound ? describeValue(valueAt(source.value, path)) : undefined;
      problems.push({
        severity,
        code,
        // A wrong key (an arm or metric name) is pointed at where the key is written, not at its value.
        ...(atKey && path.length ? source.locateKey(path.slice(0, -1), String(path[path.length - 1])) : source.locate(path)),
        field: formatFieldPath(path),
        message,
        ...(expected ? { expected: expectedText(expected) } : {}),
        ...(found ? { found } : {}),
      });
    },
  };
  for (const rule of rules) rule(context);
  return problems;
}

