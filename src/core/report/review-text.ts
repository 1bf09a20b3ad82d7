import type { Review } from '../review/build-review.js';
import type { Severity } from '../review/finding.js';
import { planChangeLines } from './plan-amendment.js';
import { terminalSafe, terminalStyle } from './terminal-style.js';

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
  }[review.verdict];
  const n = (count: number, noun: string) => `${count} ${noun}${count === 1 ? '' : 's'}`;
  out.push(`${style.bold('Plumbline')}: ${verdict} (${review.counts.block} blocking, ${n(review.counts.warn, 'warning')}, ${n(review.counts.note, 'note')}) for ${review.base.slice(0, 7)}...${review.head.slice(0, 7)}`);
  if (review.verdict === 'nothing-to-check') {
    out.push('This change touches no feature flag and no plan, and removes no event a running test depends on.');
    return out.join('\n');
  }
  for (const f of review.findings) {
    const at = f.file ? `${f.file}${f.line ? `:${f.line}` : ''}: ` : '';
    out.push(`${at}${paint(f.severity, LABEL[f.severity])} ${f.code}${f.plan ? ` [${f.plan}]` : ''}: ${terminalSafe(f.message)}`);
    out.push(`    fix: ${terminalSafe(f.fix)}`, ...planChangeLines(f, terminalSafe));
  }
  for (const plan of review.plans) {
    out.push('', `${style.bold(`Plan ${plan.id}`)} (${plan.state}, ${terminalSafe(plan.owners.join(', '))}) ${plan.file}:${plan.line}`);
    for (const item of plan.checklist) out.push(`  [${item.done ? style.green('x') : style.red(' ')}] ${item.label}`);
    const primary = plan.sizing.metrics[0];
    if (primary?.result.ok && primary.result.value.headline) {
      const h = primary.result.value.headline;
      const end = primary.result.value.atPlannedEnd;
      out.push(
        `  sizing: ${h.totalUnits.toLocaleString('en-US')} units${h.duration ? `, ${h.duration.days} days (${h.duration.weeks} weeks)` : ''}${end?.power !== undefined ? `, ${(end.power * 100).toFixed(1)}% power by the planned end` : ''}; details: plumbline size ${plan.id}`,
      );
    }
    const missing = plan.events.filter((e) => !e.location).map((e) => e.event);
    out.push(`  events: ${plan.events.length - missing.length} of ${plan.events.length} logged${missing.length ? ` (missing: ${terminalSafe(missing.join(', '))})` : ''}`);
  }
  return out.join('\n');
}
