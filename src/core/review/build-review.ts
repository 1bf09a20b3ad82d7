import { CHECKS, PLAN_CHECKS } from '../checks/index.js';
import { bugFixNudge, type BugFixNudge } from '../checks/bug-fix.js';
import { collisionsOfLinked } from '../checks/collisions.js';
import { eventStatuses, type EventStatus } from '../checks/logging.js';
import { closestName } from '../source/closest-name.js';
import type { PlanSizing } from '../stats/plan-sizing.js';
import { armsToShip, type MetricRead, type Verdict as ReadoutVerdict } from '../readout/build-readout.js';
import type { OutcomeClass } from '../plan/outcome.js';
import type { RuleSource } from '../readout/launch-note.js';
import type { LinkReason, ReadoutSource, ReviewContext } from './context.js';
import type { UnseenFiles } from './coverage.js';
import { ALWAYS_BLOCKS, CHANGE_BOUND, FINDING_CODES, type Finding, type Severity } from './finding.js';

/** `partial`: nothing found, but some files of the change were never seen (see Review.partial). */
export type Verdict = 'blocked' | 'warnings' | 'clear' | 'nothing-to-check' | 'partial';

export interface ChecklistItem {
  label: string;
  done: boolean;
}

export interface PlanReview {
  id: string;
  title: string;
  file: string;
  line: number;
  state: string;
  owners: string[];
  reasons: LinkReason[];
  checklist: ChecklistItem[];
  sizing: PlanSizing;
  power: number;
  window: { start?: string; end?: string };
  events: EventStatus[];
  /** A plan that records an outcome with its totals: the rule applied to them, beside what was recorded. */
  readout?: PlanReadout;
  /** A recorded decision that departs from the registered rule: what reviewers must judge first. */
  override?: { class?: OutcomeClass; ship?: string[]; reason: string };
}

export interface PlanReadout {
  /** The totals file read. */
  file: string;
  /** The class the registered rule gives on the totals, and the arms it names. */
  verdict: ReadoutVerdict;
  arms: string[];
  /** The decision the plan registered for that class, as written. */
  decision?: string;
  /** The class the plan records. */
  recorded?: OutcomeClass;
  /** The primary metric's figures, as the readout computed them. */
  primary?: MetricRead;
  /** Where the totals came from: the recorded outcome, a file the change adds or edits, or the latest one (the change ends the test). */
  source: ReadoutSource;
  /** The change removes the last read of these flags: the arm its code keeps, or why that could not be told. */
  removes?: { flags: string[]; kept?: string; unknown?: string };
  /** The arms the rule says to ship: the winners of a win, else the control. */
  ships: string[];
  /** Which plan's rule was applied (launch, amended, or today's for want of history). */
  rule?: RuleSource;
}

export interface ReviewCollision {
  plan: string;
  other: string;
  owners: string[];
  otherSurface: string;
  overlapDays?: number;
  overlapWindow?: { start: string; end: string };
  platforms: string[] | 'all';
  locales: string[] | 'all';
  trafficShare: number;
  known: boolean;
}

/**
 * Whether a finding is this change's doing: `known` when the same finding (same code, plan and
 * message with its numbers masked) already held for the plan at the base commit; `introduced`
 * otherwise, and always for findings about the change itself (flags it touches, events it removes).
 */
export type FindingOrigin = 'introduced' | 'known';

/** A finding as reviewed: its origin, and for a located one the commit its line is read at (`side`, always set). */
export type ReviewFinding = Finding & { origin: FindingOrigin };

/**
 * How many findings: `block`, `warn` and `note` count the findings this change introduces, by
 * severity; `known` counts those that already held at the base commit. The verdict reads every
 * finding: a known blocking one still blocks.
 */
export interface ReviewCounts {
  block: number;
  warn: number;
  note: number;
  known: number;
}

/** The two ends of the change, and how the entry point named them when head turned out to be an ancestor of base. */
export interface ChangeEnds {
  base: string;
  head: string;
  /** Set when head is an ancestor of the commit named as base and differs from it: how each was named (e.g. `--base main`). */
  swapped?: { base: string; head: string };
}

/** The review of one change: what the core says, for the entry points to show. */
export interface Review {
  verdict: Verdict;
  counts: ReviewCounts;
  base: string;
  head: string;
  /** Blocking first, then warnings, then notes; within each, introduced before known. */
  findings: ReviewFinding[];
  plans: PlanReview[];
  flags: { key: string; file: string; line: number; side: 'added' | 'removed'; via: string; plans: string[]; exempt: boolean }[];
  collisions: ReviewCollision[];
  /** On a bug fix that ships without a flag: why a check test is worth it, and a plan to paste. */
  nudge?: BugFixNudge;
  /** Set when some files of the change were not seen, e.g. past GitHub's 3,000-file listing. */
  partial?: UnseenFiles;
}

/** Which findings un-tick which checklist item. */
const CHECKLIST: { label: string; codes: string[]; when?: (p: ReviewContext['linked'][number]) => boolean }[] = [
  { label: 'Decision rules written for a win, a flat result, a loss and a guardrail breach', codes: ['decisions-missing'] },
  { label: 'Hypothesis says why the change should work', codes: ['reason-missing'] },
  { label: 'One primary metric and at least one guardrail', codes: ['guardrails-missing'] },
  { label: 'Planned end, at least a week, in whole weeks', codes: ['end-missing', 'window-short', 'window-partial-week'] },
  { label: 'Enough power by the planned end', codes: ['underpowered', 'sizing-incomplete', 'sizing-impossible', 'not-feasible', 'groups-short', 'effect-implausible'] },
  { label: 'Exposure logged in every arm where the change is seen (the logging call read against the flag read, not only the plan’s reach)', codes: ['exposure-diluted', 'exposure-one-arm'] },
  { label: 'Randomization unit fits the surface', codes: ['spillover'] },
  { label: 'No collision with a running test', codes: ['collision'] },
  { label: 'Every event the plan names is logged in the code', codes: ['event-missing'] },
  { label: 'Population and readiness declared (platforms, locales)', codes: ['population-undeclared', 'readiness-missing'] },
  { label: 'Sensitive areas have their named review', codes: ['review-missing'], when: (p) => p.loaded.plan.sensitive.length > 0 },
  { label: 'Bundled flags are explained', codes: ['bundle-unexplained'], when: (p) => p.loaded.plan.flags.length > 1 },
];

function severityFor(code: string, overrides: Record<string, string>): Severity | 'off' {
  const fallback = (FINDING_CODES as Record<string, { severity: Severity }>)[code]?.severity ?? 'warn';
  if (ALWAYS_BLOCKS.has(code)) return 'block';
  const chosen = overrides[code];
  return chosen === 'block' || chosen === 'warn' || chosen === 'note' || chosen === 'off' ? chosen : fallback;
}

const ORDER: Record<Severity, number> = { block: 0, warn: 1, note: 2 };

/** The same finding at base and head has the same key; numbers (days, lines, shares) may move. */
export function findingKey(f: Pick<Finding, 'code' | 'plan' | 'message'>): string {
  return [f.code, f.plan ?? '', f.message.replace(/\d+(?:[.,]\d+)*/g, '#')].join('\u0000');
}

/** Findings about a plan that already held at base (the per-plan checks run on the base commit's plans). */
function knownAtBase(base: ReviewContext | undefined): Set<string> {
  if (!base) return new Set();
  return new Set(
    PLAN_CHECKS.flatMap((check) => check(base))
      .filter((f) => f.plan !== undefined && !CHANGE_BOUND.has(f.code))
      .map(findingKey),
  );
}

/** The readout part of a plan's section: its recorded outcome's totals, totals in the change, or the latest when the change ends the test. */
function planReadout(linked: ReviewContext['linked'][number]): Pick<PlanReview, 'readout' | 'override'> {
  const outcome = linked.loaded.plan.outcome;
  const read = linked.readout?.readout;
  const override = outcome?.override ? { override: outcome.override } : {};
  if (!read || !linked.readout) return override;
  const ending = linked.ending;
  return {
    readout: {
      file: linked.readout.file,
      source: linked.readout.source,
      verdict: read.verdict,
      arms: read.verdictArms,
      ships: armsToShip(read),
      ...(read.decision ? { decision: read.decision.text } : {}),
      ...(outcome?.class ? { recorded: outcome.class } : {}),
      ...(read.verdict !== 'not-read' ? { primary: read.primary } : {}),
      ...(ending ? { removes: { flags: ending.flags, ...('arm' in ending.kept ? { kept: ending.kept.arm } : { unknown: ending.kept.unknown }) } } : {}),
      ...(read.rule ? { rule: read.rule } : {}),
    },
    ...override,
  };
}

/** The counts every format shows: this change's findings by severity, and how many already held before it. */
export function countFindings(findings: readonly ReviewFinding[]): ReviewCounts {
  const counts: ReviewCounts = { block: 0, warn: 0, note: 0, known: 0 };
  for (const f of findings) {
    if (f.origin === 'known') counts.known++;
    else counts[f.severity]++;
  }
  return counts;
}

/**
 * Head is an ancestor of base: the change from base to head is empty, which would read as a pass.
 * Said as a finding, so every format and the JSON report carry it.
 */
function refsSwapped(named: { base: string; head: string }): Omit<Finding, 'severity'> {
  return {
    code: 'refs-swapped',
    message: `${named.head} is an ancestor of ${named.base}: the refs look swapped; the change from base to head is empty, so nothing was reviewed.`,
    fix: 'Name the commit the change starts from as base and the commit with the change as head; if the change is already merged into the base, there is nothing left to review.',
  };
}

/** Plans the description names come first: they are what the author says the change is about. */
function byMention(a: PlanReview, b: PlanReview): number {
  const named = (p: PlanReview) => (p.reasons.includes('named in the description') ? 0 : 1);
  return named(a) - named(b);
}

/**
 * Reviews a change. `base`, when given, is the same review context built from the base commit's
 * plans and registry; findings that already held there are marked `known`.
 */
export function buildReview(context: ReviewContext, change: ChangeEnds, base?: ReviewContext): Review {
  const raw = CHECKS.flatMap((check) => check(context));
  if (change.swapped) raw.push(refsSwapped(change.swapped));
  const codes = Object.keys(FINDING_CODES);
  for (const code of Object.keys(context.settings.severity)) {
    if (codes.includes(code)) continue;
    const suggestion = closestName(code, codes);
    raw.push({
      code: 'severity-unknown-code',
      message: `The settings set a severity for "${code}", which is not a finding code${suggestion ? `; did you mean "${suggestion}"?` : '.'}`,
      fix: `Use one of: ${codes.join(', ')}.`,
    });
  }
  const known = knownAtBase(base);
  const findings: ReviewFinding[] = [];
  for (const finding of raw) {
    const severity = severityFor(finding.code, context.settings.severity);
    const origin: FindingOrigin = finding.plan !== undefined && known.has(findingKey(finding)) ? 'known' : 'introduced';
    const side = finding.file !== undefined ? { side: finding.side ?? ('head' as const) } : {};
    if (severity !== 'off') findings.push({ ...finding, ...side, severity, origin });
  }
  const originOrder = (f: ReviewFinding) => (f.origin === 'introduced' ? 0 : 1);
  findings.sort((a, b) => ORDER[a.severity] - ORDER[b.severity] || originOrder(a) - originOrder(b));

  const counts = countFindings(findings);

  // Grouped once: collisions make findings grow with the square of the plans, so a scan per plan would too.
  const codesByPlan = new Map<string, Set<string>>();
  for (const f of findings) {
    if (f.plan === undefined) continue;
    const codes = codesByPlan.get(f.plan) ?? new Set<string>();
    codes.add(f.code);
    codesByPlan.set(f.plan, codes);
  }
  const plans: PlanReview[] = context.linked.map((linked) => {
    const { plan } = linked.loaded;
    const mine = codesByPlan.get(plan.id) ?? new Set<string>();
    return {
      id: plan.id,
      title: plan.title,
      file: linked.loaded.file,
      line: linked.loaded.line,
      state: plan.state,
      owners: plan.owners,
      reasons: linked.reasons,
      checklist: CHECKLIST.filter((item) => !item.when || item.when(linked)).map((item) => ({ label: item.label, done: !item.codes.some((c) => mine.has(c)) })),
      sizing: linked.sizing,
      power: plan.design.power,
      window: plan.window,
      events: eventStatuses(context, plan.id),
      ...planReadout(linked),
    };
  });
  plans.sort(byMention);

  const planned = new Map<string, string[]>();
  for (const e of context.registry.entries) for (const f of e.flags) planned.set(f, [...(planned.get(f) ?? []), e.id]);
  const exempt = new Set(context.settings.exemptFlags);
  const flags = context.touches.map((t) => ({ ...t, plans: planned.get(t.key) ?? [], exempt: exempt.has(t.key) }));

  const collisions: ReviewCollision[] = collisionsOfLinked(context).map(({ plan, collision: c }) => ({
    plan,
    other: c.other.id,
    owners: c.other.owners,
    otherSurface: c.other.surface.path,
    ...(c.overlapDays !== undefined ? { overlapDays: c.overlapDays } : {}),
    ...(c.overlapWindow ? { overlapWindow: c.overlapWindow } : {}),
    platforms: c.platforms,
    locales: c.locales,
    trafficShare: c.trafficShare,
    known: c.known,
  }));

  const nothing = context.touches.length === 0 && context.linked.length === 0 && context.invalidPlanFiles.length === 0 && findings.length === 0;
  const verdict: Verdict = nothing ? 'nothing-to-check' : findings.some((f) => f.severity === 'block') ? 'blocked' : findings.some((f) => f.severity === 'warn') ? 'warnings' : 'clear';
  const nudge = findings.some((f) => f.code === 'bug-fix-unmeasured') ? bugFixNudge(context) : undefined;
  return { verdict, counts, base: change.base, head: change.head, findings, plans, flags, collisions, ...(nudge ? { nudge } : {}) };
}
