import type { Digest, DigestItemKind } from '../digest/build-digest.js';
import { codeSpan, safeText } from './markdown-safe.js';
import { countOf, formatCount } from './numbers.js';
import { COMMENT_LIMIT } from './review-markdown.js';
import { terminalSafe } from './terminal-style.js';

/** Finds the digest issue again; user text can never contain it (`<` is escaped). */
export const DIGEST_MARKER = '<!-- plumbline:digest -->';
/** Everything between these two lines is Plumbline's; text a person adds outside them is kept. */
export const DIGEST_START = '<!-- plumbline:digest:start -->';
export const DIGEST_END = '<!-- plumbline:digest:end -->';
/** The timeline stays readable: at most this many bars, the rest counted. */
export const TIMELINE_LIMIT = 40;

const LABEL: Record<DigestItemKind, string> = {
  overdue: '⏰ past its end',
  'flag-gone': '🧹 flag gone from the code',
  collision: '💥 collides',
  'draft-past-start': '📝 draft past its start',
  'long-on-hold': '⏸️ on hold too long',
  'ending-soon': '📅 ending soon',
  'outcome-missing': '📋 no outcome recorded',
  'concluded-flag-in-code': '🧹 concluded, flag still in the code',
};

/** An outcome-missing item past the planned end: the data is in and the readout is owed. */
const READOUT_DUE = '📊 readout due';

/** The headline: only what is there to count, each with its noun in the right number. */
export function countLine(d: Digest): string {
  const c = d.counts;
  const parts = [
    c.overdue ? `${formatCount(c.overdue)} past ${c.overdue === 1 ? 'its' : 'their'} planned end` : '',
    c['ending-soon'] ? `${formatCount(c['ending-soon'])} ending soon` : '',
    c['draft-past-start'] ? `${countOf(c['draft-past-start'], 'draft')} past ${c['draft-past-start'] === 1 ? 'its' : 'their'} start` : '',
    c['long-on-hold'] ? `${formatCount(c['long-on-hold'])} on hold too long` : '',
    c.collision ? countOf(c.collision, 'collision') : '',
    c['flag-gone'] ? `${countOf(c['flag-gone'], 'live test')} with ${c['flag-gone'] === 1 ? 'its flag' : 'their flags'} gone` : '',
    c.orphanFlags ? `${countOf(c.orphanFlags, 'flag')} in code without a plan` : '',
  ].filter(Boolean);
  const registry = [c.live ? `${formatCount(c.live)} live` : '', c.planned ? countOf(c.planned, 'draft') : ''].filter(Boolean).join(', ') || 'no live tests or drafts';
  return `${parts.length ? parts.join(' · ') : 'nothing needs attention'} — ${registry}`;
}

/**
 * Owners beside their tests, each mentioned (notified) once per digest: the first time a handle
 * appears it is live, later appearances are inert text, and anything not a handle is always inert.
 */
function ownersOf(owners: readonly string[], mentioned: Set<string>): string {
  return owners
    .map((owner) => {
      const handle = /^@[A-Za-z0-9][\w./-]*$/.test(owner);
      if (!handle || mentioned.has(owner.toLowerCase())) return safeText(owner);
      mentioned.add(owner.toLowerCase());
      return owner;
    })
    .join(', ');
}

/** A bar label Mermaid accepts: no colon, hash or semicolon. */
function taskName(id: string): string {
  return id.replace(/[:#;]/g, '-');
}

function gantt(d: Digest): string[] {
  const shown = d.timeline.slice(0, TIMELINE_LIMIT);
  const lines = ['```mermaid', 'gantt', '  title Live and planned tests by surface', '  dateFormat YYYY-MM-DD', `  todayMarker stroke-width:3px`];
  let section = '';
  shown.forEach((t, i) => {
    const area = t.surface.split('/')[0]!;
    if (area !== section) {
      section = area;
      lines.push(`  section ${taskName(area)}`);
    }
    const tag = t.overdue ? 'crit, ' : t.state === 'live' ? 'active, ' : '';
    lines.push(`  ${taskName(t.id)} :${tag}t${i}, ${t.start}, ${t.end}`);
  });
  lines.push('```');
  if (d.timeline.length > shown.length) lines.push('', `${countOf(d.timeline.length - shown.length, 'more test')} ${d.timeline.length - shown.length === 1 ? 'is' : 'are'} not drawn (the list above has them all).`);
  return lines;
}

function render(d: Digest, withTimeline: boolean, maxTests: number): string {
  const out = [DIGEST_MARKER, DIGEST_START, `## Plumbline weekly digest, ${d.today}`, '', `**${countLine(d)}**`, ''];
  if (d.tests.length === 0 && d.orphanFlags.length === 0) out.push('Nothing needs attention this week.', '');
  const mentioned = new Set<string>();
  for (const test of d.tests.slice(0, maxTests)) {
    out.push(`- **${codeSpan(test.id)}** ${safeText(test.title)} · ${ownersOf(test.owners, mentioned)} · ${codeSpan(`${test.file}:${test.line}`)}`);
    for (const it of test.items) out.push(`  - ${it.readoutDue ? READOUT_DUE : LABEL[it.kind]}: ${safeText(it.detail)}`);
  }
  if (d.tests.length > maxTests) out.push(`- …and ${countOf(d.tests.length - maxTests, 'more test')} (see the JSON report).`);
  if (d.tests.length) out.push('');
  if (d.orphanFlags.length) {
    out.push('### Flags in code that no plan covers', '', ...d.orphanFlags.slice(0, 50).map((f) => `- ${codeSpan(f.key)} at ${codeSpan(`${f.location.file}:${f.location.line}`)}`));
    if (d.orphanFlags.length > 50) out.push(`- …and ${formatCount(d.orphanFlags.length - 50)} more.`);
    out.push('', 'Write a plan for each, or list kill switches and operational toggles under exempt-flags.', '');
  }
  if (withTimeline && d.timeline.length) out.push('### Timeline', '', ...gantt(d), '');
  out.push(DIGEST_END);
  return out.join('\n');
}

/** The digest block, under GitHub's body limit: the timeline goes first, then tests beyond the first few. */
export function renderDigestMarkdown(d: Digest, limit = COMMENT_LIMIT - 2000): string {
  for (const [timeline, tests] of [[true, Infinity], [false, Infinity], [false, 100], [false, 20], [false, 5]] as const) {
    const body = render(d, timeline, tests);
    if (body.length <= limit) return body;
  }
  return [DIGEST_MARKER, DIGEST_START, `## Plumbline weekly digest, ${d.today}`, '', `**${countLine(d)}**`, '', 'The full list is too long for an issue; see the JSON report.', DIGEST_END].join('\n');
}

/**
 * The issue body after this week's digest: the marked block replaced, text a person wrote before
 * or after it kept as it was. A body without the block gets it at the top.
 */
export function mergeDigestBody(existing: string | undefined, block: string): string {
  if (!existing) return block;
  const start = existing.indexOf(DIGEST_START);
  const end = existing.indexOf(DIGEST_END);
  if (start < 0 || end < start) return `${block}\n\n${existing}`;
  const before = existing.slice(0, start).replace(DIGEST_MARKER, '').replace(/\s+$/, '');
  const after = existing.slice(end + DIGEST_END.length);
  const blockBody = block.slice(block.indexOf(DIGEST_START));
  return `${DIGEST_MARKER}\n${before ? `${before}\n` : ''}${blockBody}${after}`;
}

export function renderDigestText(d: Digest): string {
  const out = [`Plumbline digest for ${d.today}: ${countLine(d)}`];
  for (const test of d.tests) {
    out.push('', `${test.id} (${test.file}:${test.line}) ${terminalSafe(test.owners.join(', '))}`);
    for (const it of test.items) out.push(`  ${(it.readoutDue ? 'readout-due' : it.kind).padEnd(16)} ${terminalSafe(it.detail)}`);
  }
  if (d.orphanFlags.length) {
    out.push('', 'Flags in code that no plan covers:');
    for (const f of d.orphanFlags) out.push(`  ${terminalSafe(f.key)} at ${f.location.file}:${f.location.line}`);
  }
  return out.join('\n');
}

export const DIGEST_JSON_FORMAT = 'plumbline.digest/1';
