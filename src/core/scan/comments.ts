/**
 * Where the comments of a source file are, so that commented-out code never counts as code: a logging
 * call behind `//` logs nothing, and a flag read behind `#` reads nothing. A small lexer, not a parser:
 * it knows line comments, block comments and string literals (so `"//"` in a string is not a comment),
 * which is what the languages the flag and logging patterns cover have in common.
 */

/** Languages whose line comment is `#` (and that have no `//` comment). */
const HASH_ONLY = /\.(?:py|pyi|rb|sh|bash|zsh|ya?ml|toml|r|pl|pm|ex|exs|cr|nim|coffee|tf|cfg|ini|conf)$/i;
/** Languages with both `#` and `//` line comments. */
const HASH_AND_SLASH = /\.(?:php)$/i;

export interface CommentSyntax {
  slash: boolean;
  hash: boolean;
}

export function commentSyntaxOf(path: string): CommentSyntax {
  if (HASH_ONLY.test(path)) return { slash: false, hash: true };
  if (HASH_AND_SLASH.test(path)) return { slash: true, hash: true };
  return { slash: true, hash: false };
}

const SLASH = 47;
const STAR = 42;
const HASH = 35;
const NEWLINE = 10;
const BACKSLASH = 92;
const QUOTES = new Set([34, 39, 96]);

/**
 * Comment ranges [start, end) of a text given as character codes (a string or UTF-8 bytes: only ASCII
 * delimiters matter, so offsets are in the caller's own units).
 */
export function commentRanges(length: number, at: (index: number) => number, syntax: CommentSyntax): [number, number][] {
  const ranges: [number, number][] = [];
  let i = 0;
  while (i < length) {
    const c = at(i);
    if (QUOTES.has(c)) {
      // A string: skip to its closing quote; ' and " end at a line end, a template literal may span lines.
      const quote = c;
      i++;
      while (i < length) {
        const d = at(i);
        if (d === BACKSLASH) i += 2;
        else if (d === quote) break;
        else if (d === NEWLINE && quote !== 96) break;
        else i++;
      }
      i++;
    } else if ((syntax.slash && c === SLASH && at(i + 1) === SLASH) || (syntax.hash && c === HASH)) {
      const start = i;
      while (i < length && at(i) !== NEWLINE) i++;
      ranges.push([start, i]);
    } else if (syntax.slash && c === SLASH && at(i + 1) === STAR) {
      const start = i;
      i += 2;
      while (i < length && !(at(i) === STAR && at(i + 1) === SLASH)) i++;
      i = Math.min(length, i + 2);
      ranges.push([start, i]);
    } else i++;
  }
  return ranges;
}

/** Whether `index` falls inside one of the sorted ranges (binary search). */
export function insideRanges(ranges: readonly [number, number][], index: number): boolean {
  let lo = 0;
  let hi = ranges.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const [start, end] = ranges[mid]!;
    if (index < start) hi = mid - 1;
    else if (index >= end) lo = mid + 1;
    else return true;
  }
  return false;
}

/** Comment ranges of a text, in string offsets. */
export function commentsOfText(text: string, path: string): [number, number][] {
  return commentRanges(text.length, (i) => text.charCodeAt(i), commentSyntaxOf(path));
}

/** Comment ranges of a file's bytes, in byte offsets. */
export function commentsOfBytes(bytes: Uint8Array, path: string): [number, number][] {
  return commentRanges(bytes.length, (i) => bytes[i] ?? 0, commentSyntaxOf(path));
}
