import type { Review } from '../review/build-review.js';
import type { Severity } from '../review/finding.js';
import { formatCount } from './numbers.js';
import { AT_BASE, checklistSummary, countsSummary } from './review-summary.js';
import { lengthSummary } from './sizing.js';
import { planChangeLines } from './plan-amendment.js';
import { terminalSafe, terminalStyle } from './terminal-style.js';
import { overrideLines, ruleAppliedLine, ruleSourceLine, type ReadoutStyle } from './review-readout.js';

const LABEL: Record<Severity, string> = { block: 'BLOCK', warn: 'warn ', note: 'note ' };

/** The review for a terminal: one line per finding, then each plan's checklist. */
export function renderReviewText(review: Review, options: { color: boolean }): string {
  const style = terminalStyle(options.color);
  const paint = (s: Severity, text: string) => (s === 'block' ? style.red(text) : s === 'warn' ? style.yellow(text) : style.dim(text));
  const out: string[] = [];
  const verdict = {
    blocked: style.red('blocked'),
    warnings: style.yellow('passes, with warnings'),
    clear: style.green('all clear'),
    'nothing-to-check': style.green('nothing to check'),
    partial: style.yellow('partial review, nothing found in the files seen'),
  }[review.verdict];
  const { introduced, known } = countsSummary(review);
  const counts = introduced || known ? ` (this change: ${introduced || 'nothing new'}${known ? `; already known before it: ${known}` : ''})` : '';
  out.push(`${style.bold('Plumbline')}: ${verdict}${counts} for ${review.base.slice(0, 7)}...${review.head.slice(0, 7)}`);
  const readoutStyle: ReadoutStyle = { escape: terminalSafe, strong: style.bold, code: terminalSafe };
  out.push(...overrideLines(review.plans, readoutStyle));
  if (review.verdict === 'nothing-to-check') {
    out.push('This change touches no feature flag and no plan, and removes no event a running test depends on.');
    return out.join('\n');
  }
  for (const f of review.findings) {
    // A line of the base commit (a removed line, a deleted plan) is not that line of the working tree.
    const at = f.file ? `${terminalSafe(f.file)}${f.line ? `:${f.line}` : ''}${f.side === 'base' ? ` (${AT_BASE} ${review.base.slice(0, 7)})` : ''}: ` : '';
    out.push(`${at}${paint(f.severity, LABEL[f.severity])} ${f.code}${f.plan ? ` [${terminalSafe(f.plan)}]` : ''}${f.origin === 'known' ? style.dim(' (already known)') : ''}: ${terminalSafe(f.message)}`);
    out.push(`    fix: ${terminalSafe(f.fix)}`, ...planChangeLines(f, terminalSafe));
  }
  for (const plan of review.plans) {
    out.push('', `${style.bold(`Plan ${terminalSafe(plan.id)}`)} (${terminalSafe(plan.state)}, ${terminalSafe(plan.owners.join(', '))}) ${terminalSafe(plan.file)}:${plan.line}`);
    const checklist = checklistSummary(plan.checklist);
    if (plan.readout) out.push(`  ${ruleAppliedLine(plan.readout, readoutStyle)}`, `  ${ruleSourceLine(plan.readout, readoutStyle)}`);
    out.push(`  checklist: ${checklist.count}`);
    for (const label of checklist.failing) out.push(`  [${style.red(' ')}] ${label}`);
    const length = lengthSummary(plan.sizing);
    if (length) out.push(`  length: ${terminalSafe(length.length)}${length.power ? `; power: ${terminalSafe(length.power)}` : ''}; details: plumbline size ${terminalSafe(plan.id)}`);
    const missing = plan.events.filter((e) => !e.location).map((e) => e.event);
    out.push(`  events: ${formatCount(plan.events.length - missing.length)} of ${formatCount(plan.events.length)} logged${missing.length ? ` (missing: ${terminalSafe(missing.join(', '))})` : ''}`);
  }
  return out.join('\n');
}
