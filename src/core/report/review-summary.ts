import type { ChecklistItem } from '../review/build-review.js';
import { formatCount } from './numbers.js';

/** A plan's checklist as people read it: how many items hold ("9 of 11 hold") and which do not. */
export function checklistSummary(items: readonly ChecklistItem[]): { count: string; failing: string[] } {
  const held = items.filter((i) => i.done).length;
  return { count: `${formatCount(held)} of ${formatCount(items.length)} ${held === 1 ? 'holds' : 'hold'}`, failing: items.filter((i) => !i.done).map((i) => i.label) };
}
