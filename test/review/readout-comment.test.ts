import { afterAll, describe, expect, it } from 'vitest';
import { rmSync } from 'node:fs';
import { openChange } from '../../src/adapters/git.js';
import type { Review } from '../../src/core/review/build-review.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import { renderReviewText } from '../../src/core/report/review-text.js';
import { reviewChange } from '../../src/run/review-change.js';
import { renderGfm, requireCmarkInCi } from '../helpers/cmark.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, recorded } from './scenarios.js';

const made: string[] = [];
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 60_000);

/** The good plan's test is over: the review runs after its planned end (2026-11-29). */
async function review(changes: Record<string, string | null>): Promise<Review> {
  const repo = makeTwoCommitRepo(baseFiles(), changes);
  made.push(repo.root);
  const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr: {}, today: '2026-12-01' });
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
    const r = await review(recorded({ class: 'win', arms: ['treatment'] }, 6400, { decisions }));
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

  it('has no readout section for a plan whose outcome names no totals', async () => {
    const r = await review(recorded({ class: 'win', totals: undefined }, 6400));
    expect(r.plans[0]!.readout).toBeUndefined();
    expect(renderReviewMarkdown(r)).not.toContain('Rule applied:');
  });
});
