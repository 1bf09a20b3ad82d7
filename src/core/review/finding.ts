import type { FieldChange } from '../plan/compare.js';
import type { Amendment } from '../plan/schema.js';

/** One thing the review has to say, with where and how to fix it. */
export type Severity = 'block' | 'warn' | 'note';

export interface Finding {
  /** Stable code, e.g. `decisions-missing`; settings can change its severity. */
  code: string;
  severity: Severity;
  message: string;
  /** What to do about it. */
  fix: string;
  /** The plan it concerns, by id. */
  plan?: string;
  file?: string;
  line?: number;
  /**
   * Which commit `file` and `line` are read at: `base` for a place the change removes (a deleted line, a
   * deleted plan), where the same line number at head is something else; `head` (the default) otherwise.
   */
  side?: 'base' | 'head';
  /** Frozen-plan findings: what changed in a started plan, field by field (before and after as written). */
  changes?: FieldChange[];
  /** Frozen-plan findings: the amendment the change adds, when it adds one. */
  amendment?: Amendment;
  /** event-removed and test-ended-early: the ids of the running tests that depend on what is removed. */
  dependents?: string[];
}

/**
 * Every finding code with its default severity and what it means. The settings file may raise or
 * lower any of them, except that a missing decision rule always blocks.
 */
export const FINDING_CODES = {
  'flag-without-plan': { severity: 'warn', about: 'a changed feature flag has no plan (and is not exempt)' },
  'plan-invalid': { severity: 'block', about: 'a plan the change touches cannot be loaded' },
  'file-warning': { severity: 'warn', about: 'a plan the change is about, or a plan or registry file it edits, loads with a warning (a renamed key, a default taken), as validate reports it' },
  'decisions-missing': { severity: 'block', about: 'a decision rule (win, flat, loss, guardrail breach) is not written' },
  'reason-missing': { severity: 'warn', about: 'the hypothesis does not say why the change should work' },
  'guardrails-missing': { severity: 'warn', about: 'no guardrail metric' },
  'end-missing': { severity: 'warn', about: 'no planned end date' },
  'window-short': { severity: 'warn', about: 'the planned window is shorter than 7 days' },
  'window-partial-week': { severity: 'note', about: 'the planned window is not a whole number of weeks' },
  'review-missing': { severity: 'block', about: 'a sensitive area has no named review' },
  'bundle-unexplained': { severity: 'warn', about: 'several flags in one plan without a rationale' },
  'population-undeclared': { severity: 'warn', about: 'platforms or locales are not declared' },
  'readiness-missing': { severity: 'warn', about: 'the change is not declared ready on a platform or locale of its population' },
  underpowered: { severity: 'warn', about: 'the planned window gives less than the planned power' },
  'sizing-incomplete': { severity: 'note', about: 'the plan lacks the figures sizing needs' },
  'sizing-impossible': { severity: 'warn', about: 'the plan’s figures cannot be sized' },
  'exposure-diluted': { severity: 'note', about: 'exposure is logged before the change is reached; says whether the planned window still suffices (when it does not, underpowered warns)' },
  'not-feasible': { severity: 'warn', about: 'the test needs more than the longest sensible window at this traffic' },
  'returning-units': { severity: 'note', about: 'the population returns, but traffic is given only as units a day' },
  'groups-short': { severity: 'warn', about: 'the design needs more groups than exist' },
  'ratio-denominator': { severity: 'note', about: 'a ratio metric whose denominator may move lacks its parts as secondary metrics' },
  'atypical-period': { severity: 'note', about: 'the planned window overlaps a holiday, sale or other atypical period' },
  'novelty-window': { severity: 'note', about: 'a change for returning users planned for less than two weeks' },
  spillover: { severity: 'warn', about: 'people randomized one by one on a surface they share' },
  'analysis-unit-differs': { severity: 'note', about: 'metrics are averaged over another unit than the one randomized' },
  collision: { severity: 'warn', about: 'the test overlaps a running test on the same surface; says what isolating them would cost' },
  'known-overlap': { severity: 'note', about: 'the test overlaps a running test it declares' },
  'event-missing': { severity: 'warn', about: 'an event the plan names is not logged in the code' },
  'event-removed': { severity: 'block', about: 'the change removes an event a running test depends on' },
  'severity-unknown-code': { severity: 'warn', about: 'the settings name a finding code that does not exist' },
  'outcome-mismatch': { severity: 'block', about: 'a recorded outcome differs from what the registered rule gives on its totals, or the change ships (keeps, removing the flag) an arm the rule does not name, without an override' },
  'outcome-override': { severity: 'warn', about: 'a recorded outcome departs from the registered rule with an override and a reason to judge' },
  'readout-missing': { severity: 'warn', about: 'the change removes the last read of a concluded or overdue test’s flag, and the test has neither arm totals nor a recorded outcome' },
  'rule-changed': { severity: 'block', about: 'a readout’s plan differs from the plan at its plan-commit in what decides the outcome, without an amendment; the launch rule is applied' },
  'launch-plan-unavailable': { severity: 'warn', about: 'the plan at a readout’s plan-commit cannot be read (commit not in the repository, no history), so the readout uses today’s plan' },
  'effect-implausible': { severity: 'warn', about: 'once five or more tests recorded outcomes on the primary metric: the planned minimum detectable effect is above nine in ten of the effects measured on it before' },
  'plan-frozen': { severity: 'block', about: 'a started test’s plan changes what decides its result without an amendment' },
  'plan-amended': { severity: 'note', about: 'a started test’s plan changes what decides its result and records why (shown before and after)' },
  'plan-deleted': { severity: 'block', about: 'the change deletes the plan of a started test that has no outcome' },
  'base-unread': { severity: 'warn', about: 'the base commit could not be read (the Action’s files-API mode), so the started tests’ plans the change edits or deletes were not compared with it' },
  'plan-end-moved': { severity: 'warn', about: 'a started test’s planned end moves later, or earlier without interim looks' },
  'test-ended-early': { severity: 'block', about: 'the change removes the last read of a started test’s flag before its planned end, with no outcome recorded' },
  'outcome-missing': { severity: 'note', about: 'the change removes the flag of a test past its planned end whose outcome is not recorded' },
  'exposure-one-arm': { severity: 'warn', about: 'the exposure event is logged inside a branch on the flag or after an early return on it, so not in every arm' },
  'treatment-changed': { severity: 'warn', about: 'code around a started test’s flag read, or its flag definition, changes mid-test' },
  'refs-swapped': { severity: 'warn', about: 'head is an ancestor of base and differs from it: the refs look swapped (or the change is already in the base), so the change from base to head is empty' },
  'bug-fix-unmeasured': { severity: 'note', about: 'a bug fix changes product code without a flag or a check test' },
} as const satisfies Record<string, { severity: Severity; about: string }>;

export type FindingCode = keyof typeof FINDING_CODES;

/**
 * Codes about what the change itself does (a plan rewritten, code edited around a flag read, a read
 * or a logging call removed), or read from the code at head only: the base context cannot have
 * them, so they always count as introduced by the change.
 */
export const CHANGE_BOUND: ReadonlySet<string> = new Set([
  'plan-frozen',
  'plan-amended',
  'plan-deleted',
  'plan-end-moved',
  'test-ended-early',
  'outcome-missing',
  'readout-missing',
  'treatment-changed',
  'exposure-one-arm',
  'event-removed',
]);

/** Codes whose severity the settings cannot lower. */
export const ALWAYS_BLOCKS: ReadonlySet<string> = new Set(['decisions-missing']);
