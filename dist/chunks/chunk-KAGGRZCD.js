#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/source/problem.ts
function expectedText(phrase) {
  return phrase.replace(/^expected\s+/i, "");
}
function formatProblem(problem) {
  const where = `${problem.file}:${problem.line}:${problem.column}`;
  const field = problem.field ? `${problem.field}: ` : "";
  const detail = [
    problem.expected ? `expected ${problem.expected}` : "",
    problem.found ? `found ${problem.found}` : ""
  ].filter(Boolean).join("; ");
  return `${where}: ${problem.severity}: ${field}${problem.message}${detail ? ` (${detail})` : ""}`;
}
function sortProblems(problems) {
  const byUnits = (a, b) => a < b ? -1 : a > b ? 1 : 0;
  return [...problems].sort((a, b) => byUnits(a.file, b.file) || a.line - b.line || a.column - b.column || byUnits(a.code, b.code));
}
function describeValue(value) {
  if (value === void 0) return "nothing";
  if (value === null) return "an empty value";
  if (typeof value === "string") {
    const shown = value.length > 60 ? `${value.slice(0, 57)}...` : value;
    return `the text ${JSON.stringify(shown)}`;
  }
  if (typeof value === "number") return Number.isFinite(value) ? `the number ${value}` : `${String(value)}, which is not a finite number`;
  if (typeof value === "boolean") return `${value}`;
  if (Array.isArray(value)) return value.length === 1 ? "a list of 1 item" : `a list of ${value.length} items`;
  if (typeof value === "object") return "a mapping of keys";
  return typeof value;
}

export {
  expectedText,
  formatProblem,
  sortProblems,
  describeValue
};
