import { readFileSync, rmSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown, REVIEW_MARKER, COMMENT_LIMIT } from '../../src/core/report/review-markdown.js';
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
});
afterAll(() => demo?.cleanup());

/** SHAs differ from run to run; everything else must not. */
const normalize = (text: string) => text.replace(/\b[0-9a-f]{40}\b/g, '<sha>').replace(/Compared [0-9a-f]{7}…[0-9a-f]{7}/, 'Compared <base>…<head>').replace(/for [0-9a-f]{7}\.\.\.[0-9a-f]{7}/, 'for <base>...<head>');

describe('the demo review', () => {
  it('blocks on the widened guardrail of a running test, the missing decision rules and the removed exposure event', () => {
    expect(review.verdict).toBe('blocked');
    expect(review.findings.filter((f) => f.severity === 'block').map((f) => f.code)).toEqual(['plan-frozen', 'decisions-missing', 'event-removed']);
  });

  it('warns that the tip prompt logs exposure after an early return on control', () => {
    expect(review.findings.filter((f) => f.code === 'exposure-one-arm').map((f) => `${f.plan}:${f.file}:${f.line}`)).toEqual(['checkout-tip-prompt:src/checkout/payment.ts:14']);
  });

  it('matches the golden Markdown comment', async () => {
    const markdown = renderReviewMarkdown(review, { link: (path, line) => `https://github.com/bramblecart/shop/blob/${review.head}/${path}#L${line}` });
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
    findings: Array.from({ length: 3000 }, (_, i) => ({ code: 'event-missing', severity: 'warn' as const, message: `Event number ${i} `.repeat(8), fix: 'Log it.', plan: 'p', file: `src/file-${i}.ts`, line: i + 1 })),
  });

  it('stays under GitHub’s 65,536 characters and says what it left out', () => {
    const markdown = renderReviewMarkdown(huge(), { fullReport: 'the job summary' });
    expect(markdown.length).toBeLessThanOrEqual(COMMENT_LIMIT);
    expect(markdown).toContain("To fit GitHub's comment size limit, this comment leaves out the power charts, the sizing and events tables, some findings; the full report is in the job summary.");
    expect(markdown).toMatch(/… and \d+ more findings in the job summary\./);
  });

  it('drops the charts first when only they do not fit', () => {
    const full = renderReviewMarkdown(review);
    const limit = full.length - 1;
    const smaller = renderReviewMarkdown(review, {}, limit);
    expect(smaller.length).toBeLessThanOrEqual(limit);
    expect(smaller).toContain('leaves out the power charts.');
    expect(smaller).toContain('<summary>Sizing: units, days and power</summary>');
  });
});
