import { changedFields, decisiveFields, type FieldChange } from './compare.js';
import { loadPlan } from './load.js';
import type { Amendment, Plan } from './schema.js';

/** A file as it was at a commit, or why it cannot be had (read by an adapter, passed in). */
export type TextAtCommit =
  | { found: true; text: string; /** The full commit id. */ commit: string }
  | { found: false; reason: 'no-repository' | 'no-commit' | 'no-file' | 'no-history'; commit?: string };

/**
 * The rule a readout applies is the one registered when the test launched: the plan as it was at the
 * totals file's `plan-commit`. Today's plan may differ; a difference that decides the outcome counts
 * only when the plan records it under `amendments:` (appended since launch, earlier entries intact).
 * Otherwise the readout applies the launch rule and says the rule was changed after launch.
 */
export type LaunchRule =
  | { status: 'same'; plan: Plan; commit: string }
  | { status: 'amended'; plan: Plan; commit: string; changes: FieldChange[]; amendments: Amendment[] }
  | { status: 'changed'; plan: Plan; commit: string; changes: FieldChange[] }
  | { status: 'unavailable'; plan: Plan; commit: string; why: string };

/** What of a plan decides its readout: decisiveFields, plus the planned end (early reads) and variance reduction. */
export function ruleFields(plan: Plan): Map<string, unknown> {
  const fields = decisiveFields(plan, false);
  fields.set('window.end', plan.window.end);
  fields.set('design.pre-period-correlation', plan.design.prePeriodCorrelation);
  return fields;
}

const WHY: Record<Exclude<TextAtCommit, { found: true }>['reason'], (commit: string, file: string) => string> = {
  'no-repository': () => 'this folder is not a git repository',
  'no-commit': (commit) => `the commit ${commit} is not in this repository (a shallow clone, or a mistyped plan-commit)`,
  'no-file': (commit, file) => `${file} did not exist at ${commit}`,
  'no-history': () => 'no git history is available here',
};

/** Today's plan against the plan file's text at `commit` (the totals file's plan-commit). */
export function launchRule(today: Plan, file: string, commit: string, atLaunch: TextAtCommit): LaunchRule {
  if (!atLaunch.found) return { status: 'unavailable', plan: today, commit, why: WHY[atLaunch.reason](commit, file) };
  const loaded = loadPlan(atLaunch.text, file);
  if (!loaded.ok) return { status: 'unavailable', plan: today, commit, why: `${file} at ${commit} does not load as a plan (${loaded.errors[0]?.field ?? 'the file'}: ${loaded.errors[0]?.message ?? 'invalid'})` };
  const then = loaded.loaded.plan;
  if (then.id !== today.id) return { status: 'unavailable', plan: today, commit, why: `${file} held the plan ${then.id} at ${commit}` };
  const changes = changedFields(ruleFields(then), ruleFields(today));
  if (changes.length === 0) return { status: 'same', plan: today, commit };
  const intact = then.amendments.every((a, i) => JSON.stringify(a) === JSON.stringify(today.amendments[i]));
  const added = intact ? today.amendments.slice(then.amendments.length) : [];
  if (added.length) return { status: 'amended', plan: today, commit, changes, amendments: added };
  // The launch plan's rule, with today's record of what happened since (the outcome block).
  return { status: 'changed', plan: { ...then, ...(today.outcome ? { outcome: today.outcome } : {}) }, commit, changes };
}
