import { changedFields, decisiveEntryFields, decisiveFields, showValue, writtenPathOf, type FieldChange } from '../plan/compare.js';
import { lineOfKey } from '../plan/load.js';
import type { Amendment } from '../plan/schema.js';
import type { RegistryEntry } from '../registry/schema.js';
import type { Check, ReviewContext } from '../review/context.js';
import type { FieldPath } from '../source/yaml-source.js';
import type { Finding } from '../review/finding.js';
import { countOf, formatCount } from '../report/numbers.js';
import { collectingSince, hasOutcome, hasStarted, ownersOf } from './test-lifecycle.js';

type Raw = Omit<Finding, 'severity'>;

/** Amendments are append-only: the head list must start with the base list. What the change appends, or why it cannot count. */
function appendedAmendments(before: readonly Amendment[], after: readonly Amendment[]): { added: Amendment[]; rewritten: boolean } {
  const rewritten = after.length < before.length || before.some((a, i) => JSON.stringify(a) !== JSON.stringify(after[i]));
  return { added: rewritten ? [] : after.slice(before.length), rewritten };
}

function decisiveChanges(before: RegistryEntry, after: RegistryEntry, today: string): FieldChange[] {
  const baselineFrozen = collectingSince(before, today);
  if (before.plan && after.plan) return changedFields(decisiveFields(before.plan, baselineFrozen), decisiveFields(after.plan, baselineFrozen));
  return changedFields(decisiveEntryFields(before), decisiveEntryFields(after));
}

const startedOn = (entry: RegistryEntry) => (entry.window.start ? `started on ${entry.window.start}` : `is ${entry.state}`);
const listChanges = (changes: readonly FieldChange[]) => changes.map((c) => `${c.field} (${c.before} → ${c.after})`).join('; ');

/** How a change moves the planned end of a started test, if it matters. */
function endMove(before: RegistryEntry, after: RegistryEntry): FieldChange | undefined {
  const was = before.window.end;
  const now = after.window.end;
  if (was === now || was === undefined) return undefined;
  const later = now === undefined || now > was;
  if (!later && (after.plan?.design.interimLooks ?? 0) > 0) return undefined;
  return { field: 'window.end', before: showValue(was), after: showValue(now) };
}

/**
 * Where a finding about changed fields points at head: the first changed key in the file (a removed key:
 * its nearest written parent), so the annotation lands on the line to put back, not on the plan's id.
 */
function atChangedKey(entry: RegistryEntry, fields: readonly FieldPath[]): { plan: string; file: string; line: number } {
  const { keyLines } = entry;
  const line = keyLines && fields.length ? Math.min(...fields.map((path) => lineOfKey({ line: entry.line, keyLines }, path))) : entry.line;
  return { plan: entry.id, file: entry.file, line };
}

function reviewOne(before: RegistryEntry, after: RegistryEntry, today: string): Raw[] {
  const guardrails = after.plan?.metrics.guardrails.map((g) => g.name) ?? [];
  const at = (changes: readonly FieldChange[]) => atChangedKey(after, changes.map((c) => writtenPathOf(c.field, guardrails)));
  const { added, rewritten } = appendedAmendments(before.amendments, after.amendments);
  const changes = decisiveChanges(before, after, today);
  if (rewritten) changes.push({ field: 'amendments', before: `${before.amendments.length} recorded`, after: 'earlier entries edited or removed' });
  const end = endMove(before, after);
  const amendment = added.at(-1);
  if (amendment && !rewritten && (changes.length || end)) {
    const all = end ? [...changes, end] : changes;
    return [
      {
        code: 'plan-amended',
        message: `${after.id} (${ownersOf(after)}) ${startedOn(before)}; this change amends what decides its result (${all.map((c) => c.field).join(', ')}), recorded on ${amendment.date}: “${amendment.changed}” because “${amendment.reason}”.`,
        fix: 'Judge the amendment against the table: a result must not be chosen after seeing data. The readout must say the plan changed on this date.',
        changes: all,
        amendment,
        ...atChangedKey(after, [['amendments', after.amendments.length - 1]]),
      },
    ];
  }
  const findings: Raw[] = [];
  if (changes.length) {
    findings.push({
      code: 'plan-frozen',
      message: `${after.id} (${ownersOf(after)}) ${startedOn(before)}, and this change alters what decides its result: ${listChanges(changes)}. Changing these after the start lets the result be chosen after the fact.`,
      fix: `Put these fields back as they were. If a change is truly needed, append an entry under amendments: with date, changed and reason (reviewers then see a before/after table), or end ${after.id} and plan a new test.`,
      changes,
      ...at(changes),
    });
  }
  if (end) {
    const later = end.after === showValue(undefined) || end.after > end.before;
    findings.push({
      code: 'plan-end-moved',
      message: later
        ? `${after.id} ${startedOn(before)}; this change moves its planned end from ${end.before} to ${end.after}. A later end changes the power the test was sized for and invites stopping when the numbers look good.`
        : `${after.id} ${startedOn(before)}; this change brings its planned end forward from ${end.before} to ${end.after}, and the plan has no interim looks, so the test ends with less power than planned.`,
      fix: later
        ? 'Keep the planned end, or record the reason under amendments: and read the result only at the new end.'
        : 'Keep the planned end, plan interim looks with a stopping boundary, or record the reason under amendments:.',
      changes: [end],
      ...at([end]),
    });
  }
  return findings;
}

function deleted(before: RegistryEntry): Raw {
  return {
    code: 'plan-deleted',
    message: `This change deletes ${before.id} (${ownersOf(before)}) from ${before.file}, a test that ${startedOn(before)} and has no recorded outcome; its pre-registered plan is what its result will be judged against.`,
    fix: `Keep the plan: set state: concluded with an outcome (date and a one-line reason) when the test is over.`,
    plan: before.id,
    file: before.file,
    line: before.line,
    side: 'base',
  };
}

/**
 * When the base commit cannot be read, a started test's plan cannot be compared with what it was; silence
 * would read as "nothing changed", so the review names the started tests whose plan or registry file the
 * change edits, and the deleted files that may have held one, and says why.
 */
function baseUnread(context: ReviewContext, why: string): Raw[] {
  const edited = new Set(context.changedPaths);
  const deleted = context.changedCode.filter((c) => c.head === undefined && !edited.has(c.path) && /\.ya?ml$/i.test(c.basePath)).map((c) => c.basePath);
  const started = context.registry.entries.filter((e) => hasStarted(e, context.today) && edited.has(e.file));
  if (started.length === 0 && deleted.length === 0) return [];
  // A large registry: name a few, count the rest.
  const named = started.slice(0, 5).map((e) => e.id).join(', ');
  const ids = started.length > 5 ? `${named} and ${formatCount(started.length - 5)} more` : named;
  return [
    {
      code: 'base-unread',
      message: [
        started.length ? `The plans of ${countOf(started.length, 'started test')} this change edits (${ids}) were not compared with the base commit, so changes to what decides their results (plan-frozen, plan-amended, plan-end-moved) could not be checked.` : '',
        deleted.length ? `This change deletes ${countOf(deleted.length, 'YAML file')} (${deleted.slice(0, 5).join(', ')}${deleted.length > 5 ? ', …' : ''}); whether one held a started test's plan (plan-deleted) could not be checked.` : '',
        `The base commit was not read because ${why}.`,
      ].filter(Boolean).join(' '),
      fix: 'Check out the repository with its history (actions/checkout with fetch-depth: 0) so the review reads the base commit with git.',
    },
  ];
}

/** Started tests at the base commit, each compared with the same id at head. */
export const frozenPlans: Check = (context: ReviewContext) => {
  if (context.baseUnreadable) return baseUnread(context, context.baseUnreadable);
  const head = new Map(context.registry.entries.map((e) => [e.id, e]));
  const unloadable = new Set(context.invalidPlanFiles.map((f) => f.file));
  return context.baseEntries
    .filter((before) => hasStarted(before, context.today))
    .flatMap((before) => {
      const after = head.get(before.id);
      if (after) return reviewOne(before, after, context.today);
      // A plan that no longer loads is reported as invalid; that blocks already.
      if (unloadable.has(before.file) || hasOutcome(before)) return [];
      return [deleted(before)];
    });
};
