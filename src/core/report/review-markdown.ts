import type { PlanReview, Review, ReviewFinding, Verdict } from '../review/build-review.js';
import type { Severity } from '../review/finding.js';
import { codeCell, codeSpan, inCell, linkTarget, safeCell, safeMessage, safeText, urlPath } from './markdown-safe.js';
import { formatCount, countOf } from './numbers.js';
import { coverageNotice } from './coverage-notice.js';
import { AT_BASE, checklistSummary, countsSummary } from './review-summary.js';
import { lengthSummary, renderSizingMarkdown } from './sizing.js';
import { planChangeTable } from './plan-amendment.js';
import { overrideLines, readoutSectionMarkdown } from './review-readout.js';

/** The hidden marker that finds our comment again. User text can never contain it (see markdown-safe). */
export const REVIEW_MARKER = '<!-- plumbline:review -->';
/** GitHub refuses comment bodies longer than this many characters. */
export const COMMENT_LIMIT = 65_536;
/** GitHub shows a step's job summary up to 1 MiB (bytes of UTF-8). */
export const SUMMARY_LIMIT = 1024 * 1024;

/** The size of a text as a budget counts it. */
export type Measure = (text: string) => number;
/** Comment bodies are limited in characters (JavaScript counts UTF-16 units, which never undercounts). */
export const measureCharacters: Measure = (text) => text.length;
const encoder = new TextEncoder();
/** Job summaries are limited in bytes. */
export const measureBytes: Measure = (text) => encoder.encode(text).length;

export interface MarkdownOptions {
  /**
   * The repository's web address, e.g. https://github.com/o/r: files link to `<repoUrl>/blob/<commit>/<path>#L<line>`,
   * GitHub's permanent link form, at the commit the line was read at (head, or base for removed lines); undefined: plain text.
   */
  repoUrl?: string;
  /** Where detail left out to fit is found in full, e.g. "the job summary". */
  fullReport?: string;
  /** What limits the size: "GitHub's comment size limit" unless said. */
  limitName?: string;
}

const ICON: Record<Severity, string> = { block: '⛔', warn: '⚠️', note: 'ℹ️' };
const HEADLINE: Record<Verdict, string> = {
  blocked: '⛔ Plumbline: blocked',
  warnings: '⚠️ Plumbline: passes, with warnings',
  clear: '✅ Plumbline: all clear',
  'nothing-to-check': '✅ Plumbline: nothing to check',
  partial: '⚠️ Plumbline: partial review, nothing found in the files seen',
};
/** Where a file's line is read: the commit, and whether that is the base (said beside the link). */
interface At {
  commit: string;
  base: boolean;
}

const atHead = (review: Review): At => ({ commit: review.head, base: false });
const atSide = (review: Review, side: 'base' | 'head' | undefined): At => (side === 'base' ? { commit: review.base, base: true } : atHead(review));

function where(path: string | undefined, line: number | undefined, at: At, options: MarkdownOptions): string {
  if (!path) return '';
  const label = codeSpan(`${path}${line ? `:${line}` : ''}`);
  const linked = options.repoUrl ? `[${label}](${linkTarget(`${options.repoUrl}/blob/${at.commit}/${urlPath(path)}#L${line ?? 1}`)})` : label;
  return at.base ? `${linked} (${AT_BASE})` : linked;
}

function findingLine(f: ReviewFinding, review: Review, options: MarkdownOptions): string {
  const plan = f.plan ? ` · ${codeSpan(f.plan)}` : '';
  const at = f.file ? ` · ${where(f.file, f.line, atSide(review, f.side), options)}` : '';
  return `- ${ICON[f.severity]} **${f.code}**${plan}${at}: ${safeMessage(f.message)} _Fix:_ ${safeMessage(f.fix)}${planChangeTable(f)}`;
}

/** The first visible line: the verdict, and the one thing to do first when something blocks or warns. */
function headline(review: Review): string {
  const first = review.findings.find((f) => f.severity === 'block') ?? review.findings.find((f) => f.severity === 'warn');
  const todo = review.verdict === 'blocked' || review.verdict === 'warnings' ? (first ? ` — first: ${safeMessage(first.fix)}` : '') : '';
  return `### ${HEADLINE[review.verdict]}${todo}`;
}

/** The second line: what this change introduced, what already held before it, and the commits compared. */
function countsLine(review: Review): string {
  const { introduced, known } = countsSummary(review);
  const parts = [introduced ? `This change: ${introduced}.` : known ? 'Nothing new from this change.' : ''];
  if (known) parts.push(`Already known before it: ${known}.`);
  parts.push(`<sub>Compared ${review.base.slice(0, 7)}…${review.head.slice(0, 7)}</sub>`);
  return parts.filter(Boolean).join(' ');
}

/** How much detail one rendering keeps; every step down is named in the note at the end. */
interface Detail {
  charts: boolean;
  /** Plans (in order) that keep their sizing and events tables. */
  tablesFor: number;
  /** Findings (in order: blocking first) that are listed. */
  findingsShown: number;
  /** Plans (in order) that keep their section at all. */
  plansShown: number;
  /** Rows of the table of flags the change touches. */
  flagsShown: number;
}

function planSection(plan: PlanReview, review: Review, options: MarkdownOptions, detail: Detail, withTables: boolean): string[] {
  const checklist = checklistSummary(plan.checklist);
  const length = lengthSummary(plan.sizing);
  const found = plan.events.filter((e) => e.location).length;
  const lines = [
    `#### Plan ${codeSpan(plan.id)}: ${safeText(plan.title)}`,
    `${safeText(plan.state)} · ${plan.owners.map(safeText).join(', ')} · ${where(plan.file, plan.line, atHead(review), options)} · linked because: ${plan.reasons.join(', ')}`,
    `**${checklist.count}.**${checklist.failing.length ? ` Not yet: ${checklist.failing.map((l) => safeText(l)).join('; ')}.` : ''}`,
  ];
  const readout = readoutSectionMarkdown(plan);
  // The readout ends in a paragraph of its own; the length line must not run into it.
  lines.push(...readout, ...(readout.length && length ? [''] : []));
  if (length) lines.push(`**Length:** ${safeText(length.length)}.${length.power ? ` **Power:** ${safeText(length.power)}.` : ''} **Events:** ${formatCount(found)} of ${formatCount(plan.events.length)} logged in the code.`);
  if (!withTables) return lines;
  const sizing = renderSizingMarkdown(plan.sizing, { title: 'Sizing', designLine: '', window: plan.window, power: plan.power })
    .split('\n')
    .filter((l) => !l.startsWith('### '));
  lines.push(
    '',
    '<details><summary>Sizing and events</summary>',
    '',
    ...(detail.charts ? sizing : cutChart(sizing)),
    '| event | used for | first logged at |',
    '| --- | --- | --- |',
    ...plan.events.map(
      (e) =>
        `| ${codeCell(e.event)} | ${safeCell(e.roles.join(', '))} | ${e.location ? `${inCell(where(e.location.file, e.location.line, atHead(review), options))}${e.via === 'literal' ? ' (as a string, not in a logging call)' : ''}` : '**missing**'} |`,
    ),
    '',
    '</details>',
  );
  return lines;
}

function cutChart(lines: string[]): string[] {
  const start = lines.findIndex((l) => l.startsWith('<details><summary>Power by day'));
  return start < 0 ? lines : [...lines.slice(0, start), ''];
}

function hasChart(review: Review): boolean {
  return review.plans.some((p) => renderSizingMarkdown(p.sizing, { title: '', designLine: '', window: p.window, power: p.power }).includes('<summary>Power by day'));
}

function findingsSection(review: Review, options: MarkdownOptions, shown: number): string[] {
  const listed = review.findings.slice(0, shown);
  const introduced = listed.filter((f) => f.origin === 'introduced');
  // A known blocking finding still blocks the merge, so it stays in sight; other known ones fold away.
  const knownBlocking = listed.filter((f) => f.origin === 'known' && f.severity === 'block');
  const knownRest = listed.filter((f) => f.origin === 'known' && f.severity !== 'block');
  const out: string[] = [];
  if (introduced.length) out.push('#### Introduced by this change', '', ...introduced.map((f) => findingLine(f, review, options)), '');
  if (knownBlocking.length) out.push('#### Still blocking from before this change', '', ...knownBlocking.map((f) => findingLine(f, review, options)), '');
  if (knownRest.length) {
    out.push(`<details><summary>Already known: ${countOf(knownRest.length, 'finding')} that held before this change</summary>`, '', ...knownRest.map((f) => findingLine(f, review, options)), '', '</details>', '');
  }
  return out;
}

function render(review: Review, options: MarkdownOptions, detail: Detail, omitted: string[]): string {
  // An override is the one decision the registered rule did not make: reviewers judge it first.
  const overrides = overrideLines(review.plans);
  const out = [REVIEW_MARKER, headline(review), ...(overrides.length ? ['', ...overrides, ''] : []), countsLine(review), ''];
  out.push(...coverageNotice(review));
  if (review.verdict === 'nothing-to-check') {
    out.push('This change touches no feature flag and no plan, and removes no event a running test depends on.');
    return out.join('\n');
  }
  out.push(...findingsSection(review, options, detail.findingsShown));
  review.plans.slice(0, detail.plansShown).forEach((plan, i) => out.push(...planSection(plan, review, options, detail, i < detail.tablesFor), ''));
  if (review.nudge) {
    out.push(
      '#### A small check test for this fix?',
      '',
      ...(review.nudge.twoWeeksLine ? [safeText(review.nudge.twoWeeksLine), ''] : []),
      'A fix can fail to fix, or quietly cost latency or errors elsewhere. Behind a flag, half the traffic gets it first and a guardrail shows within days whether it made things worse; a kill switch is there if it did.',
      '',
      '<details><summary>Sizing, and a plan to paste into experiments/ (edit the placeholders)</summary>',
      '',
      ...(review.nudge.sizingLine ? [safeMessage(review.nudge.sizingLine), ''] : []),
      '```yaml',
      review.nudge.planStub.replace(/```/g, "'''"),
      '```',
      '',
      '</details>',
      '',
    );
  }
  if (review.collisions.length) {
    out.push(
      `<details><summary>Running tests on the same surface: ${countOf(review.collisions.length, 'overlap')}</summary>`,
      '',
      '| plan | overlaps | owners | their surface | days together | platforms | locales | traffic in both |',
      '| --- | --- | --- | --- | --- | --- | --- | --- |',
      ...review.collisions.map(
        (c) =>
          `| ${codeCell(c.plan)} | ${codeCell(c.other)}${c.known ? ' (declared)' : ''} | ${safeCell(c.owners.join(', '))} | ${codeCell(c.otherSurface)} | ${c.overlapDays !== undefined ? formatCount(c.overlapDays) : 'unknown'} | ${safeCell(c.platforms === 'all' ? 'all' : c.platforms.join(', '))} | ${safeCell(c.locales === 'all' ? 'all' : c.locales.join(', '))} | ${Math.round(c.trafficShare * 100)}% |`,
      ),
      '',
      '</details>',
      '',
    );
  }
  if (review.flags.length && detail.flagsShown > 0) {
    const shown = review.flags.slice(0, detail.flagsShown);
    out.push(
      `<details><summary>Feature flags this change touches: ${formatCount(review.flags.length)}</summary>`,
      '',
      '| flag | where | how | plans |',
      '| --- | --- | --- | --- |',
      // A removed use is a line of the base commit; "(removed, at the base)" says both at once.
      ...shown.map(
        (f) =>
          `| ${codeCell(f.key)} | ${f.side === 'removed' ? `${inCell(where(f.file, f.line, { commit: review.base, base: false }, options))} (removed, ${AT_BASE})` : `${inCell(where(f.file, f.line, atHead(review), options))} (added)`} | ${safeCell(f.via)} | ${f.exempt ? 'exempt' : f.plans.length ? f.plans.map(codeCell).join(', ') : '**none**'} |`,
      ),
      '',
      '</details>',
      '',
    );
  }
  if (omitted.length) {
    const list = omitted.length > 1 ? `${omitted.slice(0, -1).join(', ')} and ${omitted.at(-1)}` : omitted[0];
    out.push(`<sub>Left out to fit ${options.limitName ?? "GitHub's comment size limit"}: ${list}${options.fullReport ? `. They are in ${options.fullReport}` : ''}.</sub>`);
  }
  return out.join('\n').replace(/\n{3,}/g, '\n\n');
}

/** What a step leaves out, in words a reader can act on. */
function omissions(review: Review, detail: Detail, charts: boolean): string[] {
  const out: string[] = [];
  if (!detail.charts && charts && detail.tablesFor > 0) out.push('the power charts');
  const withoutTables = Math.min(detail.plansShown, review.plans.length) - Math.min(detail.tablesFor, detail.plansShown);
  if (withoutTables > 0) out.push(`the sizing and events tables of ${countOf(withoutTables, 'plan')}`);
  const hiddenPlans = review.plans.length - Math.min(detail.plansShown, review.plans.length);
  if (hiddenPlans > 0) out.push(`the sections of ${countOf(hiddenPlans, 'more plan')}`);
  const hiddenFlags = review.flags.length - Math.min(detail.flagsShown, review.flags.length);
  if (hiddenFlags > 0) out.push(`${countOf(hiddenFlags, 'row')} of the flags table`);
  const hiddenFindings = review.findings.length - Math.min(detail.findingsShown, review.findings.length);
  if (hiddenFindings > 0) out.push(countOf(hiddenFindings, 'finding'));
  return out;
}

/** n, then about half as many each time, down to 0: few renderings even for thousands of items. */
function halving(n: number): number[] {
  const out: number[] = [];
  for (let k = n; k > 0; k = k > 8 ? Math.floor(k / 2) : k - 1) out.push(k);
  return [...out, 0];
}

/**
 * The review as Markdown within a size budget: the comment (65,536 characters) or the job summary
 * (1 MiB). Detail goes in stated steps, each only when the previous one did not fit: the power
 * charts, then the sizing and events tables plan by plan from the last, then rows of the flags
 * table, then findings from the last (notes before warnings before blocking ones), then plan sections. The note at the end says
 * exactly what was left out and where it is.
 */
export function renderReviewMarkdown(review: Review, options: MarkdownOptions = {}, limit = COMMENT_LIMIT, measure: Measure = measureCharacters): string {
  const plans = review.plans.length;
  const findings = review.findings.length;
  const charts = hasChart(review);
  const attempt = (detail: Detail) => {
    const body = render(review, options, detail, omissions(review, detail, charts));
    return measure(body) <= limit ? body : undefined;
  };
  const full: Detail = { charts: true, tablesFor: plans, findingsShown: findings, plansShown: plans, flagsShown: review.flags.length };
  const steps: Detail[] = [full, { ...full, charts: false }];
  for (const tablesFor of halving(plans).slice(1)) steps.push({ ...full, charts: false, tablesFor });
  const lean = { ...full, charts: false, tablesFor: 0 };
  for (const flagsShown of halving(review.flags.length).slice(1)) steps.push({ ...lean, flagsShown });
  for (const findingsShown of halving(findings).slice(1)) steps.push({ ...lean, flagsShown: 0, findingsShown });
  for (const plansShown of halving(plans).slice(1)) steps.push({ ...lean, flagsShown: 0, findingsShown: 0, plansShown });
  for (const detail of steps) {
    const body = attempt(detail);
    if (body !== undefined) return body;
  }
  return `${REVIEW_MARKER}\n${headline(review)}\n\nThe review does not fit here${options.fullReport ? `; see ${options.fullReport}` : ''}.`;
}

/** The job summary: the same report under the summary's own 1 MiB budget, so it holds what the comment left out. */
export function renderReviewSummary(review: Review, options: MarkdownOptions = {}): string {
  return renderReviewMarkdown(review, { ...options, limitName: "GitHub's job summary size limit" }, SUMMARY_LIMIT, measureBytes);
}
