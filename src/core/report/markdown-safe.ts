/**
 * Text from plans, pull requests and file names is untrusted. Every piece of it that reaches a
 * comment or a job summary goes through one of these functions, chosen by where it lands:
 *
 * - running text (`safeText` for names, `safeMessage` for our sentences that quote names in
 *   backticks): no raw HTML, no Markdown links, images or emphasis, no autolinks, no live
 *   @-mentions or #references, no line breaks;
 * - a table cell (`safeCell`, `codeCell`): the same, and every `|` escaped, code spans included,
 *   because GFM splits a row on pipes before it reads code spans;
 * - inline code (`codeSpan`): a fence longer than any backtick run inside;
 * - a link target (`urlPath`, `linkTarget`): percent-encoded, so `)` cannot end the link early;
 * - text inside an HTML block such as `<summary>` (`htmlText`): entities only, since Markdown is
 *   not read there.
 *
 * None of them can produce `<!--`, so our hidden markers occur once, where we put them.
 */

const ZERO_WIDTH_SPACE = '\u200b';

/** GitHub links @name, @org/team and #123 in text; a zero-width space after the sign keeps them inert. */
function inert(text: string): string {
  return text.replace(/@(?=[A-Za-z0-9_-])/g, `@${ZERO_WIDTH_SPACE}`).replace(/#(?=\d)/g, `#${ZERO_WIDTH_SPACE}`);
}

function oneLine(text: string): string {
  return text.replace(/\r\n?|\n/g, ' ');
}

/** Outside code: entities for HTML, backslashes for Markdown's punctuation, autolinks broken. */
function escapePlain(text: string): string {
  // Mentions first: escaping would put a backslash between `@` and `_name`, which GitHub still links.
  return inert(text)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/[\\`*_[\]~!]/g, (c) => `\\${c}`)
    // GFM's extended autolinks: "www." and "scheme://" (an escaped dot or colon is not recognized).
    .replace(/(www)\./gi, '$1\\.')
    .replace(/:(?=\/\/)/g, '\\:');
}

/** Inside a code span nothing is interpreted; only a marker-like `<!--` is broken up. */
function escapeCode(text: string): string {
  return text.replace(/<!--/g, `<${ZERO_WIDTH_SPACE}!--`);
}

/** A name or any other untrusted text, shown exactly as written (backticks included). */
export function safeText(text: string): string {
  return escapePlain(oneLine(text));
}

/**
 * Running text that may hold code spans of its own (finding messages quote names in backticks).
 * Spans are found as CommonMark finds them: a backtick run closed by the next run of the same
 * length; an unmatched run is literal and escaped. Everything outside spans is escaped.
 */
export function safeMessage(text: string): string {
  const clean = oneLine(text);
  let out = '';
  let at = 0;
  const runs = [...clean.matchAll(/`+/g)];
  for (let i = 0; i < runs.length; i++) {
    const open = runs[i]!;
    if (open.index < at) continue;
    const close = runs.slice(i + 1).find((r) => r[0].length === open[0].length);
    out += escapePlain(clean.slice(at, open.index));
    if (!close) {
      out += open[0].replace(/`/g, '\\`');
      at = open.index + open[0].length;
      continue;
    }
    const inner = clean.slice(open.index + open[0].length, close.index);
    // A span of only spaces, or with a marker inside, is written through codeSpan's own rules.
    out += `${open[0]}${escapeCode(inner)}${close[0]}`;
    at = close.index + close[0].length;
    i = runs.indexOf(close);
  }
  return out + escapePlain(clean.slice(at));
}

/** Markdown made for a table cell: GFM removes one backslash before every pipe before it reads the cell. */
export function inCell(markdown: string): string {
  return markdown.replace(/\|/g, '\\|');
}

/** For a table cell: safe text with pipes escaped (inside code spans too). */
export function safeCell(text: string): string {
  return inCell(safeText(text));
}

/** Inline code that cannot be broken out of, whatever backticks the text holds. */
export function codeSpan(text: string): string {
  const clean = escapeCode(oneLine(text));
  const longest = Math.max(0, ...[...clean.matchAll(/`+/g)].map((m) => m[0].length));
  const fence = '`'.repeat(longest + 1);
  const pad = clean.startsWith('`') || clean.endsWith('`') || /^ .* $/.test(clean) ? ' ' : '';
  // Inside code spans HTML is not interpreted and GitHub does not link mentions.
  return clean === '' ? '` `' : `${fence}${pad}${clean}${pad}${fence}`;
}

/** Inline code in a table cell. */
export function codeCell(text: string): string {
  return inCell(codeSpan(text));
}

/** A path for a URL: every byte but unreserved characters and `/` percent-encoded (`)`, `@` and `#` too). */
export function urlPath(path: string): string {
  return path
    .split('/')
    .map((segment) => encodeURIComponent(segment).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`))
    .join('/');
}

/**
 * A link target as written between `(` and `)`: characters that could end it or start markup are
 * percent-encoded, whatever the caller built. Existing %-escapes are kept.
 */
export function linkTarget(url: string): string {
  return url.replace(/[^A-Za-z0-9\-._~:/?#[\]@!$&'*+,;=%]/gu, (c) => encodeURIComponent(c)).replace(/[()'!*[\]]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

/** Text inside an HTML element such as <summary>, where Markdown is not read: entities only. */
export function htmlText(text: string): string {
  return inert(oneLine(text).replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;'));
}
