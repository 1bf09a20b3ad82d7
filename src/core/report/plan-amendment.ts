import type { Finding } from '../review/finding.js';
import { codeSpan, safeCell } from './markdown-safe.js';

/**
 * The before/after table of a started test's plan change, under its finding's list item (indented so it
 * stays inside the item), so reviewers judge the change itself rather than a summary of it.
 */
export function planChangeTable(finding: Finding): string {
  if (!finding.changes?.length) return '';
  const rows = finding.changes.map((c) => `  | ${codeSpan(c.field)} | ${safeCell(c.before)} | ${safeCell(c.after)} |`);
  return ['', '', '  | field | at the base commit | in this change |', '  | --- | --- | --- |', ...rows].join('\n');
}

/** The same table for a terminal: one line per field. */
export function planChangeLines(finding: Finding, clean: (text: string) => string): string[] {
  return (finding.changes ?? []).map((c) => `    ${c.field}: ${clean(c.before)} -> ${clean(c.after)}`);
}
