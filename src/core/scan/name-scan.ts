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
  const end = Math.min(bytes.length, 8000);
  for (let i = 0; i < end; i++) if (bytes[i] === 0) return true;
  return false;
}

/**
 * Finds the first locations of many names across many files in one pass per file. Logging-call
 * patterns (with a named group `event`) are run only over files where a still-unplaced name
 * appears quoted, so the regular expressions never dominate the scan.
 */
export function createNameScanner(names: readonly string[], callPatterns: readonly RegExp[] = []): NameScanner {
  const unique = [...new Set(names)].filter((n) => n.length > 0 && !n.includes('\n'));
  const automaton = buildAutomaton(unique);
  const hits: NameHits[] = unique.map(() => ({}));
  const index = new Map(unique.map((n, i) => [n, i]));
  let files = 0;
  let bytesSeen = 0;
  let skippedBinary = 0;
  let unplacedCalls = unique.length;

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
      let quotedHere = false;
      automaton.search(bytes, (name, end) => {
        const h = hits[name]!;
        if (h.first && h.firstQuoted) return;
        const start = end - automaton.lengths[name]! + 1;
        const here = locate(start, end);
        h.first ??= here;
        const quote = bytes[start - 1];
        if (quote !== undefined && QUOTES.has(quote) && bytes[end + 1] === quote) {
          h.firstQuoted ??= here;
          if (!h.firstCall) quotedHere = true;
        }
      });
      if (quotedHere && unplacedCalls > 0 && callPatterns.length) {
        const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8');
        const lineStarts = [0];
        for (let nl = text.indexOf('\n'); nl !== -1; nl = text.indexOf('\n', nl + 1)) lineStarts.push(nl + 1);
        for (const pattern of callPatterns) {
          pattern.lastIndex = 0;
          for (const match of text.matchAll(pattern)) {
            const event = match.groups?.event;
            const i = event === undefined ? undefined : index.get(event);
            if (i === undefined || hits[i]!.firstCall) continue;
            const at = match.index + match[0].lastIndexOf(event!);
            let lo = 0;
            let hi = lineStarts.length - 1;
            while (lo < hi) {
              const mid = (lo + hi + 1) >> 1;
              if (lineStarts[mid]! <= at) lo = mid;
              else hi = mid - 1;
            }
            // Columns count UTF-8 bytes, as the byte scan does.
            hits[i]!.firstCall = { file: path, line: lo + 1, column: Buffer.byteLength(text.slice(lineStarts[lo]!, at)) + 1 };
            unplacedCalls--;
          }
        }
      }
    },
    results() {
      return new Map(unique.map((n, i) => [n, hits[i]!]));
    },
    stats() {
      return { files, bytes: bytesSeen, skippedBinary };
    },
  };
}
