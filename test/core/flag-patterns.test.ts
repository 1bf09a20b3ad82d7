import { describe, expect, it } from 'vitest';
import { parseUnifiedDiff } from '../../src/core/scan/diff.js';
import { findFlagTouches } from '../../src/core/scan/flag-touches.js';
import { BUILTIN_FLAG_PATTERNS, BUILTIN_LOG_PATTERNS, compilePatterns } from '../../src/core/scan/patterns.js';
import { createNameScanner } from '../../src/core/scan/name-scan.js';

// Evaluation calls as the OpenFeature SDK documentation shows them for each language (the
// specification's "flag evaluation" API: get<Type>Value / <Type>Value / fetch_<type>_value and
// their *Details forms); written from memory of those examples.
const OPENFEATURE_CALLS: [string, string][] = [
  ['TypeScript', "const enabled = await client.getBooleanValue('v2-checkout', false);"],
  ['JavaScript details', "const details = await client.getStringDetails('v2-checkout', 'blue', context);"],
  ['React', "const showBanner = useBooleanFlagValue('v2-checkout', false);"],
  ['Python', 'enabled = client.get_boolean_value("v2-checkout", False)'],
  ['Python keyword', 'enabled = client.get_boolean_value(flag_key="v2-checkout", default_value=False)'],
  ['Go', 'enabled, err := client.BooleanValue(context.Background(), "v2-checkout", false, openfeature.EvaluationContext{})'],
  ['Go details', 'details, err := client.StringValueDetails(ctx, "v2-checkout", "blue", evalCtx)'],
  ['Java', 'Boolean enabled = client.getBooleanValue("v2-checkout", false);'],
  ['Kotlin', 'val enabled = client.getBooleanValue("v2-checkout", false)'],
  ['C#', 'var enabled = await client.GetBooleanValueAsync("v2-checkout", false);'],
  ['Swift', 'let enabled = client.getBooleanValue(key: "v2-checkout", defaultValue: false)'],
  ['Ruby', 'enabled = client.fetch_boolean_value(flag_key: "v2-checkout", default_value: false)'],
  ['PHP', '$enabled = $client->getBooleanValue("v2-checkout", false);'],
  ['helper', "if (isFeatureEnabled('v2-checkout')) {"],
];

function touchesOf(line: string, knownKeys: string[] = []) {
  const diff = parseUnifiedDiff(`diff --git a/x b/x\n--- a/x\n+++ b/x\n@@ -0,0 +1 @@\n+${line}\n`);
  return findFlagTouches({ diffs: diff, patterns: compilePatterns(BUILTIN_FLAG_PATTERNS), knownKeys: new Set(knownKeys), textOf: () => undefined });
}

describe('built-in flag patterns on OpenFeature call shapes', () => {
  it.each(OPENFEATURE_CALLS)('%s', (_language, line) => {
    expect(touchesOf(line).map((t) => [t.key, t.via])).toEqual([['v2-checkout', 'call']]);
  });

  it.each([
    ['a string that merely looks like a key', "const label = 'v2-checkout';"],
    ['a method of another name', "client.getBooleanish('v2-checkout')"],
    ['a comment about the API', '// see getBooleanValue in the docs'],
  ])('does not fire on %s', (_name, line) => {
    expect(touchesOf(line)).toEqual([]);
  });

  it('counts a string equal to a known key as touching it', () => {
    expect(touchesOf("const label = 'v2-checkout';", ['v2-checkout']).map((t) => t.via)).toEqual(['literal']);
  });
});

describe('parseUnifiedDiff', () => {
  it('reads line numbers on both sides, renames and binary files', () => {
    const text = [
      'diff --git a/src/a.ts b/src/b.ts',
      'similarity index 90%',
      'rename from src/a.ts',
      'rename to src/b.ts',
      '--- a/src/a.ts',
      '+++ b/src/b.ts',
      '@@ -3,2 +3 @@ function x() {',
      '-  old();',
      '-  older();',
      '+  new();',
      '@@ -10,0 +11,2 @@',
      '+  one();',
      '+  two();',
      'diff --git a/logo.png b/logo.png',
      'Binary files a/logo.png and b/logo.png differ',
    ].join('\n');
    const [renamed, binary] = parseUnifiedDiff(text);
    expect(renamed).toEqual({
      path: 'src/b.ts',
      previousPath: 'src/a.ts',
      removed: [
        { line: 3, text: '  old();' },
        { line: 4, text: '  older();' },
      ],
      added: [
        { line: 3, text: '  new();' },
        { line: 11, text: '  one();' },
        { line: 12, text: '  two();' },
      ],
      binary: false,
    });
    expect(binary).toMatchObject({ path: 'logo.png', binary: true, added: [] });
  });

  it('undoes git quoting of unusual file names', () => {
    const [file] = parseUnifiedDiff('diff --git "a/caf\\303\\251.ts" "b/caf\\303\\251.ts"\n--- "a/caf\\303\\251.ts"\n+++ "b/caf\\303\\251.ts"\n@@ -1 +1 @@\n-a\n+b\n');
    expect(file!.path).toBe('café.ts');
  });
});

describe('the name scan', () => {
  it('finds every name at its first location, including names inside other names, across files in order', () => {
    const scanner = createNameScanner(['order', 'order_placed', 'placed', 'absent'], compilePatterns(BUILTIN_LOG_PATTERNS));
    scanner.scanFile('a.ts', new TextEncoder().encode('// nothing\nconst x = "order_placed_total";\n'));
    scanner.scanFile('b.ts', new TextEncoder().encode('function f() {\n  track("order_placed");\n  const o = \'order\';\n}\n'));
    const results = scanner.results();
    expect(results.get('order')).toEqual({ first: { file: 'a.ts', line: 2, column: 12 }, firstQuoted: { file: 'b.ts', line: 3, column: 14 } });
    expect(results.get('placed')).toEqual({ first: { file: 'a.ts', line: 2, column: 18 } });
    expect(results.get('order_placed')).toEqual({
      first: { file: 'a.ts', line: 2, column: 12 },
      firstQuoted: { file: 'b.ts', line: 2, column: 10 },
      firstCall: { file: 'b.ts', line: 2, column: 10 },
    });
    expect(results.get('absent')).toEqual({});
  });

  it('skips binary files and counts multi-byte characters by byte', () => {
    const scanner = createNameScanner(['naïve_event']);
    scanner.scanFile('bin', new Uint8Array([0, 1, 2, ...new TextEncoder().encode('naïve_event')]));
    scanner.scanFile('t.py', new TextEncoder().encode('é = "naïve_event"'));
    expect(scanner.results().get('naïve_event')?.first).toEqual({ file: 't.py', line: 1, column: 7 });
    expect(scanner.stats().skippedBinary).toBe(1);
  });
});
