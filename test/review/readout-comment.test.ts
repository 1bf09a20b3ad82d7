import { afterAll, describe, expect, it } from 'vitest';
import { rmSync } from 'node:fs';
import { openChange } from '../../src/adapters/git.js';
import type { Review } from '../../src/core/review/build-review.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import { renderReviewText } from '../../src/core/report/review-text.js';
import { reviewChange } from '../../src/run/review-change.js';
import { renderGfm, requireCmarkInCi } from '../helpers/cmark.js';
import { historyOf, LAUNCH_COMMIT, makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE, cleanPlan, goodTotals, planYaml, recorded } from './scenarios.js';

const made: string[] = [];
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 60_000);

/** The good plan's test is over: the review runs after its planned end (2026-11-29). */
async function review(changes: Record<string, string | null>, base: Record<string, string> = baseFiles(), launch?: Record<string, string>): Promise<Review> {
  const repo = makeTwoCommitRepo(base, changes, launch ? { launch } : {});
  made.push(repo.root);
  const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), history: historyOf(repo.root), pr: {}, today: '2026-12-01' });
  if (outcome.kind !== 'review') throw new Error(JSON.stringify(outcome.problems));
  return outcome.review;
}

// A decision with Markdown emphasis, raw HTML and a mention: the comment must show it as written, inert.
const WIN = 'Ship *it* to <b>everyone</b>, tell @team';
const decisions = { win: WIN, flat: 'Drop.', loss: 'Drop and study.', 'guardrail-breach': 'Stop.' };
const cmark = requireCmarkInCi();

describe('the readout section of the review comment', () => {
  // 6,400 of 20,000 against 6,000 of 20,000: +2 percentage points, +6.67% relative, a clear win.
  it('applies the rule in its first line, quoting the decision safely, then gives the primary absolute beside relative', async () => {
    // The decisions were registered at launch (the base commit), as the rule applied must be.
    const r = await review(recorded({ class: 'win', arms: ['treatment'] }, 6400, { decisions }), baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ decisions })) }));
    const md = renderReviewMarkdown(r);
    const section = md.split('#### Plan `good`')[1]!;
    const rule = section.split('\n').find((l) => l.startsWith('Rule applied:'));
    expect(rule).toBe('Rule applied: **win**: «Ship \\*it\\* to &lt;b&gt;everyone&lt;/b&gt;, tell @\u200bteam». This change does that.');
    // The primary: treatment row with the difference in percentage points and the relative change, each with its interval.
    // By hand: SE = √(0.30·0.70/20,000 + 0.32·0.68/20,000) = 0.004624; ±1.96·SE = ±0.906 pp.
    expect(section).toMatch(/\| treatment \| 30\.0% \(n 20,000\) \| 32\.0% \(n 20,000\) \| \+2 pp \\\[\+1\.09, \+2\.91\\\] \| \+6\.67% \\\[\+[\d.]+%, \+[\d.]+%\\\] \|[^\n]*\| win \|/);
    expect(md.indexOf('Rule applied:')).toBeLessThan(md.indexOf('| treatment |'));
    expect(renderReviewText(r, { color: false })).toContain('  Rule applied: win: «Ship *it* to <b>everyone</b>, tell @team». This change does that.');
    if (!cmark) return;
    // GitHub's renderer (cmark-gfm): the quote is text, not emphasis or a tag.
    const html = renderGfm(md);
    expect(html).toContain('<p>Rule applied: <strong>win</strong>: «Ship *it* to &lt;b&gt;everyone&lt;/b&gt;, tell @\u200bteam». This change does that.</p>');
    expect(html).not.toContain('<b>everyone');
    expect(html).not.toMatch(/<em>it<\/em>/);
  });

  it('says what the change records instead when it differs from the rule', async () => {
    // 6,050 against 6,000: the interval excludes the 5% effect both ways, so the rule gives flat.
    const r = await review(recorded({ class: 'win', arms: ['treatment'] }, 6050));
    const md = renderReviewMarkdown(r);
    expect(md).toContain('Rule applied: **flat**: «Drop.». This change records **win** instead.');
    expect(renderReviewText(r, { color: false })).toContain('Rule applied: flat: «Drop.». This change records win instead.');
  });

  it('puts an override right after the headline, reason quoted as written', async () => {
    const reason = 'Support costs *fall* <i>either</i> way';
    const r = await review(recorded({ class: 'win', arms: ['treatment'], override: { class: 'win', reason } }, 6050));
    const lines = renderReviewMarkdown(r).split('\n');
    expect(lines[1]).toMatch(/^### /);
    const at = lines.findIndex((l) => l.startsWith('**Override to judge**'));
    expect(at).toBeGreaterThan(1);
    expect(lines.slice(2, at).every((l) => l.trim() === '')).toBe(true);
    expect(lines[at]).toBe('**Override to judge**: `good` acts on **win** where the rule gives **flat**. Reason given: «Support costs \\*fall\\* &lt;i&gt;either&lt;/i&gt; way»');
    expect(renderReviewText(r, { color: false }).split('\n')[1]).toBe('Override to judge: good acts on win where the rule gives flat. Reason given: «Support costs *fall* <i>either</i> way»');
    if (!cmark) return;
    expect(renderGfm(lines.join('\n'))).toContain('Reason given: «Support costs *fall* &lt;i&gt;either&lt;/i&gt; way»');
  });

  it('has no readout section for a plan whose outcome names no totals, when the change has none either', async () => {
    const { 'readouts/good.totals.yaml': _totals, ...changes } = recorded({ class: 'win', totals: undefined }, 6400) as Record<string, string | null>;
    const r = await review(changes);
    expect(r.plans[0]!.readout).toBeUndefined();
    expect(renderReviewMarkdown(r)).not.toContain('Rule applied:');
  });
});

// A test that launched (the plan committed), then concluded with its totals on main; the change only edits code.
const LAUNCH = { 'experiments/good.yaml': planYaml(cleanPlan()), 'src/cart.ts': CART_CODE };
const concludedWith = (totals: string | undefined, plan: Record<string, unknown> = {}) => ({
  'experiments/good.yaml': planYaml(cleanPlan({ state: 'concluded', ...plan })),
  'src/cart.ts': CART_CODE,
  ...(totals !== undefined ? { 'readouts/good.totals.yaml': totals } : {}),
});
const KEEPS_TREATMENT = { 'src/cart.ts': "export function cart(client, track) {\n  track('cart_viewed');\n  track('order_done');\n  track('cart_error');\n}\n" };
const KEEPS_CONTROL = { 'src/cart.ts': "export function cart(client, track) {\n  track('cart_viewed');\n  track('cart_error');\n}\n" };
const ruleLine = (r: Review) => renderReviewMarkdown(r).split('\n').find((l) => l.startsWith('Rule applied:'));
const codes = (r: Review) => r.findings.map((f) => f.code);

describe('a change that removes a concluded test’s flag read, the plan untouched', () => {
  it('links the latest totals on main and says the change does what the rule says when it keeps the winner', async () => {
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6400, LAUNCH_COMMIT)), LAUNCH);
    expect(r.plans[0]!.readout).toMatchObject({ source: 'latest', verdict: 'win', ships: ['treatment'], removes: { flags: ['good-flag'], kept: 'treatment' }, rule: { status: 'same' } });
    expect(ruleLine(r)).toBe('Rule applied: **win**: «Ship.». This change does that.');
    expect(renderReviewMarkdown(r)).toMatch(/<sub>Read from `readouts\/good\.totals\.yaml`, the latest totals of the test this change ends; the rule as registered at launch \(`[0-9a-f]{7}/);
    expect(codes(r)).not.toContain('outcome-mismatch');
    if (!cmark) return;
    expect(renderGfm(renderReviewMarkdown(r))).toContain('<p>Rule applied: <strong>win</strong>: «Ship.». This change does that.</p>');
  });

  it('picks the totals with the latest data when there are several', async () => {
    const early = goodTotals(6050, LAUNCH_COMMIT).replace('data-through: 2026-11-29', 'data-through: 2026-11-28');
    const r = await review(KEEPS_TREATMENT, { ...concludedWith(goodTotals(6400, LAUNCH_COMMIT)), 'readouts/z-early.totals.yaml': early }, LAUNCH);
    expect(r.plans[0]!.readout).toMatchObject({ file: 'readouts/good.totals.yaml', verdict: 'win' });
  });

  it('blocks a change that keeps control when the rule ships the winner', async () => {
    const r = await review(KEEPS_CONTROL, concludedWith(goodTotals(6400, LAUNCH_COMMIT)), LAUNCH);
    expect(ruleLine(r)).toBe('Rule applied: **win**: «Ship.». This change removes `good-flag` and keeps **control**, but the rule ships **treatment**.');
    const finding = r.findings.find((f) => f.code === 'outcome-mismatch');
    expect(finding?.severity).toBe('block');
    expect(finding?.message).toBe('good: this change removes `good-flag` and keeps control, but the registered rule gives "win" on readouts/good.totals.yaml, which ships treatment.');
  });

  it('blocks a change that ships the treatment when the rule says flat, and says what the rule said to do', async () => {
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6050, LAUNCH_COMMIT)), LAUNCH);
    expect(ruleLine(r)).toBe('Rule applied: **flat**: «Drop.». This change removes `good-flag` and keeps **treatment**, but the rule ships **control**.');
    expect(codes(r)).toContain('outcome-mismatch');
    // Keeping control is what flat says.
    const kept = await review(KEEPS_CONTROL, concludedWith(goodTotals(6050, LAUNCH_COMMIT)), LAUNCH);
    expect(ruleLine(kept)).toBe('Rule applied: **flat**: «Drop.». This change does that.');
    expect(codes(kept)).not.toContain('outcome-mismatch');
  });

  it('lets an override with the arm shipped and a reason stand, for reviewers to judge', async () => {
    const override = { reason: 'Support costs fall either way.', ship: ['treatment'] };
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6050, LAUNCH_COMMIT), { outcome: { reason: 'Shipped for support costs.', override } }), LAUNCH);
    expect(codes(r)).toContain('outcome-override');
    expect(codes(r)).not.toContain('outcome-mismatch');
  });

  it('says when it could not tell which arm the change keeps', async () => {
    const passed = "export function cart(client, track) {\n  track('cart_viewed');\n  render(client.getBooleanValue('good-flag', false));\n  track('order_done');\n  track('cart_error');\n}\n";
    const launch = { ...LAUNCH, 'src/cart.ts': passed };
    const r = await review({ 'src/cart.ts': passed.replace("client.getBooleanValue('good-flag', false)", 'true') }, { ...concludedWith(goodTotals(6400, LAUNCH_COMMIT)), 'src/cart.ts': passed }, launch);
    expect(ruleLine(r)).toMatch(/^Rule applied: \*\*win\*\*: «Ship\.»\. This change removes `good-flag`; could not tell which arm it keeps \(src\/cart\.ts:3: the flag’s value is neither branched on nor assigned to a variable\): check that it ships \*\*treatment\*\*\.$/);
    expect(codes(r)).not.toContain('outcome-mismatch');
  });

  it('finds a test ended without a readout: no totals and no outcome', async () => {
    const r = await review(KEEPS_TREATMENT, concludedWith(undefined), LAUNCH);
    expect(r.plans[0]!.readout).toBeUndefined();
    const finding = r.findings.find((f) => f.code === 'readout-missing');
    expect(finding?.message).toBe('This change removes the last read of `good-flag`, ending good, without a readout: no arm totals for it were found (a readouts/ folder or a *.totals.yaml file) and its plan records no outcome.');
    // A live test past its end says it once, as readout-missing, not also outcome-missing.
    const live = await review(KEEPS_TREATMENT, concludedWith(undefined, { state: 'live' }), LAUNCH);
    expect(codes(live)).toContain('readout-missing');
    expect(codes(live)).not.toContain('outcome-missing');
  });
});

describe('the rule registered at launch', () => {
  const changedWin = { decisions: { win: 'Ship to everyone at once.', flat: 'Drop.', loss: 'Drop and study.', 'guardrail-breach': 'Stop.' } };

  it('applies the launch rule when the plan was changed after launch without an amendment, and blocks', async () => {
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6400, LAUNCH_COMMIT), changedWin), LAUNCH);
    expect(ruleLine(r)).toBe('Rule applied: **win**: «Ship.». This change does that.');
    const finding = r.findings.find((f) => f.code === 'rule-changed');
    expect(finding?.severity).toBe('block');
    expect(finding?.message).toMatch(/^The rule was changed after launch: good at the plan-commit of readouts\/good\.totals\.yaml \([0-9a-f]{7,}\) differs from today's plan in decisions\.win \(Ship\. → Ship to everyone at once\.\), and no amendment records it\./);
    expect(renderReviewMarkdown(r)).toContain('the plan was changed since without an amendment (decisions.win).</sub>');
  });

  it.each([
    ['design.alpha', { design: { ...(cleanPlan().design as object), alpha: 0.1 } }],
    ['metrics.guardrails[errors].tolerance', { metrics: { ...(cleanPlan().metrics as Record<string, unknown>), guardrails: [{ name: 'errors', kind: 'proportion', baseline: { rate: 0.02 }, events: ['cart_error'], direction: 'decrease', tolerance: { relative: 0.5 } }] } }],
    ['design.arms', { design: { ...(cleanPlan().design as object), arms: [{ name: 'control', weight: 0.3 }, { name: 'treatment', weight: 0.7 }] } }],
  ])('reports a change of %s', async (field, plan) => {
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6400, LAUNCH_COMMIT), plan), LAUNCH);
    expect(r.findings.find((f) => f.code === 'rule-changed')?.message).toContain(field);
  });

  it('applies an amended rule, and says so, when an amendment records the change', async () => {
    const amended = { ...changedWin, amendments: [{ date: '2026-11-10', changed: 'win decision widened', reason: 'Support is ready for everyone.' }] };
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6400, LAUNCH_COMMIT), amended), LAUNCH);
    expect(ruleLine(r)).toBe('Rule applied: **win**: «Ship to everyone at once.». This change does that.');
    expect(codes(r)).not.toContain('rule-changed');
    expect(renderReviewMarkdown(r)).toContain('the rule as amended after launch (');
  });

  it('warns, and uses today’s plan, when the plan-commit is not in the repository', async () => {
    const r = await review(KEEPS_TREATMENT, concludedWith(goodTotals(6400, '4b1d2e7'), changedWin), LAUNCH);
    expect(ruleLine(r)).toBe('Rule applied: **win**: «Ship to everyone at once.». This change does that.');
    const finding = r.findings.find((f) => f.code === 'launch-plan-unavailable');
    expect(finding?.severity).toBe('warn');
    expect(finding?.message).toBe("readouts/good.totals.yaml names plan-commit 4b1d2e7, but the plan as registered then cannot be read: the commit 4b1d2e7 is not in this repository (a shallow clone, or a mistyped plan-commit). The readout uses today's plan and cannot show that it is the rule registered at launch.");
    expect(renderReviewMarkdown(r)).toContain("today's plan, because the plan at `4b1d2e7` cannot be read");
  });
});
