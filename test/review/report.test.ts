import { readFileSync, rmSync } from 'node:fs';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, cleanPlan, planYaml } from './scenarios.js';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown, renderReviewSummary, REVIEW_MARKER, COMMENT_LIMIT, SUMMARY_LIMIT } from '../../src/core/report/review-markdown.js';
import { formatWeeks, countOf } from '../../src/core/report/numbers.js';
import { renderReviewText } from '../../src/core/report/review-text.js';
import { reviewJson } from '../../src/core/review/report-schema.js';
import type { Review } from '../../src/core/review/build-review.js';
import { reviewChange } from '../../src/run/review-change.js';
// @ts-expect-error: a plain .mjs script without types
import { buildDemoChange } from '../../scripts/demo-change.mjs';

const root = new URL('../../', import.meta.url);
let demo: { root: string; cleanup: () => void };
let review: Review;

beforeAll(async () => {
  process.chdir(new URL('.', root).pathname);
  demo = buildDemoChange();
  const pr = JSON.parse(readFileSync(new URL('demo/change/pull-request.json', root), 'utf8'));
  const outcome = await reviewChange({ change: await openChange(demo.root, 'main', 'feature/slot-nudge'), pr, today: '2026-12-01' });
  if (outcome.kind !== 'review') throw new Error('demo settings invalid');
  review = outcome.review;
}, 60_000);
afterAll(() => demo?.cleanup());

/** SHAs differ from run to run; everything else must not. Base and head stay apart: a link to the base commit is not one to head. */
const normalize = (text: string) =>
  text
    .replaceAll(review.base, '<base-sha>')
    .replaceAll(review.head, '<head-sha>')
    .replace(/\b[0-9a-f]{40}\b/g, '<sha>')
    .replace(new RegExp(`\\b${review.base.slice(0, 7)}\\b`, 'g'), '<base>')
    .replace(new RegExp(`\\b${review.head.slice(0, 7)}\\b`, 'g'), '<head>');

describe('the demo review', () => {
  it('blocks on the widened guardrail of a running test, the missing decision rules and the removed exposure event', () => {
    expect(review.verdict).toBe('blocked');
    expect(review.findings.filter((f) => f.severity === 'block').map((f) => f.code)).toEqual(['plan-frozen', 'event-removed', 'decisions-missing']);
  });

  it('warns that the tip prompt logs exposure after an early return on control', () => {
    expect(review.findings.filter((f) => f.code === 'exposure-one-arm').map((f) => `${f.plan}:${f.file}:${f.line}`)).toEqual(['checkout-tip-prompt:src/checkout/payment.ts:14']);
  });

  it('matches the golden Markdown comment', async () => {
    const markdown = renderReviewMarkdown(review, { repoUrl: 'https://github.com/bramblecart/shop' });
    await expect(normalize(markdown)).toMatchFileSnapshot('golden/demo-review.md');
  });

  it('matches the golden terminal text', async () => {
    await expect(normalize(renderReviewText(review, { color: false }))).toMatchFileSnapshot('golden/demo-review.txt');
  });

  it('writes JSON that validates against the published report schema', () => {
    const schema = JSON.parse(readFileSync(new URL('schema/review-report.schema.json', root), 'utf8'));
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(schema);
    const json = JSON.parse(JSON.stringify(reviewJson(review)));
    expect(validate(json), JSON.stringify(validate.errors)).toBe(true);
    expect(JSON.stringify(json)).not.toMatch(/NaN|Infinity/);
  });
});

describe('untrusted text in the comment', () => {
  const hostile = (): Review => ({
    ...review,
    findings: [
      {
        code: 'reason-missing',
        severity: 'warn',
        message: 'Ping @everyone and @acme/security <!-- plumbline:review --> <img src=x onerror=alert(1)> | col',
        fix: '<script>alert(1)</script>',
        plan: 'evil`plan',
        file: 'src/`weird`.ts',
        line: 3,
        origin: 'introduced',
      },
    ],
  });

  it('cannot ping, inject HTML or spoof the marker', () => {
    const markdown = renderReviewMarkdown(hostile());
    expect(markdown.split(REVIEW_MARKER)).toHaveLength(2);
    expect(markdown.indexOf(REVIEW_MARKER)).toBe(0);
    expect(markdown).not.toMatch(/<img|<script|@everyone|@acme/);
    expect(markdown).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(markdown).toContain('@\u200beveryone');
    expect(markdown).toContain('``evil`plan``');
  });
});

describe('the comment size budget', () => {
  const huge = (): Review => ({
    ...review,
    findings: Array.from({ length: 3000 }, (_, i) => ({ code: 'event-missing', severity: 'warn' as const, message: `Event number ${i} `.repeat(8), fix: 'Log it.', plan: 'p', file: `src/file-${i}.ts`, line: i + 1, origin: 'introduced' as const })),
  });

  it('stays under GitHub’s 65,536 characters and says what it left out', () => {
    const markdown = renderReviewMarkdown(huge(), { fullReport: 'the job summary' });
    expect(markdown.length).toBeLessThanOrEqual(COMMENT_LIMIT);
    const note = /Left out to fit GitHub's comment size limit: the sizing and events tables of 3 plans, 3 rows of the flags table and ([\d,]+) findings\. They are in the job summary\./.exec(markdown);
    expect(note, markdown.slice(-400)).not.toBeNull();
    const listed = (markdown.match(/^- [⛔⚠️ℹ️]+ \*\*/gmu) ?? []).length;
    expect(Number(note![1]!.replace(/,/g, ''))).toBe(3000 - listed);
  });

  it('keeps the whole review in the job summary, whose budget is 1 MiB of UTF-8', () => {
    const many = huge();
    const summary = renderReviewSummary(many);
    expect(new TextEncoder().encode(summary).length).toBeLessThanOrEqual(SUMMARY_LIMIT);
    expect(summary).not.toContain('Left out');
    for (const f of many.findings) expect(summary).toContain(`${f.file}:${f.line}`);
  });

  it('drops the charts first when only they do not fit', () => {
    const full = renderReviewMarkdown(review);
    const limit = full.length - 1;
    const smaller = renderReviewMarkdown(review, {}, limit);
    expect(smaller.length).toBeLessThanOrEqual(limit);
    expect(smaller).toContain("Left out to fit GitHub's comment size limit: the power charts.");
    expect(smaller).toContain('<summary>Sizing and events</summary>');
  });

  // Two screens of a laptop browser hold about 50 lines of a rendered comment (our bound; README's demo section quotes it).
  it('shows the demo review in at most 50 lines outside collapsed details', () => {
    const markdown = renderReviewMarkdown(review);
    let depth = 0;
    let visible = 0;
    for (const line of markdown.split('\n')) {
      if (depth === 0) visible++;
      depth += (line.match(/<details>/g) ?? []).length - (line.match(/<\/details>/g) ?? []).length;
    }
    expect(depth).toBe(0);
    expect(visible).toBeLessThanOrEqual(50);
  });
});

describe('the comment for the person who opened the pull request', () => {
  it('starts with the verdict and the blocking finding’s fix', () => {
    const first = renderReviewMarkdown(review).split('\n')[1]!;
    const blocking = review.findings.find((f) => f.severity === 'block')!;
    expect(first).toBe(`### ⛔ Plumbline: blocked — first: ${blocking.fix}`);
  });

  it('puts the plans the description names first', () => {
    const named = review.plans.map((p) => p.reasons.includes('named in the description'));
    expect(named).toEqual([...named].sort((a, b) => Number(b) - Number(a)));
    expect(named[0]).toBe(true);
    expect(review.plans.map((p) => p.id)).toEqual(['delivery-slot-nudge', 'search-suggestions-v2', 'checkout-tip-prompt']);
  });

  it('shows failed checklist items with a count instead of every ticked box', () => {
    const markdown = renderReviewMarkdown(review);
    expect(markdown).not.toMatch(/^- \[[ x]\] /m);
    expect(markdown).toContain('**9 of 11 hold.** Not yet: Exposure logged in every arm where the change is seen (the logging call read against the flag read, not only the plan’s reach); No collision with a running test.');
  });

  it('says a collision once in sight: the finding, with the table collapsed', () => {
    const markdown = renderReviewMarkdown(review);
    expect(markdown).toMatch(/<details><summary>Running tests on the same surface: 2 overlaps<\/summary>/);
    expect(markdown).not.toContain('#### Running tests on the same surface');
  });

  it('states lengths in weeks for the metric that sets the length, the same in text and Markdown', () => {
    const markdown = renderReviewMarkdown(review);
    const text = renderReviewText(review, { color: false });
    // delivery-slot-nudge: the primary needs 10 days, the guardrail slot-booked 15, so the guardrail sets the length.
    for (const out of [markdown, text]) expect(out).toContain('3 weeks (guardrail slot-booked sets the length: 15 days)');
    // checkout-tip-prompt: the demo change widens its guardrail's tolerance, so the primary sets the length.
    expect(text).toContain('>99.9% for tip-added by the planned end (28 days)');
    expect(markdown).toContain('&gt;99.9% for tip-added by the planned end (28 days)');
    expect(text).not.toMatch(/100\.0%|\b1 weeks\b|\d{4} days/);
  });
});

describe('numbers in words', () => {
  it.each([
    [1, 'week', '1 week'],
    [2, 'week', '2 weeks'],
    [2274, 'day', '2,274 days'],
    [1, 'draft', '1 draft'],
    [0, 'collision', '0 collisions'],
  ])('%s %s -> %s', (n, noun, expected) => expect(countOf(n, noun)).toBe(expected));

  it('leads a length with whole weeks and separates thousands', () => {
    expect(formatWeeks({ days: 2274, weeks: 325 })).toBe('325 weeks (2,274 days)');
    expect(formatWeeks({ days: 7, weeks: 1 })).toBe('1 week (7 days)');
  });

  it('says how long an underpowered test needs in whole weeks, thousands separated', async () => {
    // 20 units a day for a 5% relative lift on a 30% rate: thousands of days.
    const slow = planYaml(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20 } }));
    const repo = makeTwoCommitRepo(baseFiles(), { 'experiments/good.yaml': slow });
    try {
      const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr: {} });
      if (outcome.kind !== 'review') throw new Error('settings invalid');
      const message = outcome.review.findings.find((f) => f.code === 'underpowered')!.message;
      expect(message).toMatch(/ It needs \d{1,3}(,\d{3})* weeks \(\d{1,3}(,\d{3})+ days\)\.$/);
    } finally {
      rmSync(repo.root, { recursive: true, force: true });
    }
  });

});
