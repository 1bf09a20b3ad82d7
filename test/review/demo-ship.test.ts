import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import type { Review } from '../../src/core/review/build-review.js';
import { reviewChange } from '../../src/run/review-change.js';
import { renderGfm, requireCmarkInCi } from '../helpers/cmark.js';
import { historyOf } from '../helpers/git-repo.js';
// @ts-expect-error: a plain .mjs script without types
import { buildShipDemo } from '../../scripts/demo-change.mjs';

/**
 * The demo pull request that ships a winner (demo/ship/): checkout-wallet-first passed its planned end,
 * its outcome is recorded by `plumbline readout --record` (the built CLI, run by the demo builder) and the
 * flag read removed, keeping saved wallets first. The comment must open its readout with the rule applied.
 */
const root = new URL('../../', import.meta.url);
let demo: { root: string; cleanup: () => void };
let review: Review;
let markdown: string;
const cmark = requireCmarkInCi();

beforeAll(async () => {
  process.chdir(new URL('.', root).pathname);
  demo = buildShipDemo();
  const pr = JSON.parse(readFileSync(new URL('demo/ship/pull-request.json', root), 'utf8'));
  const outcome = await reviewChange({ change: await openChange(demo.root, 'main', 'ship/wallet-first'), history: historyOf(demo.root), pr, today: '2026-12-08' });
  if (outcome.kind !== 'review') throw new Error('demo settings invalid');
  review = outcome.review;
  markdown = renderReviewMarkdown(review, { repoUrl: 'https://github.com/bramblecart/shop' });
}, 120_000);
afterAll(() => demo?.cleanup());

const normalize = (text: string) => text.replaceAll(review.base, '<base-sha>').replaceAll(review.head, '<head-sha>').replace(/\b[0-9a-f]{40}\b/g, '<sha>').replace(/Compared [0-9a-f]{7}…[0-9a-f]{7}/, 'Compared <base>…<head>').replace(/\(`[0-9a-f]{7}`\)/g, '(`<launch>`)');

describe('the demo pull request that ships the winner', () => {
  it('records the outcome with plumbline readout --record, removes the flag and keeps the winning arm', () => {
    const plan = review.plans.find((p) => p.id === 'checkout-wallet-first');
    expect(plan?.readout).toMatchObject({ source: 'outcome', verdict: 'win', recorded: 'win', ships: ['treatment'], removes: { flags: ['checkout-wallet-first'], kept: 'treatment' }, rule: { status: 'same' } });
    expect(review.findings.filter((f) => f.plan === 'checkout-wallet-first')).toEqual([]);
    expect(review.verdict).toBe('clear');
  });

  it('opens the readout section with the rule applied, then where it was read from', () => {
    const lines = markdown.split('\n');
    const at = lines.findIndex((l) => l.startsWith('Rule applied:'));
    expect(lines[at]).toBe('Rule applied: **win**: «Make wallets first for everyone.». This change does that.');
    // Nothing of the readout comes before it in the plan's section.
    const section = lines.slice(lines.findIndex((l) => l.startsWith('#### Plan `checkout-wallet-first`')), at);
    expect(section.join('\n')).not.toMatch(/Primary|payment-completed|readouts\//);
    expect(lines[at + 2]).toMatch(/^<sub>Read from `readouts\/checkout-wallet-first\.totals\.yaml`, named by the recorded outcome; the rule as registered at launch \(`[0-9a-f]{7}`\)\.<\/sub>$/);
  });

  it('matches the golden Markdown comment', async () => {
    await expect(normalize(markdown)).toMatchFileSnapshot('golden/demo-ship-review.md');
  });

  it('renders with GitHub’s renderer (cmark-gfm): the rule as its own paragraph, then the primary’s table', () => {
    if (!cmark) return;
    const html = renderGfm(markdown);
    const rule = '<p>Rule applied: <strong>win</strong>: «Make wallets first for everyone.». This change does that.</p>';
    expect(html).toContain(rule);
    const after = html.slice(html.indexOf(rule));
    // The source line, the primary's title, then its table with the treatment row; the next paragraph is the length line, not run into the readout.
    expect(after).toMatch(/^<p>Rule applied:[^\n]*<\/p>\n<p><sub>Read from <code>readouts\/checkout-wallet-first\.totals\.yaml<\/code>[^\n]*<\/sub><\/p>\n<p><strong>Primary: <code>payment-completed<\/code><\/strong>[^\n]*<\/p>\n<table>\n<thead>\n<tr>\n<th>arm<\/th>/);
    const table = after.slice(after.indexOf('<table>'), after.indexOf('</table>'));
    expect(table).toContain('<td>treatment</td>');
    expect(table).toContain('<td>win</td>');
    expect(after).toMatch(/<\/table>\n<p>Minimum detectable effect: ±0\.821 pp\.<\/p>\n<p><strong>Length:<\/strong>/);
  });
});
