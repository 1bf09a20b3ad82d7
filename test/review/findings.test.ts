import { afterAll, describe, expect, it } from 'vitest';
import { rmSync } from 'node:fs';
import { openChange } from '../../src/adapters/git.js';
import { FINDING_CODES } from '../../src/core/review/finding.js';
import type { Review } from '../../src/core/review/build-review.js';
import { reviewChange } from '../../src/run/review-change.js';
import type { PullRequestInfo } from '../../src/core/review/context.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE, CART_CODE_TOUCHED, cleanPlan, planYaml } from './scenarios.js';

const made: string[] = [];
// Removing some 150 temporary repositories can outlast the default hook timeout on a busy machine.
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 120_000);

async function review(files: Record<string, string>, changes: Record<string, string | null>, pr: PullRequestInfo = {}): Promise<Review> {
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr });
  if (outcome.kind !== 'review') throw new Error(JSON.stringify(outcome.problems));
  return outcome.review;
}

/** A head that changes the good plan (so it is linked) and touches its flag. */
const withPlan = (plan: Record<string, unknown>, extra: Record<string, string | null> = {}) => ({ 'experiments/good.yaml': planYaml(plan), 'src/cart.ts': CART_CODE_TOUCHED, ...extra });

const other = (overrides: Record<string, unknown>) =>
  planYaml(cleanPlan({ id: 'other', flags: ['other-flag'], owners: ['@owner-two'], surface: { path: 'shop/cart/total' }, exposure: { event: 'order_done' }, ...overrides }));

type Scenario = { files?: Record<string, string>; changes: Record<string, string | null>; body?: string; pr?: PullRequestInfo };

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
  'sizing-impossible': {
    trigger: { changes: withPlan(cleanPlan({ metrics: { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.98 }, events: ['order_done'] }, guardrails: (cleanPlan().metrics as { guardrails: unknown }).guardrails } })) },
    nearMiss: { changes: withPlan(cleanPlan({ metrics: { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.9 }, events: ['order_done'] }, guardrails: (cleanPlan().metrics as { guardrails: unknown }).guardrails } })) },
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
      files: baseFiles({ 'experiments/other.yaml': other({ surface: { path: 'shop/cart/total', 'exclusion-group': { name: 'cart', slice: { from: 50, to: 100 } } } }) }),
      changes: withPlan(cleanPlan({ surface: { path: 'shop/cart', 'exclusion-group': { name: 'cart', slice: { from: 0, to: 50 } } } })),
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
  'bug-fix-unmeasured': {
    trigger: { changes: { 'src/checkout.ts': 'export const total = (a: number, b: number) => a + b;\n' }, pr: { title: 'fix: totals were off by one', labels: [] } },
    nearMiss: { changes: { 'docs/totals.md': 'Totals are now right.\n' }, pr: { title: 'fix: totals were off by one' } },
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
      const r = await review(trigger.files ?? baseFiles(), trigger.changes, { ...trigger.pr, ...(trigger.body ? { body: trigger.body } : {}) });
      expect(r.findings.map((f) => f.code)).toContain(code);
    });
    it('does not raise it on the near miss', async () => {
      const r = await review(nearMiss.files ?? baseFiles(), nearMiss.changes, { ...nearMiss.pr, ...(nearMiss.body ? { body: nearMiss.body } : {}) });
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

  it('carries a plan stub that loads, and a sizing line from the configured guardrail and traffic', async () => {
    const settings = 'bug-fix:\n  guardrail: { name: checkout-errors, rate: 0.02, events: [checkout_error] }\n  daily-units: 40000\n';
    const r = await review(baseFiles({ '.plumbline.yml': settings }), product, { title: 'fix: totals', branch: 'fix/totals' });
    expect(r.nudge?.sizingLine).toMatch(/^To detect a 1% relative regression in checkout-errors \(2\.00% → 2\.02%\) at 40,000 eligible units a day: [\d,]+ units per arm, \d+ days \(\d+ weeks\), one-sided α 0\.05, power 80%\. Two weeks would catch a rise to [\d.]+% \(\+[\d.]+% relative\)\.$/);
    const { loadPlan } = await import('../../src/core/plan/load.js');
    const loaded = loadPlan(r.nudge!.planStub, 'stub.yaml');
    expect(loaded.ok ? [] : loaded.errors).toEqual([]);
  });
});
