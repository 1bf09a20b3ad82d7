import type { RegistryEntry } from '../registry/schema.js';
import type { Check, ReviewContext } from '../review/context.js';
import type { Finding } from '../review/finding.js';
import type { FlagTouch } from '../scan/flag-touches.js';
import { daysBetween } from '../calendar.js';
import { hasOutcome, hasStarted, ownersOf } from './test-lifecycle.js';

type Raw = Omit<Finding, 'severity'>;

/** Flag reads the change removes (calls, not mere mentions), first place per key. */
function removedReads(touches: readonly FlagTouch[]): Map<string, FlagTouch> {
  const removed = new Map<string, FlagTouch>();
  for (const t of touches) if (t.side === 'removed' && (t.via === 'call' || t.via === 'constant') && !removed.has(t.key)) removed.set(t.key, t);
  return removed;
}

/** Still read somewhere in the product code at head: a quoted key outside tests, documents and comments. */
const stillRead = (context: ReviewContext, key: string) => {
  const hits = context.flagsAtHead.get(key);
  return hits?.firstCall !== undefined || hits?.firstQuoted !== undefined;
};

function finding(before: RegistryEntry, after: RegistryEntry, keys: string[], where: FlagTouch, today: string): Raw {
  const flags = keys.map((k) => `\`${k}\``).join(', ');
  const end = after.window.end;
  // A removed read: its line is the base commit's.
  const base = { plan: after.id, file: where.file, line: where.line, side: 'base' as const, dependents: [after.id] };
  if (end !== undefined && end < today) {
    return {
      code: 'outcome-missing',
      message: `This change removes the last read of ${flags}; ${after.id} (${ownersOf(after)}) passed its planned end on ${end}, but its plan records no outcome.`,
      fix: `Record the outcome in ${after.file}: state: concluded and outcome: { date, reason } with the decision in one line.`,
      ...base,
    };
  }
  const left = end !== undefined ? `its planned end is ${end}, ${daysBetween(today, end)} day${daysBetween(today, end) === 1 ? '' : 's'} away` : 'it has no planned end';
  return {
    code: 'test-ended-early',
    message: `This change removes the last read of ${flags}, which ${before.state === 'live' ? 'the running' : 'the started'} test ${after.id} (${ownersOf(after)}) randomizes; ${left}. Hard-coding one arm ends the test early, and a result read before its planned end overstates the effect.`,
    fix: `Keep the flag read until the planned end, or end the test on purpose: set state: concluded with an outcome (date and a one-line reason) in ${after.file}.`,
    ...base,
  };
}

/** A change that removes the last read of a started test's flag ends that test; it has to say so. */
export const endedEarly: Check = (context) => {
  const removed = removedReads(context.touches);
  if (removed.size === 0) return [];
  const head = new Map(context.registry.entries.map((e) => [e.id, e]));
  return context.baseEntries
    .filter((before) => hasStarted(before, context.today))
    .flatMap((before) => {
      const gone = before.flags.filter((k) => removed.has(k) && !stillRead(context, k));
      const after = head.get(before.id) ?? before;
      if (gone.length === 0 || hasOutcome(after)) return [];
      const raised = finding(before, after, gone, removed.get(gone[0]!)!, context.today);
      // Past its end with no totals either: readout-missing says both, once.
      const linked = context.linked.find((l) => l.loaded.plan.id === after.id);
      if (raised.code === 'outcome-missing' && linked?.ending && !linked.readout) return [];
      return [raised];
    });
};
