import { describe, expect, it } from 'vitest';
import { checkOutput, signatureOf } from '../../scripts/fuzz/oracles.js';
import { memoryChange } from '../../scripts/fuzz/memory-repo.js';
import { parseUnifiedDiff } from '../../src/core/scan/diff.js';
import { loadSettings } from '../../src/core/config/load.js';

/** The fuzzer is only as good as its oracles: each broken promise must be caught, and a clean run must pass. */
const run = (over: Partial<Parameters<typeof checkOutput>[0]>) =>
  checkOutput({ command: 'check', format: 'json', exit: 0, stdout: '{"verdict":"clear","counts":{"block":0}}', stderr: '', ms: 10, timeLimitMs: 5000, inputText: '', ...over });

describe('fuzz oracles', () => {
  it('pass a clean run', () => {
    expect(run({})).toEqual([]);
  });

  it.each([
    ['an internal error', { exit: 3, stderr: 'plumbline: internal error: SyntaxError: Invalid regular expression' }, 'internal-error'],
    ['a null number in JSON', { stdout: '{"sizing":{"units":null}}' }, 'null-number'],
    ['NaN in text', { format: 'text', stdout: 'sizing: NaN units' }, 'non-number'],
    ['∞ in Markdown', { format: 'markdown', stdout: 'the test needs ∞ units' }, 'non-number'],
    ['n/a in a finding', { format: 'text', stdout: 'power n/a by the planned end' }, 'non-number'],
    ['Infinity in a message', { format: 'text', stdout: 'got Infinity' }, 'non-number'],
    ['a problem without a field', { stdout: '{"problems":[{"severity":"error","code":"plan/invalid-value","file":"x.yaml","line":3,"field":"","message":"bad"}]}' }, 'unlocated-problem'],
    ['a problem without a line', { stdout: '{"problems":[{"severity":"error","code":"plan/invalid-value","file":"x.yaml","line":0,"field":"id","message":"bad"}]}' }, 'unlocated-problem'],
    ['a slow command', { ms: 6000 }, 'too-slow'],
    ['an exit code outside 0-3', { exit: 7 }, 'bad-exit'],
  ])('catch %s', (_, over, kind) => {
    expect(run(over).map((f) => f.kind)).toContain(kind);
  });

  it('let the input echo a word it contains', () => {
    expect(run({ format: 'text', stdout: 'title: NaN bread', inputText: 'title: NaN bread' })).toEqual([]);
  });

  it('group failures by shape, not by number', () => {
    const a = signatureOf({ kind: 'null-number', detail: 'size: null at metrics[0].days' });
    const b = signatureOf({ kind: 'null-number', detail: 'size: null at metrics[3].days' });
    expect(a).toBe(b);
  });

  it('write diffs the review reads as git would give them', async () => {
    const change = memoryChange(new Map([['a.ts', 'one\ntwo\n']]), new Map([['a.ts', 'one\nthree\n'], ['b.ts', 'new\n']]));
    const diffs = parseUnifiedDiff(await change.diff());
    expect(diffs.map((d) => [d.path, d.added.map((l) => l.text), d.removed.map((l) => l.text)])).toEqual([
      ['a.ts', ['one', 'three'], ['one', 'two']],
      ['b.ts', ['new'], []],
    ]);
  });
});

describe('settings numbers', () => {
  it('bound bug-fix daily units as plans are bounded', () => {
    const result = loadSettings('bug-fix:\n  guardrail: { name: errors, rate: 0.01, events: [e] }\n  daily-units: 5e-324\n', '.plumbline.yml');
    expect(result.ok).toBe(false);
    expect(result.ok ? [] : result.errors.map((p) => [p.field, p.line])).toEqual([['bug-fix.daily-units', 3]]);
  });
});

describe('settings globs', () => {
  it('are at most 500 characters, so no glob compiles to an oversized pattern (found by the fuzzer: exit 3 on check)', () => {
    const result = loadSettings(`bug-fix:\n  non-product-paths: ["${'a-'.repeat(20_000)}"]\n`, '.plumbline.yml');
    expect(result.ok ? [] : result.errors.map((p) => [p.field, p.line, p.message.includes('internal')])).toEqual([['bug-fix.non-product-paths[0]', 2, false]]);
  });
});
