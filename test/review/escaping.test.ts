// Untrusted names through the whole review and into GitHub's own Markdown renderer (cmark-gfm with
// the extensions github.com enables: table, autolink, strikethrough, tagfilter). What must hold in
// the rendered HTML: no element we do not write ourselves, links only to the repository's files,
// one hidden marker, no live @mention or #reference from a name, and each name whole in its cell.
import { rmSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown, renderReviewSummary, REVIEW_MARKER } from '../../src/core/report/review-markdown.js';
import type { PlanReadout, Review } from '../../src/core/review/build-review.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { buildReadout } from '../../src/core/readout/build-readout.js';
import { loadTotals } from '../../src/core/totals/load.js';
import { reviewChange } from '../../src/run/review-change.js';
import { renderGfm, requireCmarkInCi } from '../helpers/cmark.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, cleanPlan, goodTotals, planYaml } from './scenarios.js';

const canRender = requireCmarkInCi();
const REPO_URL = 'https://github.com/bramblecart/shop';

/** Names that have broken comments somewhere: cell splits, raw HTML, link breakouts, mentions, markers. */
const NASTY = [
  'odd|<img src=x onerror=alert(3)>',
  'pb|<details>',
  'a)@some-org/everyone',
  '<!-- plumbline:review -->',
  'x</summary><img src=x>',
  '</td></tr><tr><td>cell',
  '<script>alert(1)</script>',
  '[click](javascript:alert(1))',
  '![pixel](https://evil.example/p.png)',
  ')](https://evil.example)',
  'www.evil.example',
  'https://evil.example/x',
  'mail@evil.example',
  '@everyone ping',
  'team @some-org/team',
  'fixes #123',
  '**bold** _em_ ~~gone~~',
  'back\\|slash\\',
  '&lt;img src=x&gt; &#60;b&#62;',
  'tick`in`side',
  '``double',
  'a|b|c|d|e',
  '<b>bold</b>',
];

const ALLOWED = new Set(['p', 'h3', 'h4', 'ul', 'li', 'a', 'code', 'strong', 'em', 'table', 'thead', 'tbody', 'tr', 'th', 'td', 'details', 'summary', 'sub', 'pre']);

function decode(text: string): string {
  return text
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#(\d+);/g, (_, d: string) => String.fromCodePoint(Number(d)))
    .replace(/&#x([0-9a-f]+);/gi, (_, h: string) => String.fromCodePoint(parseInt(h, 16)))
    .replace(/&amp;/g, '&');
}

/** Everything wrong with one rendering (Markdown and the HTML cmark-gfm made of it); empty when it is safe. */
function problems(markdown: string, html = renderGfm(markdown)): string[] {
  const out: string[] = [];
  if (!markdown.startsWith(REVIEW_MARKER) || markdown.split(REVIEW_MARKER).length !== 2) out.push('the hidden marker is not exactly once, at the start');
  if (markdown.split('<!--').length !== 2) out.push('a second HTML comment in the Markdown');
  if (html.split('<!--').length !== 2) out.push('a second HTML comment in the HTML');
  for (const m of html.matchAll(/<\/?([A-Za-z][A-Za-z0-9-]*)([^>]*)>/g)) {
    const tag = m[1]!.toLowerCase();
    if (!ALLOWED.has(tag)) out.push(`element <${tag}>`);
    if (tag === 'a' && !m[0].startsWith('</')) {
      const href = /href="([^"]*)"/.exec(m[2]!)?.[1] ?? '';
      // Only GitHub's permanent link to a file at a commit (github.com/OWNER/REPO/blob/SHA/PATH).
      if (!/^https:\/\/github\.com\/bramblecart\/shop\/blob\/[0-9a-f]{40}\//.test(decode(href))) out.push(`a link to ${href}`);
    }
  }
  // Visible text outside code: GitHub links mentions and references only there.
  const text = decode(html.replace(/<code>[\s\S]*?<\/code>/g, ' ').replace(/<[^>]+>/g, ' '));
  for (const m of text.matchAll(/@[A-Za-z0-9_-]+|#\d+/g)) out.push(`live ${m[0]}`);
  return out;
}

/** The text of every table cell, as a reader sees it (zero-width spaces do not show). */
function cells(html: string): string[] {
  return [...html.matchAll(/<td>([\s\S]*?)<\/td>/g)].map((m) => decode(m[1]!.replace(/<[^>]+>/g, '')).replace(/\u200b/g, ''));
}

describe.skipIf(!canRender)('untrusted names through the review and GitHub’s renderer', () => {
  let review: Review;
  let root: string;
  const keys = NASTY.filter((n) => !/["'`]/.test(n));
  const files = keys.map((k, i) => `src/n${i}/${k.replace(/^\/+/, '')}.ts`);

  beforeAll(async () => {
    // One plan whose events are the names, and one code file per name (at that path) using it as a flag key.
    const plan = cleanPlan({ title: NASTY.join(' '), metrics: { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: NASTY } } });
    const changes: Record<string, string> = { 'experiments/good.yaml': planYaml(plan) };
    keys.forEach((key, i) => (changes[files[i]!] = `if (client.getBooleanValue('${key}', false)) run();\n`));
    const repo = makeTwoCommitRepo(baseFiles(), changes);
    root = repo.root;
    const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr: { body: NASTY.join('\n') } });
    if (outcome.kind !== 'review') throw new Error('settings invalid');
    review = outcome.review;
  }, 60_000);
  afterAll(() => root && rmSync(root, { recursive: true, force: true }));

  it('renders no foreign element, link, marker or mention in the comment and the summary', () => {
    // The flag key reported broken is among the flags the review found in the code (the event is in the plan).
    expect(review.flags.map((f) => f.key)).toContain('pb|<details>');
    expect(review.flags.length).toBeGreaterThan(10);
    for (const markdown of [renderReviewMarkdown(review, { repoUrl: REPO_URL }), renderReviewSummary(review, { repoUrl: REPO_URL })]) {
      expect(problems(markdown)).toEqual([]);
    }
  });

  it('keeps every name whole in its table cell', () => {
    const seen = cells(renderGfm(renderReviewMarkdown(review, { repoUrl: REPO_URL })));
    for (const name of NASTY) expect(seen, name).toContain(name);
    for (const flag of review.flags) {
      expect(seen, flag.key).toContain(flag.key);
      expect(seen.some((c) => c.startsWith(`${flag.file}:1 (added)`)), flag.file).toBe(true);
    }
  });
});

describe.skipIf(!canRender)('any text in any field of a review', () => {
  // Strings built mostly from the characters Markdown, HTML and GitHub give meaning to.
  const nasty = fc.string({ unit: fc.constantFrom(...'|<>`@#&;[]()!*_~\\/:.-= abcx1\'"'.split('')), maxLength: 30 }).filter((s) => s.trim() === s && s.length > 0);
  let base: Review;
  beforeAll(async () => {
    const repo = makeTwoCommitRepo(baseFiles(), { 'experiments/good.yaml': planYaml(cleanPlan({ title: 'Changed' })), 'src/x.ts': "getBooleanValue('good-flag', true)\n" });
    const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr: {} });
    rmSync(repo.root, { recursive: true, force: true });
    if (outcome.kind !== 'review') throw new Error('settings invalid');
    base = outcome.review;
  }, 60_000);

  it('renders safely and keeps table cells whole', () => {
    fc.assert(
      fc.property(fc.array(nasty, { minLength: 6, maxLength: 6 }), ([a, b, c, d, e, f]) => {
        const plan = base.plans[0]!;
        const review: Review = {
          ...base,
          findings: [{ code: 'reason-missing', severity: 'warn', message: `${a} \`${b}\` ${c}`, fix: d!, plan: e!, file: f!, line: 2, origin: 'introduced' }],
          plans: [{ ...plan, title: a!, owners: [b!], events: [{ event: c!, roles: [d!], location: { file: f!, line: 1, column: 1 }, via: 'call' }] }],
          flags: [{ key: e!, file: f!, line: 3, side: 'added', via: 'call', plans: [a!], exempt: false }],
          collisions: [{ plan: a!, other: b!, owners: [c!], otherSurface: d!, platforms: [e!], locales: 'all', trafficShare: 0.5, known: false }],
        };
        const markdown = renderReviewMarkdown(review, { repoUrl: REPO_URL });
        const html = renderGfm(markdown);
        expect(problems(markdown, html)).toEqual([]);
        const seen = cells(html);
        for (const name of [c!, e!, d!]) expect(seen).toContain(name);
      }),
      { numRuns: 40 },
    );
  });

  it('renders the readout section safely: decision, file, flags, arms, amendments, reasons and override', () => {
    const plan = loadPlan(planYaml(cleanPlan()), 'experiments/good.yaml');
    const totals = loadTotals(goodTotals(6400, '4b1d2e7'), 'readouts/good.totals.yaml');
    if (!plan.ok || !totals.ok) throw new Error('fixtures do not load');
    const read = buildReadout(plan.loaded.plan, totals.totals);
    fc.assert(
      fc.property(fc.array(nasty, { minLength: 7, maxLength: 7 }), fc.constantFrom('amended', 'unavailable', 'changed'), fc.boolean(), ([a, b, c, d, e, f, g], status, known) => {
        const rule =
          status === 'amended'
            ? { status, commit: '4b1d2e7', changes: [{ field: a!, before: b!, after: c! }], amendments: [{ date: d!, changed: e!, reason: f! }] }
            : status === 'changed'
              ? { status, commit: '4b1d2e7', changes: [{ field: a!, before: b!, after: c! }] }
              : { status, commit: '4b1d2e7', why: g! };
        const review: Review = {
          ...base,
          plans: [
            {
              ...base.plans[0]!,
              readout: { file: a!, source: 'latest', verdict: 'win', arms: [b!], ships: [c!], decision: d!, primary: read.primary, removes: { flags: [e!], ...(known ? { kept: f! } : { unknown: g! }) }, rule } as PlanReadout,
              override: { class: 'win', ship: [b!], reason: g! },
            },
          ],
        };
        const markdown = renderReviewMarkdown(review, { repoUrl: REPO_URL });
        expect(markdown).toContain('Rule applied:');
        expect(problems(markdown)).toEqual([]);
      }),
      // The names that broke comments before, in every field and every rule status, then random ones.
      { numRuns: 40, examples: (['amended', 'unavailable', 'changed'] as const).flatMap((status) => [0, 7, 14].map((at): [string[], typeof status, boolean] => [NASTY.slice(at, at + 7), status, at % 2 === 0])) },
    );
  });
});
