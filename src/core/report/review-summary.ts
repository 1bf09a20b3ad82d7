import type { ChecklistItem, Review } from '../review/build-review.js';
import type { Severity } from '../review/finding.js';
import { countOf, formatCount } from './numbers.js';

/** A plan's checklist as people read it: how many items hold ("9 of 11 hold") and which do not. */
export function checklistSummary(items: readonly ChecklistItem[]): { count: string; failing: string[] } {
  const held = items.filter((i) => i.done).length;
  return { count: `${formatCount(held)} of ${formatCount(items.length)} ${held === 1 ? 'holds' : 'hold'}`, failing: items.filter((i) => !i.done).map((i) => i.label) };
}

const NOUN: Record<Severity, [string, string]> = { block: ['blocking finding', 'blocking findings'], warn: ['warning', 'warnings'], note: ['note', 'notes'] };

/**
 * The review's counts as text and Markdown both say them: the findings this change introduces by
 * severity ("2 blocking findings, 6 warnings"; empty when it introduces none), and the findings
 * that already held before it ("4 findings, 1 of them blocking"; empty when none did). The numbers
 * are the JSON report's `counts`; known blocking ones are named because they still block.
 */
export function countsSummary(review: Pick<Review, 'counts' | 'findings'>): { introduced: string; known: string } {
  const { counts } = review;
  const introduced = (['block', 'warn', 'note'] as const)
    .filter((s) => counts[s] > 0)
    .map((s) => countOf(counts[s], ...NOUN[s]))
    .join(', ');
  const knownBlocking = review.findings.filter((f) => f.origin === 'known' && f.severity === 'block').length;
  const known = !counts.known
    ? ''
    : knownBlocking === counts.known
      ? countOf(knownBlocking, ...NOUN.block)
      : `${countOf(counts.known, 'finding')}${knownBlocking ? `, ${formatCount(knownBlocking)} of them blocking` : ''}`;
  return { introduced, known };
}

/** Said beside a location read at the base commit (a removed line, a deleted plan): the same line at head is something else. */
export const AT_BASE = 'at the base';
