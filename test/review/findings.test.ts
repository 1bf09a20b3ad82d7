import { afterAll, describe, expect, it, vi } from 'vitest';
import { rmSync } from 'node:fs';
import { openChange } from '../../src/adapters/git.js';
import { CHANGE_BOUND, FINDING_CODES } from '../../src/core/review/finding.js';
import type { Review } from '../../src/core/review/build-review.js';
import { reviewChange } from '../../src/run/review-change.js';
import type { PullRequestInfo } from '../../src/core/review/context.js';
import { historyOf, makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE, CART_CODE_TOUCHED, cleanPlan, goodTotals, planYaml, recorded, withPlan } from './scenarios.js';

// Every finding the change-only checks raise in this file, to hold them to their promise (see the last test).
const changeCheckFindings = vi.hoisted(() => [] as { code: string; plan?: string }[]);
vi.mock('../../src/core/checks/index.js', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../src/core/checks/index.js')>();
  const observed = new Map([...real.CHANGE_CHECKS].map((check) => [check, ((context) => {
    const found = check(context);
    changeCheckFindings.push(...found);
    return found;
  }) as typeof check]));
  const wrap = (check: (typeof real.CHECKS)[number]) => observed.get(check) ?? check;
  return { ...real, CHECKS: real.CHECKS.map(wrap), CHANGE_CHECKS: new Set(observed.values()), PLAN_CHECKS: real.PLAN_CHECKS };
});

const made: string[] = [];
/** Mid-window of the clean plan (2026-11-02 to 2026-11-29): its test is running. */
const TODAY = '2026-11-16';
// Many repositories are made; removing them on a busy machine can take longer than the default hook limit.
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 120_000);

async function review(files: Record<string, string>, changes: Record<string, string | null>, pr: PullRequestInfo = {}, today?: string, baseUnreadable?: string, swapped = false): Promise<Review> {
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  // Swapped: the change's commit given as base and the commit before it as head.
  const change = swapped ? await openChange(repo.root, 'HEAD', 'main') : await openChange(repo.root, 'main', 'HEAD');
  // As the Action's files-API mode gives it: the base commit's files cannot be read.
  const headFiles = change.filesAt('head');
  const unknown = { listFiles: async () => [], readText: async () => undefined, readTexts: async (paths: readonly string[]) => paths.map(() => undefined) };
  if (baseUnreadable) Object.assign(change, { baseUnreadable, filesAt: (side: 'base' | 'head') => (side === 'base' ? unknown : headFiles) });
  const outcome = await reviewChange({ change, history: historyOf(repo.root), pr, today: today ?? TODAY });
  if (outcome.kind !== 'review') throw new Error(JSON.stringify(outcome.problems));
  return outcome.review;
}


const other = (overrides: Record<string, unknown>) =>
  planYaml(cleanPlan({ id: 'other', flags: ['other-flag'], owners: ['@owner-two'], surface: { path: 'shop/cart/total' }, exposure: { event: 'order_done' }, ...overrides }));



/** Concluded tests that recorded the relative effects given on the good plan's primary metric (bought). */
const pastOutcomes = (relatives: number[]) =>
  Object.fromEntries(
    relatives.map((relative, i) => [
      `experiments/past-${i}.yaml`,
      planYaml(
        cleanPlan({
          id: `past-${i}`,
          flags: [`past-flag-${i}`],
          state: 'concluded',
          window: { start: '2026-01-05', end: '2026-02-01' },
          surface: { path: `shop/past-${i}` },
          outcome: { class: 'inconclusive', 'data-through': '2026-02-01', figures: [{ arm: 'treatment', metric: 'bought', difference: 0.3 * relative, low: -0.01, high: 0.02, relative, 'p-value': 0.2 }] },
        }),
      ),
    ]),
  );

/** Totals of the good test run from 2026-10-05 to 2026-11-01, committed without a resolvable launch commit. */
const OVERDUE_TOTALS = goodTotals(6400, '4b1d2e7').replace('data-through: 2026-11-29', 'data-through: 2026-11-01');

const AMENDMENT = { date: '2026-11-16', changed: 'minimum detectable effect 5% -> 4%', reason: 'Traffic doubled after the app release.' };

/** The cart with the winning arm hard-coded: the flag read is gone. */
const HARD_CODED_CART = CART_CODE.replace("if (client.getBooleanValue('good-flag', false)) {", 'if (true) {');

type Scenario = { files?: Record<string, string>; changes: Record<string, string | null>; body?: string; pr?: PullRequestInfo; baseUnreadable?: string; swapped?: boolean };

// For every finding code: a scenario that must raise it, and a near miss that must not.
const cases: Record<string, { trigger: Scenario; nearMiss: Scenario }> = {
  'flag-without-plan': {
    trigger: { changes: { 'src/new.ts': "if (client.getBooleanValue('new-flag', false)) run();\n" } },
    nearMiss: { files: baseFiles({ '.plumbline.yml': 'exempt-flags: [new-flag]\n' }), changes: { 'src/new.ts': "if (client.getBooleanValue('new-flag', false)) run();\n" } },
  },
  'plan-invalid': {
    trigger: { changes: withPlan(cleanPlan({ design: { alpha: 2 } })) },
    nearMiss: { changes: withPlan(cleanPlan({ title: 'Renamed' })) },
  },
  'decisions-missing': {
    trigger: { changes: withPlan(cleanPlan({ decisions: { win: 'Ship.', flat: 'Drop.', 'guardrail-breach': 'Stop.' } })) },
    nearMiss: { changes: withPlan(cleanPlan({ decisions: { 'guardrail-breach': 'Stop.', 'launch-regardless': { reason: 'Legal requires it.' } } })) },
  },
  'reason-missing': {
    trigger: { changes: withPlan(cleanPlan({ hypothesis: { change: 'A clearer cart.', 'expected-direction': 'increase' } })) },
    nearMiss: { changes: withPlan(cleanPlan()) },
  },
  'guardrails-missing': {
    trigger: { changes: withPlan(cleanPlan({ metrics: { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: ['order_done'] } } })) },
    nearMiss: { changes: withPlan(cleanPlan()) },
  },
  'end-missing': {
    trigger: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02' } })) },
    nearMiss: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-29' } })) },
  },
  'window-short': {
    trigger: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-06' } })) },
    nearMiss: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-08' } })) },
  },
  'window-partial-week': {
    trigger: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-11' } })) },
    nearMiss: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-15' } })) },
  },
  'review-missing': {
    trigger: { changes: withPlan(cleanPlan({ sensitive: [{ area: 'pricing' }] })) },
    nearMiss: { changes: withPlan(cleanPlan({ sensitive: [{ area: 'pricing', review: 'pricing council' }] })) },
  },
  'bundle-unexplained': {
    trigger: { changes: withPlan(cleanPlan({ flags: ['good-flag', 'second-flag'] })) },
    nearMiss: { changes: withPlan(cleanPlan({ flags: ['good-flag', 'second-flag'], 'bundle-rationale': 'The second needs the first.' })) },
  },
  'population-undeclared': {
    trigger: { changes: withPlan(cleanPlan({ population: { platforms: ['web'] } })) },
    nearMiss: { changes: withPlan(cleanPlan()) },
  },
  'readiness-missing': {
    trigger: { changes: withPlan(cleanPlan({ population: { platforms: ['web', 'ios'], locales: ['en-GB'], ready: { platforms: ['web'], locales: ['en-GB'] } } })) },
    nearMiss: { changes: withPlan(cleanPlan({ population: { platforms: ['web', 'ios'], locales: ['en-GB'], ready: { platforms: ['web', 'ios'], locales: ['en-GB'] } } })) },
  },
  underpowered: {
    trigger: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 300 } })) },
    nearMiss: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 3000 } })) },
  },
  'sizing-incomplete': {
    trigger: { changes: withPlan(cleanPlan({ design: { 'daily-units': 20000 } })) },
    nearMiss: { changes: withPlan(cleanPlan()) },
  },
  // A plan sizing can never size fails validation (plan/cannot-be-sized); what is left is a design whose interim looks
  // no boundary can serve, which only sizing with the looks finds.
  'sizing-impossible': {
    trigger: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, 'interim-looks': 20, 'interim-boundary': 'pocock', alpha: 0.999, power: 0.9999 } })) },
    nearMiss: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, 'interim-looks': 20, 'interim-boundary': 'pocock' } })) },
  },
  'exposure-diluted': {
    trigger: { changes: withPlan(cleanPlan({ exposure: { event: 'cart_viewed', reach: 0.5 } })) },
    nearMiss: { changes: withPlan(cleanPlan({ exposure: { event: 'cart_viewed', reach: 1 } })) },
  },
  'not-feasible': {
    trigger: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 300 } })) },
    nearMiss: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 3000 } })) },
  },
  'returning-units': {
    trigger: { changes: withPlan(cleanPlan({ population: { platforms: ['web'], locales: ['en-GB'], segment: 'returning customers', ready: { platforms: ['web'], locales: ['en-GB'] } } })) },
    nearMiss: {
      changes: withPlan(
        cleanPlan({
          population: { platforms: ['web'], locales: ['en-GB'], segment: 'returning customers', ready: { platforms: ['web'], locales: ['en-GB'] } },
          design: { 'min-detectable-effect': { relative: 0.05 }, 'unique-units': [{ days: 7, units: 90000 }, { days: 28, units: 200000 }] },
        }),
      ),
    },
  },
  'groups-short': {
    trigger: { changes: withPlan(cleanPlan({ unit: { randomization: 'team', analysis: 'user' }, design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, cluster: { 'mean-size': 4, icc: 0.01 }, 'groups-available': 100 } })) },
    nearMiss: { changes: withPlan(cleanPlan({ unit: { randomization: 'team', analysis: 'user' }, design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, cluster: { 'mean-size': 4, icc: 0.01 }, 'groups-available': 1000000 } })) },
  },
  'ratio-denominator': {
    trigger: {
      changes: withPlan(cleanPlan({ metrics: { primary: { name: 'clicks-per-visit', kind: 'ratio', baseline: { numerator: { mean: 1, sd: 1 }, denominator: { mean: 3, sd: 2 }, correlation: 0.5 }, events: ['order_done', 'cart_viewed'], 'denominator-may-move': true }, guardrails: (cleanPlan().metrics as { guardrails: unknown }).guardrails } })),
    },
    nearMiss: {
      changes: withPlan(
        cleanPlan({
          metrics: {
            primary: { name: 'clicks-per-visit', kind: 'ratio', baseline: { numerator: { mean: 1, sd: 1 }, denominator: { mean: 3, sd: 2 }, correlation: 0.5 }, events: ['order_done', 'cart_viewed'], 'denominator-may-move': true },
            guardrails: (cleanPlan().metrics as { guardrails: unknown }).guardrails,
            secondary: [
              { name: 'orders', kind: 'mean', baseline: { mean: 1, sd: 1 }, events: ['order_done'] },
              { name: 'visits', kind: 'mean', baseline: { mean: 3, sd: 2 }, events: ['cart_viewed'] },
            ],
          },
        }),
      ),
    },
  },
  'atypical-period': {
    trigger: { files: baseFiles({ '.plumbline.yml': 'sizing:\n  atypical-periods: [{ name: winter sale, start: 2026-11-27, end: 2026-11-30 }]\n' }), changes: withPlan(cleanPlan()) },
    nearMiss: { files: baseFiles({ '.plumbline.yml': 'sizing:\n  atypical-periods: [{ name: winter sale, start: 2026-11-30, end: 2026-12-02 }]\n' }), changes: withPlan(cleanPlan()) },
  },
  'novelty-window': {
    trigger: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-08' }, population: { platforms: ['web'], locales: ['en-GB'], segment: 'returning customers', ready: { platforms: ['web'], locales: ['en-GB'] } } })) },
    nearMiss: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-15' }, population: { platforms: ['web'], locales: ['en-GB'], segment: 'returning customers', ready: { platforms: ['web'], locales: ['en-GB'] } } })) },
  },
  spillover: {
    trigger: { files: baseFiles({ '.plumbline.yml': 'group-surfaces: [shop]\n' }), changes: withPlan(cleanPlan()) },
    nearMiss: { files: baseFiles({ '.plumbline.yml': 'group-surfaces: [shopping]\n' }), changes: withPlan(cleanPlan()) },
  },
  'analysis-unit-differs': {
    trigger: { changes: withPlan(cleanPlan({ unit: { randomization: 'team', analysis: 'user' }, design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, cluster: { 'mean-size': 4, icc: 0.01 } } })) },
    nearMiss: { changes: withPlan(cleanPlan({ unit: { randomization: 'team', analysis: 'team' } })) },
  },
  collision: {
    trigger: { files: baseFiles({ 'experiments/other.yaml': other({}) }), changes: withPlan(cleanPlan()) },
    nearMiss: {
      // Half-open ranges: [50, 100) and [0, 50) share no unit.
      files: baseFiles({ 'experiments/other.yaml': other({ surface: { path: 'shop/cart/total', 'traffic-split': { name: 'cart', range: { start: 50, end: 100 } } } }) }),
      changes: withPlan(cleanPlan({ surface: { path: 'shop/cart', 'traffic-split': { name: 'cart', range: { start: 0, end: 50 } } } })),
    },
  },
  'known-overlap': {
    trigger: { files: baseFiles({ 'experiments/other.yaml': other({ surface: { path: 'shop/cart', 'overlaps-with': ['good'] } }) }), changes: withPlan(cleanPlan()) },
    nearMiss: { files: baseFiles({ 'experiments/other.yaml': other({ surface: { path: 'shop/search', 'overlaps-with': ['good'] } }) }), changes: withPlan(cleanPlan()) },
  },
  'event-missing': {
    trigger: { changes: withPlan(cleanPlan({ exposure: { event: 'never_logged' } })) },
    nearMiss: { changes: withPlan(cleanPlan({ exposure: { event: 'logged_as_string' } }), { 'src/names.ts': "export const EXPOSURE = 'logged_as_string';\n" }) },
  },
  'event-removed': {
    trigger: {
      files: baseFiles({ 'experiments/other.yaml': other({ exposure: { event: 'keeper_seen' } }), 'src/keeper.ts': "track('keeper_seen');\n" }),
      changes: { 'src/keeper.ts': '// moved away\n' },
    },
    nearMiss: {
      files: baseFiles({ 'experiments/other.yaml': other({ exposure: { event: 'keeper_seen' } }), 'src/keeper.ts': "track('keeper_seen');\n" }),
      changes: { 'src/keeper.ts': '// moved away\n', 'src/elsewhere.ts': "track('keeper_seen');\n" },
    },
  },
  'outcome-mismatch': {
    trigger: { changes: recorded({ class: 'win', arms: ['treatment'] }, 6050) },
    nearMiss: { changes: recorded({ class: 'win', arms: ['treatment'] }, 6400) },
  },
  'outcome-override': {
    trigger: { changes: recorded({ class: 'win', arms: ['treatment'], override: { class: 'win', reason: 'Support costs fall either way.' } }, 6050) },
    nearMiss: { changes: recorded({ class: 'inconclusive' }, 6050) },
  },
  'bug-fix-unmeasured': {
    trigger: { changes: { 'src/checkout.ts': 'export const total = (a: number, b: number) => a + b;\n' }, pr: { title: 'fix: totals were off by one', labels: [] } },
    nearMiss: { changes: { 'docs/totals.md': 'Totals are now right.\n' }, pr: { title: 'fix: totals were off by one' } },
  },
  // The good plan is sized for 5%; every effect measured on bought before was at most 3%.
  'effect-implausible': {
    trigger: { files: baseFiles(pastOutcomes([0.01, -0.02, 0.03, 0.005, 0.015])), changes: withPlan(cleanPlan()) },
    // Four recorded tests are not yet a history.
    nearMiss: { files: baseFiles(pastOutcomes([0.01, -0.02, 0.03, 0.005])), changes: withPlan(cleanPlan()) },
  },
  'plan-frozen': {
    trigger: { changes: withPlan(cleanPlan({ metrics: { ...(cleanPlan().metrics as object), primary: { name: 'cart-views', kind: 'proportion', baseline: { rate: 0.3 }, events: ['cart_viewed'] } } })) },
    // Refining a draft's baseline before its start is fine.
    nearMiss: {
      files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', window: { start: '2026-11-30', end: '2026-12-27' } })) }),
      changes: withPlan(cleanPlan({ state: 'draft', window: { start: '2026-11-30', end: '2026-12-27' }, metrics: { ...(cleanPlan().metrics as object), primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.32 }, events: ['order_done'] } } })),
    },
  },
  'plan-amended': {
    trigger: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.04 }, 'daily-units': 20000 }, amendments: [AMENDMENT] })) },
    nearMiss: { changes: withPlan(cleanPlan({ title: 'Renamed', amendments: [AMENDMENT] })) },
  },
  'plan-deleted': {
    trigger: { changes: { 'experiments/good.yaml': null } },
    nearMiss: {
      files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ state: 'concluded', outcome: { date: '2026-11-30', reason: 'Shipped: +2% orders.' } })) }),
      changes: { 'experiments/good.yaml': null },
    },
  },
  'plan-end-moved': {
    trigger: { changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-12-27' } })) },
    nearMiss: {
      files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, 'interim-looks': 2 } })) }),
      changes: withPlan(cleanPlan({ window: { start: '2026-11-02', end: '2026-11-22' }, design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, 'interim-looks': 2 } })),
    },
  },
  'test-ended-early': {
    trigger: { changes: { 'src/cart.ts': HARD_CODED_CART } },
    nearMiss: { changes: { 'src/cart.ts': HARD_CODED_CART, 'experiments/good.yaml': planYaml(cleanPlan({ state: 'concluded', outcome: { date: '2026-11-16', reason: 'Stopped: checkout errors doubled.' } })) } },
  },
  // With totals for it (here in the change), the readout is there; only the recorded outcome is missing.
  'outcome-missing': {
    trigger: { files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ window: { start: '2026-10-05', end: '2026-11-01' } })) }), changes: { 'src/cart.ts': HARD_CODED_CART, 'readouts/good.totals.yaml': OVERDUE_TOTALS } },
    nearMiss: {
      files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ window: { start: '2026-10-05', end: '2026-11-01' } })) }),
      changes: { 'src/cart.ts': HARD_CODED_CART, 'experiments/good.yaml': planYaml(cleanPlan({ state: 'concluded', window: { start: '2026-10-05', end: '2026-11-01' }, outcome: { date: '2026-11-03', reason: 'Shipped: +2% orders.' } })) },
    },
  },
  'readout-missing': {
    trigger: { files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ window: { start: '2026-10-05', end: '2026-11-01' } })) }), changes: { 'src/cart.ts': HARD_CODED_CART } },
    // Totals on main are found for the test the change ends.
    nearMiss: { files: baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ window: { start: '2026-10-05', end: '2026-11-01' } })), 'readouts/good.totals.yaml': OVERDUE_TOTALS }), changes: { 'src/cart.ts': HARD_CODED_CART } },
  },
  // The base commit is the launch: the change rewrites the win decision, and the readout is read against the launch rule.
  'rule-changed': {
    trigger: { changes: withPlan(cleanPlan({ decisions: { ...(cleanPlan().decisions as object), win: 'Ship to everyone.' } }), { 'readouts/good.totals.yaml': goodTotals(6400) }) },
    nearMiss: { changes: withPlan(cleanPlan({ decisions: { ...(cleanPlan().decisions as object), win: 'Ship to everyone.' }, amendments: [{ date: '2026-11-16', changed: 'win decision: ship to everyone', reason: 'Support is ready for every region.' }] }), { 'readouts/good.totals.yaml': goodTotals(6400) }) },
  },
  'launch-plan-unavailable': {
    trigger: { changes: withPlan(cleanPlan(), { 'readouts/good.totals.yaml': goodTotals(6400, '4b1d2e7') }) },
    nearMiss: { changes: withPlan(cleanPlan(), { 'readouts/good.totals.yaml': goodTotals(6400) }) },
  },
  'exposure-one-arm': {
    trigger: { changes: withPlan(cleanPlan(), { 'src/cart.ts': "export function cart(client, track) {\n  if (client.getBooleanValue('good-flag', true)) {\n    track('cart_viewed');\n    track('order_done');\n  }\n  track('cart_error');\n}\n" }) },
    // Logged before the branch: every arm logs it.
    nearMiss: { changes: withPlan(cleanPlan()) },
  },
  'treatment-changed': {
    trigger: { changes: { 'src/cart.ts': CART_CODE.replace("    track('order_done');\n", "    showBanner('Free delivery');\n    track('order_done');\n") } },
    // A change to an unrelated function in the same file as a live flag read is not a treatment change.
    nearMiss: { changes: { 'src/cart.ts': `${CART_CODE}\nexport function total(items) {\n  return items.length;\n}\n` } },
  },
  'file-warning': {
    // A renamed key loads with a warning (plan/renamed-key), as validate says.
    trigger: { changes: withPlan(cleanPlan({ surface: { path: 'shop/cart', 'exclusion-group': { name: 'cart-core', slice: { from: 0, to: 50 } } } })) },
    nearMiss: { changes: withPlan(cleanPlan({ surface: { path: 'shop/cart', 'traffic-split': { name: 'cart-core', range: { start: 0, end: 50 } } } })) },
  },
  'base-unread': {
    // A started test, and a run that cannot read the base commit (the Action's files-API mode).
    trigger: { changes: withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, alpha: 0.1 } })), baseUnreadable: 'no git history' },
    // The same run on a change to code only: no plan could have changed (and the code checks read head).
    nearMiss: { changes: { 'src/cart.ts': CART_CODE_TOUCHED }, baseUnreadable: 'no git history' },
  },
  'refs-swapped': {
    // Head is an ancestor of base: the change from base to head is empty.
    trigger: { changes: { 'src/cart.ts': CART_CODE_TOUCHED }, swapped: true },
    nearMiss: { changes: { 'src/cart.ts': CART_CODE_TOUCHED } },
  },
  'severity-unknown-code': {
    trigger: { files: baseFiles({ '.plumbline.yml': 'severity: { colision: block }\n' }), changes: withPlan(cleanPlan()) },
    nearMiss: { files: baseFiles({ '.plumbline.yml': 'severity: { collision: block }\n' }), changes: withPlan(cleanPlan()) },
  },
};

describe('every finding code is covered by a trigger and a near miss', () => {
  it('lists every code', () => expect(Object.keys(cases).sort()).toEqual(Object.keys(FINDING_CODES).sort()));

  describe.each(Object.entries(cases))('%s', (code, { trigger, nearMiss }) => {
    it('raises it', async () => {
      const r = await review(trigger.files ?? baseFiles(), trigger.changes, { ...trigger.pr, ...(trigger.body ? { body: trigger.body } : {}) }, undefined, trigger.baseUnreadable, trigger.swapped);
      expect(r.findings.map((f) => f.code)).toContain(code);
    });
    it('does not raise it on the near miss', async () => {
      const r = await review(nearMiss.files ?? baseFiles(), nearMiss.changes, { ...nearMiss.pr, ...(nearMiss.body ? { body: nearMiss.body } : {}) }, undefined, nearMiss.baseUnreadable, nearMiss.swapped);
      expect(r.findings.map((f) => f.code)).not.toContain(code);
    });
  });
});

describe('the review as a whole', () => {
  it('is all clear on a clean plan whose flag the change touches', async () => {
    const r = await review(baseFiles(), withPlan(cleanPlan()));
    expect(r.findings).toEqual([]);
    expect(r.verdict).toBe('clear');
    expect(r.plans[0]!.checklist.every((i) => i.done)).toBe(true);
    expect(r.plans[0]!.reasons).toEqual(['flag touched']);
  });

  it('has nothing to check when no flag, plan or event is touched', async () => {
    const r = await review(baseFiles({ 'README.md': 'hello\n' }), { 'README.md': 'hello again\n' });
    expect(r.verdict).toBe('nothing-to-check');
  });

  it('links a plan named in the description, by id as a whole word only', async () => {
    const named = await review(baseFiles(), { 'README.md': 'x\n' }, { body: 'This follows good, see plan.' });
    expect(named.plans.map((p) => p.id)).toEqual(['good']);
    const partial = await review(baseFiles(), { 'README.md': 'x\n' }, { body: 'This is goodness.' });
    expect(partial.plans).toEqual([]);
  });

  it('lets the settings raise, lower and silence findings, but never lower a missing decision rule', async () => {
    const settings = '.plumbline.yml';
    const files = baseFiles({ [settings]: 'severity: { flag-without-plan: block, decisions-missing: note, reason-missing: off }\n' });
    const r = await review(files, {
      ...withPlan(cleanPlan({ hypothesis: { change: 'x', 'expected-direction': 'increase' }, decisions: {} })),
      'src/new.ts': "client.getBooleanValue('new-flag', false);\n",
    });
    const severity = Object.fromEntries(r.findings.map((f) => [f.code, f.severity]));
    expect(severity['flag-without-plan']).toBe('block');
    expect(severity['decisions-missing']).toBe('block');
    expect(severity['reason-missing']).toBeUndefined();
  });

  it('finds flags behind constants and in flag definition files', async () => {
    const r = await review(baseFiles({ 'config/flags.json': '{ "flags": { "good-flag": { "state": "ENABLED" } } }\n' }), {
      'src/constant.ts': "const CART_FLAG = 'const-flag';\nexport const on = client.getBooleanValue(CART_FLAG, false);\n",
      'config/flags.json': '{ "flags": { "good-flag": { "state": "DISABLED" }, "defined-flag": { "state": "ENABLED" } } }\n',
    });
    const keys = r.flags.map((f) => `${f.key}:${f.via}`);
    expect(keys).toEqual(expect.arrayContaining(['const-flag:constant', 'good-flag:definition', 'defined-flag:definition']));
  });
});

describe('the bug-fix nudge', () => {
  const product = { 'src/checkout.ts': 'export const total = (a: number, b: number) => a + b;\n' };
  it.each([
    ['a bug label', { labels: ['Bug'] }, true],
    ['a fix: title', { title: 'fix: round totals' }, true],
    ['a scoped fix(cart)!: title', { title: 'fix(cart)!: round totals' }, true],
    ['a fix/ branch', { branch: 'fix/rounding' }, true],
    ['a hotfix/ branch', { branch: 'hotfix/rounding' }, true],
    ['a fixture/ branch', { branch: 'fixture/rounding' }, false],
    ['a feature title that mentions fix', { title: 'feat: fix-ups for the cart' }, false],
    ['the silencing label', { title: 'fix: round totals', labels: ['no-check-test'] }, false],
  ])('%s', async (_name, pr, expected) => {
    const r = await review(baseFiles(), product, pr);
    expect(r.findings.some((f) => f.code === 'bug-fix-unmeasured')).toBe(expected);
    expect(r.nudge !== undefined).toBe(expected);
  });

  it('stays quiet when the fix already touches a flag, and on test-only or config-only fixes', async () => {
    expect((await review(baseFiles(), { 'src/cart.ts': CART_CODE_TOUCHED }, { title: 'fix: cart' })).nudge).toBeUndefined();
    expect((await review(baseFiles(), { 'src/cart.test.ts': 'test();\n' }, { title: 'fix: cart' })).nudge).toBeUndefined();
    expect((await review(baseFiles(), { 'config/app.json': '{}\n' }, { title: 'fix: cart' })).nudge).toBeUndefined();
  });

  it('leads with what two weeks can detect, and sizes a 1% regression from the configured guardrail and traffic', async () => {
    const settings = 'bug-fix:\n  guardrail: { name: checkout-errors, rate: 0.02, events: [checkout_error] }\n  daily-units: 40000\n';
    const r = await review(baseFiles({ '.plumbline.yml': settings }), product, { title: 'fix: totals', branch: 'fix/totals' });
    expect(r.nudge?.twoWeeksLine).toMatch(/^In two weeks at 40,000 eligible units a day, half of them getting the fix, a check test would catch checkout-errors rising from 2\.00% to 2\.\d\d% \(\+[\d.]+% relative; one-sided α 0\.05, power 80%\)\.$/);
    const { renderReviewMarkdown } = await import('../../src/core/report/review-markdown.js');
    const note = renderReviewMarkdown(r).split('#### A small check test for this fix?')[1] ?? '';
    // The two-week figure comes first; the 1% sizing sits inside a collapsed <details>.
    expect(note.trimStart().startsWith('In two weeks at 40,000')).toBe(true);
    // The 1% sizing is collapsed: inside the details element, never in the lines shown.
    expect(note).toMatch(/<details><summary>Sizing, and a plan to paste[^<]*<\/summary>\n\nTo catch a 1% relative regression[^\n]*\n/);
    expect(r.nudge?.sizingLine).toMatch(/^To catch a 1% relative regression in checkout-errors \(2\.00% → 2\.02%\) at 40,000 eligible units a day, half of them getting the fix: [\d,]+ units per arm, \d+ weeks \([\d,]+ days\); one-sided α 0\.05, power 80%\.$/);
  });

  it('carries a plan stub with a two-week window that the real plan loader takes without a warning', async () => {
    const r = await review(baseFiles(), product, { title: 'fix: totals', branch: 'fix/totals' }, '2026-12-02');
    expect(r.nudge?.planStub).toContain('window: { start: 2026-12-02, end: 2026-12-15 }');
    const { loadPlan } = await import('../../src/core/plan/load.js');
    const loaded = loadPlan(r.nudge!.planStub, 'experiments/check-fix-totals.yaml');
    expect(loaded.ok ? [] : loaded.errors).toEqual([]);
    expect(loaded.warnings).toEqual([]);
    expect(loaded.ok && loaded.loaded.plan.window).toEqual({ start: '2026-12-02', end: '2026-12-15' });
  });
});

describe('plan findings point at the key the fix goes to, not at the id line', () => {
  /** 1-based line of the first line of `text` matching `pattern`, found by plain text search. */
  const lineOf = (text: string, pattern: RegExp) => text.split('\n').findIndex((l) => pattern.test(l)) + 1;
  const cases: [string, string, Record<string, unknown>, RegExp, Record<string, string>?][] = [
    ['decisions-missing', 'the decisions: line', { decisions: { win: 'Ship.' } }, /^decisions:/],
    ['end-missing', 'the window: line', { window: { start: '2026-11-02' } }, /^window:/],
    ['window-short', 'window.end', { window: { start: '2026-11-02', end: '2026-11-06' } }, /^ {2}end: /],
    ['reason-missing', 'the hypothesis: line', { hypothesis: { change: 'A clearer cart.', 'expected-direction': 'increase' } }, /^hypothesis:/],
    ['exposure-diluted', 'exposure.reach', { exposure: { event: 'cart_viewed', reach: 0.5 } }, /^ {2}reach: /],
    ['underpowered', 'the metric', { design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 300 } }, /^ {2}primary:/],
    ['event-missing', 'exposure.event', { exposure: { event: 'never_logged' } }, /^ {2}event: never_logged/],
    ['review-missing', 'the sensitive item', { sensitive: [{ area: 'pricing' }] }, /^ {2}- area: pricing/],
    ['collision', 'the surface: line', {}, /^surface:/, { 'experiments/other.yaml': other({}) }],
  ];
  it.each(cases)('%s points at %s', async (code, _key, overrides, pattern, extra) => {
    const text = planYaml(cleanPlan(overrides));
    const expected = lineOf(text, pattern);
    expect(expected).toBeGreaterThan(lineOf(text, /^id:/));
    const r = await review(baseFiles(extra ?? {}), withPlan(cleanPlan(overrides)));
    const finding = r.findings.find((f) => f.code === code);
    expect(finding).toMatchObject({ file: 'experiments/good.yaml', line: expected });
  });
});

describe('collision and dilution texts', () => {
  it('says what isolating would cost, from the sizing engine, and does not push isolation blindly', async () => {
    // The running test takes every unit: isolating means splitting traffic with it, so this test
    // gets half the units and needs twice the days (durations round up to whole days).
    const r = await review(baseFiles({ 'experiments/other.yaml': other({}) }), withPlan(cleanPlan()));
    const collision = r.findings.find((f) => f.code === 'collision')!;
    const now = r.plans[0]!.sizing.metrics.map((m) => (m.result.ok ? m.result.value.headline?.duration?.days ?? 0 : 0));
    const days = Math.max(...now);
    expect(collision.message).toMatch(new RegExp(`Isolating would cost this test time: splitting traffic with other \\(which would restart it\\), ${days} → (${2 * days - 1}|${2 * days}) days \\((\\d+ weeks? → \\d+ weeks?|still \\d+ weeks?)\\)\\.`));
    expect(collision.message).toMatch(/usually just share units.*it matters when both change the same elements/);
    expect(collision.fix).toMatch(/^Agree with @owner-two whether the two interact\. If they do, isolate them .*; if not, declare the overlap under surface\.overlaps-with/);
    expect(collision.message).not.toMatch(/exclusion|slice/i);
  });

  it('says isolating costs nothing when the running test leaves enough units free', async () => {
    const r = await review(baseFiles({ 'experiments/other.yaml': other({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, 'traffic-share': 0.5 } }) }), withPlan(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, 'traffic-share': 0.5 } })));
    expect(r.findings.find((f) => f.code === 'collision')?.message).toMatch(/Isolating costs this test nothing: other leaves 50% of eligible units free, enough for this test’s 50%/);
  });

  it('makes exposure-diluted a note that says the planned window still suffices when power at the end is met', async () => {
    const r = await review(baseFiles(), withPlan(cleanPlan({ exposure: { event: 'cart_viewed', reach: 0.5 } })));
    const diluted = r.findings.find((f) => f.code === 'exposure-diluted')!;
    expect(diluted.severity).toBe('note');
    expect(diluted.message).toMatch(/The planned 28 days still suffice: every metric reaches at least [\d.>]+% power by the end\./);
    expect(r.findings.map((f) => f.code)).not.toContain('underpowered');
  });

  it('says the window no longer suffices when dilution costs the power, and underpowered carries the warning', async () => {
    const r = await review(baseFiles(), withPlan(cleanPlan({ exposure: { event: 'cart_viewed', reach: 0.2 } })));
    const diluted = r.findings.find((f) => f.code === 'exposure-diluted')!;
    expect(diluted.message).toMatch(/The planned 28 days do not suffice: the weakest metric reaches [\d.]+% power by the end, below the planned 80\.0%\./);
    expect(r.findings.find((f) => f.code === 'underpowered')?.severity).toBe('warn');
  });
});

describe('effect-implausible', () => {
  it('counts the effects and names the largest; stays quiet when more than one in ten measured effects reached the planned size', async () => {
    const r = await review(baseFiles(pastOutcomes([0.01, -0.02, 0.03, 0.005, 0.015])), withPlan(cleanPlan()));
    expect(r.findings.find((f) => f.code === 'effect-implausible')?.message).toMatch(/^The plan is sized to detect 5% on bought, larger than 5 of the 5 effects measured on it by 5 recorded tests \(the largest: 3%\)\./);
    // One of five (a −6% loss counts by its size) reached 5%: four in five below is not nine in ten.
    const quiet = await review(baseFiles(pastOutcomes([0.01, -0.06, 0.03, 0.005, 0.015])), withPlan(cleanPlan()));
    expect(quiet.findings.map((f) => f.code)).not.toContain('effect-implausible');
  });
});

describe('checks the base pass skips', () => {
  // Runs last (vitest keeps file order): by now every trigger and near miss above has run.
  it('raise only findings about the change: without a plan, or with a change-bound code', () => {
    expect(changeCheckFindings.length).toBeGreaterThan(0);
    const perPlan = changeCheckFindings.filter((f) => f.plan !== undefined && !CHANGE_BOUND.has(f.code));
    expect(perPlan).toEqual([]);
  });
});
