import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createNameScanner, type Location } from '../../src/core/scan/name-scan.js';
import { buildAutomaton } from '../../src/core/scan/aho-corasick.js';

/**
 * The scan's first locations against the plainest possible search: for each name, every file in
 * order, Buffer.indexOf from each position, the line counted from the newlines before it and the
 * column in bytes. Small alphabets make names overlap, repeat and nest inside each other often.
 */
function plainFirst(files: readonly [string, Buffer][], name: string, quoted: boolean): Location | undefined {
  const needle = Buffer.from(name, 'utf8');
  for (const [file, bytes] of files) {
    for (let at = bytes.indexOf(needle); at !== -1; at = bytes.indexOf(needle, at + 1)) {
      if (quoted) {
        const before = bytes[at - 1];
        const after = bytes[at + needle.length];
        if (before === undefined || !'"\'`'.includes(String.fromCharCode(before)) || after !== before) continue;
      }
      const head = bytes.subarray(0, at);
      const line = head.filter((b) => b === 10).length + 1;
      const lineStart = head.lastIndexOf(10) + 1;
      return { file, line, column: at - lineStart + 1 };
    }
  }
  return undefined;
}

/** Scans `files` for `names` and holds the first locations of `checked` to the plain search's. */
function expectPlainFirsts(names: readonly string[], checked: readonly string[], files: readonly [string, Buffer][]): void {
  const scanner = createNameScanner(names);
  for (const [path, bytes] of files) scanner.scanFile(path, bytes);
  const results = scanner.results();
  for (const name of checked) {
    const hits = results.get(name)!;
    expect(hits.first, `first of ${JSON.stringify(name)}`).toEqual(plainFirst(files, name, false));
    expect(hits.firstQuoted, `first quoted ${JSON.stringify(name)}`).toEqual(plainFirst(files, name, true));
  }
}

const nameArb = fc.string({ unit: fc.constantFrom('a', 'b', 'é', '_'), minLength: 1, maxLength: 4 });
const textArb = fc.string({ unit: fc.constantFrom('a', 'b', 'é', '_', '\n', '"', "'", '`', ' '), maxLength: 120 });

describe('first locations of the name scan', () => {
  it('equal a plain string search over the same files, names nested in other names included', () => {
    fc.assert(
      fc.property(fc.uniqueArray(nameArb, { minLength: 1, maxLength: 8 }), fc.array(textArb, { minLength: 1, maxLength: 5 }), (names, texts) => {
        const files = texts.map((text, i) => [`f${i}.ts`, Buffer.from(text, 'utf8')] as [string, Buffer]);
        expectPlainFirsts(names, names, files);
      }),
      { numRuns: 400 },
    );
  });

  // Past a few hundred names the automaton's table keeps byte classes instead of one column per byte value.
  it('gives the same first locations with many names (the compact table) as with few (the wide one)', () => {
    const filler = Array.from({ length: 400 }, (_, i) => `${i}_filler_name_end`);
    fc.assert(
      fc.property(fc.uniqueArray(nameArb, { minLength: 1, maxLength: 8 }), fc.array(textArb, { minLength: 1, maxLength: 5 }), (names, texts) => {
        const files = texts.map((text, i) => [`f${i}.ts`, Buffer.from(`${text} 7_filler_name_end ${text}`, 'utf8')] as [string, Buffer]);
        expectPlainFirsts([...names, ...filler], [...names, '7_filler_name_end', '8_filler_name_end'], files);
      }),
      { numRuns: 40 },
    );
  });

  it('finds a name that only ever occurs inside a longer one, after the longer one is complete', () => {
    const scanner = createNameScanner(['checkout_done', 'out_do', 'checkout']);
    scanner.scanFile('a.ts', Buffer.from('x\n  "checkout_done"\n'));
    const results = scanner.results();
    expect(results.get('out_do')?.first).toEqual({ file: 'a.ts', line: 2, column: 9 });
    expect(results.get('checkout')?.first).toEqual({ file: 'a.ts', line: 2, column: 4 });
    expect(results.get('checkout')?.firstQuoted).toBeUndefined();
    expect(results.get('checkout_done')?.firstQuoted).toEqual({ file: 'a.ts', line: 2, column: 4 });
  });
});

describe('the automaton reports every occurrence, however many one file holds', () => {
  // Against Buffer.indexOf from every position (common practice, no source). The search notes matches in a
  // fixed-size table and empties it when full; these files hold far more matches than it has room for.
  it.each([
    ['one letter repeated', 'a'.repeat(20_000), ['a', 'aa', 'aaa']],
    ['names nested in names, every few bytes', 'xab_abc;'.repeat(5_000), ['ab', 'abc', 'b_a', 'c;x', 'xab_abc']],
  ])('%s', (_, text, names) => {
    const automaton = buildAutomaton(names);
    const bytes = Buffer.from(text, 'utf8');
    const seen: string[] = [];
    automaton.search(bytes, (name, end) => seen.push(`${names[name]}@${end}`));
    const plain: string[] = [];
    names.forEach((name) => {
      for (let at = bytes.indexOf(name); at !== -1; at = bytes.indexOf(name, at + 1)) plain.push(`${name}@${at + name.length - 1}`);
    });
    expect(seen.length).toBeGreaterThan(10_000);
    expect(seen.sort()).toEqual(plain.sort());
  });
});
