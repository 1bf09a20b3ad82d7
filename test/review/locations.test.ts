// A finding located at a line the change removes (or in a plan it deletes) is read at the base commit:
// its link goes to the base commit's file, and every format says so, as a reviewer on GitHub expects.
import { execFileSync } from 'node:child_process';
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import { renderReviewText } from '../../src/core/report/review-text.js';
import type { Review, ReviewFinding } from '../../src/core/review/build-review.js';
import { reviewJson } from '../../src/core/review/report-schema.js';
import { planAnnotations } from '../../src/action/effects.js';
import { reviewChange } from '../../src/run/review-change.js';
import { renderGfm, requireCmarkInCi } from '../helpers/cmark.js';
import { makeTwoCommitRepo, type TwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE, cleanPlan, planYaml } from './scenarios.js';

const canRender = requireCmarkInCi();
const REPO_URL = 'https://github.com/acme/shop';
/** Lines the change adds at the top of a file: after them, a line number at base points elsewhere at head. */
const PADDING = Array.from({ length: 20 }, (_, i) => `// padding ${i + 1}`).join('\n') + '\n';
/** Mid-window of the clean plan (2026-11-02 to 2026-11-29): its test is running. */
const TODAY = '2026-11-16';

const made: string[] = [];
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 60_000);

async function reviewOf(files: Record<string, string>, changes: Record<string, string | null>): Promise<{ repo: TwoCommitRepo; review: Review }> {
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), pr: {}, today: TODAY });
  if (outcome.kind !== 'review') throw new Error('settings invalid');
  return { repo, review: outcome.review };
}

/** One line of a file at a commit, read with git itself. */
function lineAt(repo: TwoCommitRepo, commit: string, path: string, line: number): string | undefined {
  try {
    return execFileSync('git', ['show', `${commit}:${path}`], { cwd: repo.root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).split('\n')[line - 1];
  } catch {
    return undefined; // not in that commit
  }
}

const other = planYaml(cleanPlan({ id: 'other', flags: ['other-flag'], owners: ['@owner-two'], surface: { path: 'shop/cart/total' }, exposure: { event: 'keeper_seen' } }));

// Each finding whose place comes from the base side, on a change that adds lines above it, and what its line at base holds.
const cases: { code: string; files: Record<string, string>; changes: Record<string, string | null>; atBase: string }[] = [
  {
    code: 'event-removed',
    files: baseFiles({ 'experiments/other.yaml': other, 'src/keeper.ts': "export function keep(track) {\n  track(\n    'keeper_seen',\n  );\n}\n" }),
    changes: { 'src/keeper.ts': `${PADDING}export function keep(track) {\n  console.log('kept');\n}\n` },
    atBase: "'keeper_seen'",
  },
  {
    code: 'test-ended-early',
    files: baseFiles(),
    changes: { 'src/cart.ts': PADDING + CART_CODE.replace("if (client.getBooleanValue('good-flag', false)) {", 'if (true) {') },
    atBase: "getBooleanValue('good-flag'",
  },
  {
    code: 'flag-without-plan',
    files: baseFiles({ 'src/old.ts': "export const old = (client) => client.getBooleanValue('old-flag', false);\n" }),
    changes: { 'src/old.ts': `${PADDING}export const old = () => false;\n` },
    atBase: "'old-flag'",
  },
  {
    code: 'treatment-changed',
    // Only a removed line near the read: the change is seen at the base commit.
    files: baseFiles({ 'src/cart.ts': CART_CODE.replace("    track('order_done');\n", "    track('order_done');\n    showBanner('Free delivery');\n") }),
    changes: { 'src/cart.ts': PADDING + CART_CODE },
    atBase: 'showBanner',
  },
  {
    code: 'plan-deleted',
    files: baseFiles(),
    changes: { 'experiments/good.yaml': null },
    atBase: 'id: good',
  },
];

describe.each(cases)('$code at a line of the base commit', ({ code, files, changes, atBase }) => {
  let repo: TwoCommitRepo;
  let review: Review;
  let finding: ReviewFinding;
  it('is read at the base commit, where its line holds what it is about', async () => {
    ({ repo, review } = await reviewOf(files, changes));
    finding = review.findings.find((f) => f.code === code)!;
    expect(finding, JSON.stringify(review.findings.map((f) => f.code))).toBeDefined();
    expect(finding.side).toBe('base');
    expect(lineAt(repo, repo.base, finding.file!, finding.line!)).toContain(atBase);
    // The same number at head is another line (or the file is gone): a head link would show the wrong code.
    expect(lineAt(repo, repo.head, finding.file!, finding.line!) ?? '').not.toContain(atBase);
    expect(reviewJson(review).findings.find((f) => f.code === code)).toMatchObject({ side: 'base', file: finding.file, line: finding.line });
  }, 60_000);

  it.skipIf(!canRender)('links to the base commit’s file in GitHub’s permanent-link form, and says it is at the base', () => {
    // GitHub's documented form of a link to a line of a file at a commit: https://github.com/OWNER/REPO/blob/SHA/PATH#Lnn
    // (GitHub Docs, "Getting permanent links to files"); the rendering is GitHub's own renderer's (cmark-gfm).
    const html = renderGfm(renderReviewMarkdown(review, { repoUrl: REPO_URL }));
    const item = html.split('\n').find((l) => l.includes(`<strong>${code}</strong>`))!;
    expect(item).toContain(`<a href="${REPO_URL}/blob/${repo.base}/${finding.file}#L${finding.line}"><code>${finding.file}:${finding.line}</code></a> (at the base)`);
    expect(item).not.toContain(repo.head);
  });

  it('says in the terminal text that the line is at the base commit', () => {
    expect(renderReviewText(review, { color: false })).toContain(`${finding.file}:${finding.line} (at the base ${repo.base.slice(0, 7)}): `);
  });

  it('does not annotate the head commit’s line of that number', () => {
    const annotation = planAnnotations(review, { notices: [], warnings: [] }).find((a) => a.properties.title === `Plumbline ${code}`)!;
    expect(annotation.properties).toEqual({ title: `Plumbline ${code}`, file: finding.file });
    expect(annotation.message.startsWith(`Line ${finding.line} at the base commit: `)).toBe(true);
  });
});

describe('places at head', () => {
  it.skipIf(!canRender)('link to the head commit, without a word about the base; a removed flag’s row links to the base', async () => {
    const { repo, review } = await reviewOf(baseFiles({ 'src/old.ts': "export const old = (client) => client.getBooleanValue('old-flag', false);\n" }), {
      'src/old.ts': `${PADDING}export const old = () => false;\n`,
      'src/new.ts': "export const on = (client) => client.getBooleanValue('new-flag', false);\n",
    });
    const added = review.findings.find((f) => f.code === 'flag-without-plan' && f.file === 'src/new.ts')!;
    expect(added.side).toBe('head');
    const html = renderGfm(renderReviewMarkdown(review, { repoUrl: REPO_URL }));
    const item = html.split('\n').find((l) => l.includes('<code>src/new.ts:1</code>') && l.includes('flag-without-plan'))!;
    expect(item).toContain(`<a href="${REPO_URL}/blob/${repo.head}/src/new.ts#L1"><code>src/new.ts:1</code></a>: Flag`);
    // The table of flags the change touches: the removed read is a line of the base commit.
    expect(html).toContain(`<td><a href="${REPO_URL}/blob/${repo.base}/src/old.ts#L1"><code>src/old.ts:1</code></a> (removed, at the base)</td>`);
    expect(html).toContain(`<td><a href="${REPO_URL}/blob/${repo.head}/src/new.ts#L1"><code>src/new.ts:1</code></a> (added)</td>`);
  }, 60_000);
});
