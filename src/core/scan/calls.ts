import { commentsOfText, insideRanges } from './comments.js';

/** A flag evaluation or logging call found in a file's text. */
export interface CallSite {
  /** The pattern's named groups (key, ident or event). */
  groups: Record<string, string | undefined>;
  /** 1-based lines where the call starts and where the pattern's match ends (a formatter may split a call). */
  line: number;
  endLine: number;
  /** 1-based line of the named value (the key or the event), where a reader looks. */
  valueLine: number;
  column: number;
  /** Offsets of the match in the text. */
  start: number;
  end: number;
}

/** Offset of the start of each line (index 0 is line 1). */
export function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) starts.push(i + 1);
  return starts;
}

/** 1-based line of each offset, by binary search over the line starts. */
export function lineIndex(text: string): (offset: number) => number {
  const starts = lineStarts(text);
  return (offset) => {
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid]! <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
}

/**
 * Every call the patterns match in a whole text, calls split over several lines included (the patterns
 * allow white space, new lines too, between a call's parts), and none that starts inside a comment.
 */
export function findCalls(text: string, path: string, patterns: readonly RegExp[]): CallSite[] {
  const comments = commentsOfText(text, path);
  const lineOf = lineIndex(text);
  const sites: CallSite[] = [];
  for (const pattern of patterns) {
    pattern.lastIndex = 0;
    for (const match of text.matchAll(pattern)) {
      const start = match.index;
      if (insideRanges(comments, start)) continue;
      const end = start + match[0].length;
      const groups = { ...(match.groups ?? {}) };
      const value = groups.key ?? groups.event ?? groups.ident;
      const valueAt = value !== undefined ? start + match[0].lastIndexOf(value) : start;
      const line = lineOf(start);
      sites.push({ groups, line, endLine: lineOf(Math.max(start, end - 1)), valueLine: lineOf(valueAt), column: start - text.lastIndexOf('\n', start - 1), start, end });
    }
  }
  return sites.sort((a, b) => a.start - b.start);
}
