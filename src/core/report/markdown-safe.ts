/**
 * Text from plans, pull requests and file names is untrusted. Before it reaches a comment or a
 * summary it loses raw HTML (so it cannot hide content, fake our hidden marker or inject markup),
 * its @-mentions stop pinging people and teams, and table cells keep their shape.
 */
export function safeText(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/@(?=[A-Za-z0-9_-])/g, '@\u200b')
    .replace(/\r?\n/g, ' ');
}

/** For a table cell: safe text with pipes escaped. */
export function safeCell(text: string): string {
  return safeText(text).replace(/\|/g, '\\|');
}

/** Inline code that cannot be broken out of, whatever backticks the text holds. */
export function codeSpan(text: string): string {
  const clean = text.replace(/\r?\n/g, ' ');
  const longest = Math.max(0, ...[...clean.matchAll(/`+/g)].map((m) => m[0].length));
  const fence = '`'.repeat(longest + 1);
  const pad = clean.startsWith('`') || clean.endsWith('`') ? ' ' : '';
  // Inside code spans HTML is not interpreted, but a mention is harmless there too.
  return `${fence}${pad}${clean}${pad}${fence}`;
}
