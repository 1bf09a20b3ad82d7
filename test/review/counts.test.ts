// The counts of a review mean one thing in every format: the findings this change introduces, by severity,
// and how many already held before it. Text, Markdown and JSON must say the same numbers on the same review.
import { readFileSync, rmSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import { renderReviewText } from '../../src/core/report/review-text.js';
import type { Review } from '../../src/core/review/build-review.js';
import { reviewJson } from '../../src/core/review/report-schema.js';
import { reviewChange } from '../../src/run/review-change.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE, CART_CODE_TOUCHED, cleanPlan, planYaml } from './scenarios.js';
// @ts-expect-error: a plain .mjs script without types
import { buildDemoChange } from '../../scripts/demo-change.mjs';

const root = new URL('../../', import.meta.url);
const made: string[] = [];
let demo: { root: string; cleanup: () => void } | undefined;
afterAll(() => {
  demo?.cleanup();
  made.forEach((dir) => rmSync(dir, { recursive: true, force: true }));
}, 60_000);

async function reviewOf(files: Record<string, string>, changes: Record<string, string | null>, today: string, ends: [string, string] = ['main', 'HEAD']): Promise<Review> {
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  const outcome = await reviewChange({ change: await openChange(repo.root, ...ends), pr: {}, today });
  if (outcome.kind !== 'review') throw new Error('settings invalid');
  return outcome.review;
}

interface Said {
  block: number;
  warn: number;
  note: number;
  known: number;
  /** Known findings that block, when the report names them. */
  knownBlocking: number;
}

const number = (text: string) => Number(text.replace(/,/g, ''));

/** "3 blocking findings, 8 warnings, 1 note" and "4 findings, 1 of them blocking" (or "2 blocking findings") into numbers. */
function parseCounts(introduced: string, known: string): Said {
  const said: Said = { block: 0, warn: 0, note: 0, known: 0, knownBlocking: 0 };
  for (const part of introduced ? introduced.split(', ') : []) {
    const m = /^([\d,]+) (blocking findings?|warnings?|notes?)$/.exec(part);
    if (!m) throw new Error(`cannot read "${part}" in "${introduced}"`);
    said[m[2]!.startsWith('blocking') ? 'block' : m[2]!.startsWith('warning') ? 'warn' : 'note'] = number(m[1]!);
  }
  if (known) {
    const all = /^([\d,]+) blocking findings?$/.exec(known);
    const some = /^([\d,]+) findings?(?:, ([\d,]+) of them blocking)?$/.exec(known);
    if (all) said.known = said.knownBlocking = number(all[1]!);
    else if (some) [said.known, said.knownBlocking] = [number(some[1]!), some[2] ? number(some[2]) : 0];
    else throw new Error(`cannot read "${known}"`);
  }
  return said;
}

/** What the terminal text's first line says: "(this change: …; already known before it: …)", or nothing when there are no findings. */
function fromText(text: string): Said {
  const first = text.split('\n')[0]!;
  const m = /\(this change: (.*?)(?:; already known before it: (.*))?\) for [0-9a-f]{7}\.\.\.[0-9a-f]{7}$/.exec(first);
  if (!m) return parseCounts('', '');
  return parseCounts(m[1] === 'nothing new' ? '' : m[1]!, m[2] ?? '');
}

/** What the comment's counts line says: "This change: …. Already known before it: …." */
function fromMarkdown(markdown: string): Said {
  const line = markdown.split('\n').find((l) => l.endsWith('</sub>') && l.includes('<sub>Compared'))!;
  const introduced = /This change: (.*?)\. (?:Already|<sub>)/.exec(line)?.[1] ?? '';
  const known = /Already known before it: (.*?)\. <sub>/.exec(line)?.[1] ?? '';
  return parseCounts(introduced, known);
}

/** The JSON report's counts, and the same counted from its findings. */
function fromJson(review: Review): { counts: Said; recounted: Said } {
  const json = JSON.parse(JSON.stringify(reviewJson(review))) as { counts: Omit<Said, 'knownBlocking'>; findings: { severity: 'block' | 'warn' | 'note'; origin: string }[] };
  const knownBlocking = json.findings.filter((f) => f.origin === 'known' && f.severity === 'block').length;
  const recounted: Said = { block: 0, warn: 0, note: 0, known: 0, knownBlocking };
  for (const f of json.findings) {
    if (f.origin === 'known') recounted.known++;
    else recounted[f.severity]++;
  }
  return { counts: { ...json.counts, knownBlocking }, recounted };
}

const noReason = { change: 'A clearer cart.', 'expected-direction': 'increase' };
const primaryOnly = { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: ['order_done'] } };
const noLossRule = { win: 'Ship.', flat: 'Drop.', 'guardrail-breach': 'Stop.' };

const reviews: [string, () => Promise<Review>][] = [
  [
    'the demo change',
    async () => {
      demo = buildDemoChange();
      const pr = JSON.parse(readFileSync(new URL('demo/change/pull-request.json', root), 'utf8'));
      const outcome = await reviewChange({ change: await openChange(demo!.root, 'main', 'feature/slot-nudge'), pr, today: '2026-12-01' });
      if (outcome.kind !== 'review') throw new Error('demo settings invalid');
      return outcome.review;
    },
  ],
  // A warning already known, a new one.
  [
    'a warning known and one introduced',
    () =>
      reviewOf(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', hypothesis: noReason })) }), { 'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', hypothesis: noReason, metrics: primaryOnly })), 'src/cart.ts': CART_CODE_TOUCHED }, '2026-10-01'),
  ],
  // Only a known blocking finding: nothing new, but the merge is still blocked.
  ['a known blocking finding only', () => reviewOf(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ decisions: noLossRule })) }), { 'experiments/good.yaml': planYaml(cleanPlan({ decisions: noLossRule, title: 'Renamed' })) }, '2026-10-01')],
  // A known blocking finding beside a known warning and new findings of every severity.
  [
    'known findings of two severities beside new ones',
    () =>
      reviewOf(
        baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', decisions: noLossRule, hypothesis: noReason })) }),
        { 'experiments/good.yaml': planYaml(cleanPlan({ state: 'draft', decisions: noLossRule, hypothesis: noReason, metrics: primaryOnly, window: { start: '2026-11-02', end: '2026-11-12' } })), 'src/cart.ts': CART_CODE_TOUCHED, 'src/new.ts': "client.getBooleanValue('new-flag', false);\n" },
        '2026-10-01',
      ),
  ],
  ['a clean change', () => reviewOf(baseFiles(), { 'src/cart.ts': CART_CODE_TOUCHED }, '2026-11-16')],
  ['nothing to check', () => reviewOf(baseFiles(), { 'README.md': 'docs\n' }, '2026-11-16')],
  ['swapped refs', () => reviewOf(baseFiles(), { 'src/cart.ts': CART_CODE.replace("track('cart_error')", "track('cart_failed')") }, '2026-11-16', ['HEAD', 'main'])],
];

const built: Review[] = [];

describe.each(reviews)('the counts of %s', (_name, make) => {
  let review: Review;
  beforeAll(async () => {
    review = await make();
    built.push(review);
  }, 120_000);

  it('are the same in the text, the Markdown and the JSON report, and count what the findings say', () => {
    const json = fromJson(review);
    // The JSON counts are the findings this change introduces by severity, and the known ones.
    expect(json.counts).toEqual(json.recounted);
    expect(fromText(renderReviewText(review, { color: false }))).toEqual(json.counts);
    expect(fromMarkdown(renderReviewMarkdown(review))).toEqual(json.counts);
  });

  it('leave the verdict to every finding: a known blocking one still blocks', () => {
    expect(review.verdict === 'blocked').toBe(review.findings.some((f) => f.severity === 'block'));
  });
});

describe('the reviews above', () => {
  it('hold known and introduced findings of each severity between them', () => {
    expect(built).toHaveLength(reviews.length);
    const kinds = new Set(built.flatMap((r) => r.findings.map((f) => `${f.origin} ${f.severity}`)));
    for (const kind of ['introduced block', 'introduced warn', 'introduced note', 'known block', 'known warn']) expect(kinds).toContain(kind);
  });
});
