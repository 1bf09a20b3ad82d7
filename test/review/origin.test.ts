// Findings this change introduces against findings that already held for the plan at the base commit.
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import type { Review } from '../../src/core/review/build-review.js';
import { reviewJson } from '../../src/core/review/report-schema.js';
import { reviewChange } from '../../src/run/review-change.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE, CART_CODE_TOUCHED, cleanPlan, planYaml } from './scenarios.js';

const made: string[] = [];
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 60_000);

async function review(files: Record<string, string>, changes: Record<string, string | null>): Promise<Review> {
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  // Before the clean plan's start (2026-11-02): a draft may still change, so no frozen-plan finding joins in.
  const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr: {}, today: '2026-10-01' });
  if (outcome.kind !== 'review') throw new Error('settings invalid');
  return outcome.review;
}

const noReason = { change: 'A clearer cart.', 'expected-direction': 'increase' };
const primaryOnly = { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: ['order_done'] } };

describe('introduced or already known', () => {
  it('marks a finding that held at base as known and a new one as introduced', async () => {
    const r = await review(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', hypothesis: noReason })) }), {
      'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', hypothesis: noReason, metrics: primaryOnly })),
      'src/cart.ts': CART_CODE_TOUCHED,
    });
    const origin = Object.fromEntries(r.findings.map((f) => [f.code, f.origin]));
    expect(origin).toEqual({ 'reason-missing': 'known', 'guardrails-missing': 'introduced' });
    expect(reviewJson(r).findings.map((f) => f.origin).sort()).toEqual(['introduced', 'known']);
    const markdown = renderReviewMarkdown(r);
    expect(markdown).toContain('This change: 1 warning. Already known before it: 1 finding.');
    const [, folded] = markdown.split('<details><summary>Already known: 1 finding that held before this change</summary>');
    expect(folded?.split('</details>')[0]).toContain('**reason-missing**');
    expect(markdown.split('<details>')[0]).toContain('#### Introduced by this change\n\n- ⚠️ **guardrails-missing**');
  });

  it('counts everything about a plan the change adds as introduced', async () => {
    const r = await review(baseFiles(), { 'experiments/new.yaml': planYaml(cleanPlan({ id: 'new', flags: ['new-flag'], hypothesis: noReason, surface: { path: 'shop/new' } })) });
    expect(r.findings.map((f) => [f.code, f.origin])).toEqual([['reason-missing', 'introduced']]);
  });

  it('keeps a known blocking finding in sight', async () => {
    const noDecisions = { win: 'Ship.', flat: 'Drop.', 'guardrail-breach': 'Stop.' };
    const r = await review(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ decisions: noDecisions })) }), {
      'experiments/good.yaml': planYaml(cleanPlan({ decisions: noDecisions, title: 'Renamed' })),
    });
    expect(r.findings.map((f) => [f.code, f.origin])).toEqual([['decisions-missing', 'known']]);
    const markdown = renderReviewMarkdown(r);
    expect(markdown).toContain('Nothing new from this change. Already known before it: 1 blocking finding.');
    expect(markdown.split('<details>')[0]).toContain('#### Still blocking from before this change\n\n- ⛔ **decisions-missing**');
  });

  it('counts an event-missing as introduced when this change removes the logging call', async () => {
    // The draft plan is linked by its flag; the change deletes the only logging of order_done.
    const draft = planYaml(cleanPlan({ state: 'draft' }));
    const r = await review(baseFiles({ 'experiments/good.yaml': draft }), { 'src/cart.ts': CART_CODE_TOUCHED.replace("    track('order_done');\n", '') });
    expect(r.findings.filter((f) => f.code === 'event-missing').map((f) => f.origin)).toEqual(['introduced']);
  });

  it('counts an event-missing as known when the event was never logged', async () => {
    const draft = planYaml(cleanPlan({ state: 'draft' }));
    const unlogged = CART_CODE.replace("    track('order_done');\n", '');
    const r = await review(baseFiles({ 'experiments/good.yaml': draft, 'src/cart.ts': unlogged }), { 'src/cart.ts': unlogged.replace("getBooleanValue('good-flag', false)", "getBooleanValue('good-flag', true)") });
    expect(r.findings.filter((f) => f.code === 'event-missing').map((f) => f.origin)).toEqual(['known']);
  });
});
