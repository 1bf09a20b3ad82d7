import { buildAutomaton } from './aho-corasick.js';
import { commentsOfBytes, insideRanges } from './comments.js';
import { evidenceKindOf } from './evidence.js';

/** A place in a file: 1-based line and column (column in bytes of UTF-8). */
export interface Location {
  file: string;
  line: number;
  column: number;
}

/**
 * Where a name first appears: anywhere (even inside another word); as a whole quoted string in product code;
 * in a logging call in product code; and where it is only mentioned (quoted in a test, fixture, document or
 * generated file, or inside a comment), which never counts as logged.
 */
export interface NameHits {
  first?: Location;
  firstQuoted?: Location;
  firstCall?: Location;
  firstMention?: Location;
}

export interface NameScanner {
  /** Feeds one file; files must come in the order that "first" should mean (path order). */
  scanFile(path: string, bytes: Uint8Array): void;
  results(): Map<string, NameHits>;
  stats(): { files: number; bytes: number; skippedBinary: number };
}

const QUOTES = new Set([34, 39, 96]); // " ' `

/** True when the file looks binary: a NUL byte in its first 8,000 bytes (git's own test). */
export function looksBinary(bytes: Uint8Array): boolean {
  return bytes.subarray(0, 8000).indexOf(0) !== -1;
}

/**
 * Finds the first locations of many names across many files in one pass per file. Logging-call
 * patterns (with a named group `event`) are tried only on the line of a quoted occurrence of a
 * name not yet seen in a call, so the regular expressions never dominate the scan.
 */
export function createNameScanner(names: readonly string[], callPatterns: readonly RegExp[] = []): NameScanner {
  const unique = [...new Set(names)].filter((n) => n.length > 0 && !n.includes('\n'));
  const automaton = buildAutomaton(unique);
  const hits: NameHits[] = unique.map(() => ({}));
  let files = 0;
  let bytesSeen = 0;
  let skippedBinary = 0;

  return {
    scanFile(path, bytes) {
      if (looksBinary(bytes)) {
        skippedBinary++;
        return;
      }
      files++;
      bytesSeen += bytes.length;
      // Line numbers are counted only when a first occurrence is recorded, from the last one counted.
      // Matches arrive in order of their end; a name holds no newline, so its start shares that line.
      const product = evidenceKindOf(path) === 'code';
      let comments: [number, number][] | undefined;
      let countedTo = 0;
      let line = 1;
      let lineStart = 0;
      const locate = (start: number, end: number): Location => {
        for (let nl = bytes.indexOf(10, countedTo); nl !== -1 && nl < end; nl = bytes.indexOf(10, nl + 1)) {
          line++;
          lineStart = nl + 1;
        }
        countedTo = end;
        return { file: path, line, column: start - lineStart + 1 };
      };
      automaton.search(bytes, (name, end) => {
        const h = hits[name]!;
        if (h.first && h.firstQuoted && (h.firstCall || callPatterns.length === 0)) return;
        const start = end - automaton.lengths[name]! + 1;
        const here = locate(start, end);
        h.first ??= here;
        const quote = bytes[start - 1];
        if (quote === undefined || !QUOTES.has(quote) || bytes[end + 1] !== quote) return;
        if (!product) {
          h.firstMention ??= here;
          return;
        }
        comments ??= commentsOfBytes(bytes, path);
        if (insideRanges(comments, start)) {
          h.firstMention ??= here;
          return;
        }
        h.firstQuoted ??= here;
        // Is this quoted name the event of a logging call? The call may start a few lines up.
        if (!h.firstCall && callPatterns.length && isLoggedAt(bytes, lineStart, start - 1, unique[name]!, callPatterns)) h.firstCall = here;
      });
    },
    results() {
      return new Map(unique.map((n, i) => [n, hits[i]!]));
    },
    stats() {
      return { files, bytes: bytesSeen, skippedBinary };
    },
  };
}

/** Lines before a quoted name that a call split by a formatter may start on. */
const CALL_LOOKBACK_LINES = 3;

/**
 * True when a logging-call pattern logs exactly `name` with its opening quote at byte `quoteAt`: the call
 * may open up to a few lines above (`track(\n  'name',`), as formatters write long calls.
 */
function isLoggedAt(bytes: Uint8Array, lineStart: number, quoteAt: number, name: string, patterns: readonly RegExp[]): boolean {
  let from = lineStart;
  for (let n = 0; n < CALL_LOOKBACK_LINES && from > 0; n++) from = from >= 2 ? bytes.lastIndexOf(10, from - 2) + 1 : 0;
  let lineEnd = bytes.indexOf(10, quoteAt);
  if (lineEnd === -1) lineEnd = bytes.length;
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length);
  const window = buffer.toString('utf8', from, lineEnd);
  // The quote's offset in characters of the window (the bytes before it may hold multi-byte characters).
  const quoteIndex = buffer.toString('utf8', from, quoteAt).length;
  for (const pattern of patterns) {
    pattern.lastIndex = 0;
    for (const match of window.matchAll(pattern)) {
      if (match.groups?.event !== name) continue;
      // This occurrence, not another call of the same event higher up in the window.
      if (match.index + match[0].lastIndexOf(name) - 1 === quoteIndex) return true;
    }
  }
  return false;
}
