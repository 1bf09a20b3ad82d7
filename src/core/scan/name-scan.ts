import { buildAutomaton } from './aho-corasick.js';

/** A place in a file: 1-based line and column (column in bytes of UTF-8). */
export interface Location {
  file: string;
  line: number;
  column: number;
}

/** Where a name first appears: anywhere (even inside another word), as a whole quoted string, and in a logging call. */
export interface NameHits {
  first?: Location;
  firstQuoted?: Location;
  firstCall?: Location;
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
        h.firstQuoted ??= here;
        // Is this quoted name the event of a logging call? Only its own line needs matching.
        if (!h.firstCall && callPatterns.length && isLoggedOnLine(bytes, lineStart, unique[name]!, callPatterns)) h.firstCall = here;
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

/** True when a logging-call pattern on the line starting at `lineStart` logs exactly `name`. */
function isLoggedOnLine(bytes: Uint8Array, lineStart: number, name: string, patterns: readonly RegExp[]): boolean {
  let lineEnd = bytes.indexOf(10, lineStart);
  if (lineEnd === -1) lineEnd = bytes.length;
  const line = Buffer.from(bytes.buffer, bytes.byteOffset + lineStart, lineEnd - lineStart).toString('utf8');
  for (const pattern of patterns) {
    pattern.lastIndex = 0;
    for (const match of line.matchAll(pattern)) if (match.groups?.event === name) return true;
  }
  return false;
}
