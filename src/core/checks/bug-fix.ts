import picomatch from 'picomatch';
import type { Settings } from '../config/schema.js';
import { addDays } from '../calendar.js';
import { countOf, formatCount, formatRate, formatRelative, formatWeeks } from '../report/numbers.js';
import type { Check, PullRequestInfo, ReviewContext } from '../review/context.js';
import { firstNonFinite } from '../stats/finite-sizing.js';
import { sizeMetric } from '../stats/sizing.js';

/** What follows the type in a conventional-commit title: an optional (scope), an optional !, then a colon. */
const CONVENTIONAL_TAIL = /^(\([^)]*\))?!?:/;

/** Why a pull request counts as a bug fix, or undefined when it does not. */
export function bugFixReason(pr: PullRequestInfo, settings: Settings['bugFix']): string | undefined {
  const labels = (pr.labels ?? []).map((l) => l.toLowerCase());
  const label = settings.labels.find((l) => labels.includes(l.toLowerCase()));
  if (label) return `it has the label ${label}`;
  const title = pr.title ?? '';
  // Conventional commits: "fix: ...", "fix(cart): ...", "fix!: ...".
  const prefix = settings.titlePrefixes.find((p) => title.toLowerCase().startsWith(p.toLowerCase()) && CONVENTIONAL_TAIL.test(title.slice(p.length)));
  if (prefix) return `its title starts with ${prefix}:`;
  const branch = (pr.branch ?? '').toLowerCase();
  const branchPrefix = settings.branchPrefixes.find((p) => branch.startsWith(p.toLowerCase()));
  if (branchPrefix) return `its branch starts with ${branchPrefix}`;
  return undefined;
}

/** The nudge on a bug fix that ships unmeasured: why, how, and a plan to paste. */
export interface BugFixNudge {
  reason: string;
  productFiles: string[];
  planStub: string;
  /** What a two-week check test would catch, when the settings name a guardrail and traffic: said first. */
  twoWeeksLine?: string;
  /** Units and time to catch a 1% relative regression: the detail behind the two-week line. */
  sizingLine?: string;
}

/** A check test runs two whole weeks: long enough to see each weekday twice, short enough for a fix. */
const CHECK_TEST_DAYS = 14;

export function bugFixNudge(context: ReviewContext): BugFixNudge | undefined {
  const settings = context.settings.bugFix;
  if (!settings.enabled) return undefined;
  const labels = (context.pr.labels ?? []).map((l) => l.toLowerCase());
  if (labels.includes(settings.silenceLabel.toLowerCase())) return undefined;
  const reason = bugFixReason(context.pr, settings);
  if (!reason || context.touches.length > 0 || context.linked.length > 0) return undefined;
  const notProduct = picomatch(settings.nonProductPaths, { dot: true });
  const productFiles = context.changedPaths.filter((p) => !notProduct(p));
  if (productFiles.length === 0) return undefined;
  const guardrail = settings.guardrail;
  let sizingLine: string | undefined;
  let twoWeeksLine: string | undefined;
  if (guardrail && settings.dailyUnits !== undefined) {
    const harm = guardrail.direction === 'decrease' ? 'increase' : 'decrease';
    const sized = sizeMetric({
      baseline: { kind: 'proportion', rate: guardrail.rate },
      direction: harm,
      effect: { relative: 0.01 },
      arms: [
        { name: 'control', weight: 50 },
        { name: 'fix', weight: 50 },
      ],
      control: 'control',
      alpha: 0.05,
      power: 0.8,
      sides: 1,
      dailyUnits: settings.dailyUnits,
      trafficShare: 1,
      reach: 1,
      interimLooks: 0,
      boundary: 'obrien-fleming-spending',
      prePeriodCorrelation: 0,
      plannedDays: CHECK_TEST_DAYS,
    });
    // The settings' figures are bounded, but a line with an overflowed figure is better left out than printed.
    if (sized.ok && sized.value.headline && sized.value.effect && firstNonFinite(sized.value) === undefined) {
      const h = sized.value.headline;
      const twoWeeks = sized.value.atPlannedEnd?.detectable;
      const traffic = `${formatCount(settings.dailyUnits)} eligible units a day, half of them getting the fix`;
      const test = 'one-sided α 0.05, power 80%';
      if (twoWeeks) {
        twoWeeksLine = `In two weeks at ${traffic}, a check test would catch ${guardrail.name} ${harm === 'increase' ? 'rising' : 'falling'} from ${formatRate(guardrail.rate)} to ${formatRate(twoWeeks.to)} (${formatRelative(twoWeeks.relative)} relative; ${test}).`;
      }
      sizingLine = `To catch a 1% relative regression in ${guardrail.name} (${formatRate(guardrail.rate)} → ${formatRate(sized.value.effect.to)}) at ${traffic}: ${countOf(h.perArm[0]!.units, 'unit')} per arm, ${h.duration ? formatWeeks(h.duration) : 'no duration'}; ${test}.`;
    }
  }
  const slug = (context.pr.branch ?? 'bug-fix').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40) || 'bug-fix';
  const g = guardrail ?? { name: 'error-rate', rate: 0.01, events: ['error_shown'], direction: 'decrease' as const };
  const planStub = [
    `id: check-${slug}`,
    `title: "Check test: ${(context.pr.title ?? 'the fix').replace(/"/g, "'").slice(0, 80)}"`,
    'owners: ["@your-handle"]',
    `flags: [${slug}]`,
    'state: draft',
    ...(context.today ? [`window: { start: ${context.today}, end: ${addDays(context.today, CHECK_TEST_DAYS - 1)} }   # two whole weeks`] : []),
    'hypothesis:',
    '  change: The fix, behind a flag, for half of the traffic.',
    '  because: It should stop the bug without harming anything else.',
    '  expected-direction: increase',
    'unit: { randomization: user }',
    'surface: { path: area/page }',
    'metrics:',
    '  primary:',
    '    name: task-completed',
    '    kind: proportion',
    '    baseline: { rate: 0.5 }',
    '    events: [task_completed]',
    '  guardrails:',
    `    - { name: ${g.name}, kind: proportion, baseline: { rate: ${g.rate} }, events: [${g.events.join(', ')}], direction: ${g.direction}, tolerance: { relative: 0.01 } }`,
    '    - { name: latency, kind: mean, baseline: { mean: 300, sd: 150 }, events: [page_rendered], direction: decrease, tolerance: { relative: 0.02 } }',
    'design:',
    '  min-detectable-effect: { relative: 0.02 }',
    `  daily-units: ${settings.dailyUnits ?? 10000}`,
    'decisions:',
    '  win: Roll the fix out to everyone.',
    '  flat: Roll it out; the bug is gone and nothing got worse.',
    '  loss: Turn the flag off and look again at the fix.',
    '  guardrail-breach: Turn the flag off at once.',
  ].join('\n');
  return { reason, productFiles, planStub, ...(twoWeeksLine ? { twoWeeksLine } : {}), ...(sizingLine ? { sizingLine } : {}) };
}

export const bugFixUnmeasured: Check = (context) => {
  const nudge = bugFixNudge(context);
  if (!nudge) return [];
  return [
    {
      code: 'bug-fix-unmeasured',
      message: `This looks like a bug fix (${nudge.reason}) that changes product code without a flag: if the fix does not fix, or slows things down or raises errors, nobody will see it.`,
      fix: `Ship it behind a flag with a small check test (a plan to paste is in the comment), or add the label ${context.settings.bugFix.silenceLabel} to say no test is needed.`,
    },
  ];
};
