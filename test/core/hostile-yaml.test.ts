import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { declaredFlags } from '../../src/core/plan/declared-flags.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { loadRegistryFile } from '../../src/core/registry/load.js';
import { MAX_NESTING_DEPTH } from '../../src/core/source/yaml-source.js';

const firstError = (text: string) => {
  const result = loadPlan(text, 'experiments/x.yaml');
  expect(result.ok).toBe(false);
  return result.ok ? undefined : result.errors[0];
};

/** Nesting written in block style, one level per line, each indented one space more than the last. */
const blockNesting = (levels: number) => `id: deep\ntitle:\n${Array.from({ length: levels }, (_, i) => `${' '.repeat(i + 1)}k:`).join('\n')} 1\n`;
const flowNesting = (levels: number, open: string, close: string) => `id: deep\nowners: [a]\ntitle: ${open.repeat(levels)}1${close.repeat(levels)}\n`;

describe('nesting past the limit is a plan error where it crosses the limit, never an engine error', () => {
  it.each([
    ['300 levels of block mappings', blockNesting(300), MAX_NESTING_DEPTH + 2, MAX_NESTING_DEPTH + 1],
    ['1000 levels of flow lists', flowNesting(1000, '[', ']'), 3, 8 + MAX_NESTING_DEPTH - 1],
    ['1000 levels of flow mappings', flowNesting(1000, '{a: ', '}'), 3, 8 + 4 * (MAX_NESTING_DEPTH - 1)],
    ['5000 levels of flow lists', flowNesting(5000, '[', ']'), 3, 8 + MAX_NESTING_DEPTH - 1],
  ])('%s', (_, text, line, column) => {
    const error = firstError(text)!;
    expect(error).toMatchObject({ code: 'plan/too-deep', file: 'experiments/x.yaml', line, column });
    // The path of the deepest key reached, where the nesting passes the limit.
    expect(error.field).toBe(text.includes('{a: ') ? `title${'.a'.repeat(MAX_NESTING_DEPTH - 1)}` : text.includes('[[') ? `title${'[0]'.repeat(MAX_NESTING_DEPTH - 1)}` : `title${'.k'.repeat(MAX_NESTING_DEPTH - 1)}`);
    expect(error.message).toBe(`lists and mappings here are nested more than ${MAX_NESTING_DEPTH} levels deep`);
    expect(JSON.stringify(error)).not.toMatch(/stack|Maximum/i);
  });

  it('accepts nesting at the limit (the error is about depth, not about nesting as such)', () => {
    const error = firstError(flowNesting(MAX_NESTING_DEPTH - 1, '[', ']'));
    expect(error?.code).not.toBe('plan/too-deep');
  });

  it('guards registry files the same way', () => {
    const result = loadRegistryFile(`experiments:\n  - ${'['.repeat(1000)}1${']'.repeat(1000)}\n`, 'registry.yaml');
    expect(result.ok).toBe(false);
    expect(result.ok ? [] : result.errors.map((e) => e.code)).toEqual(['registry/too-deep']);
    expect(result.ok ? [] : result.errors.map((e) => e.field)).toEqual([`experiments[0]${'[0]'.repeat(MAX_NESTING_DEPTH - 2)}`]);
  });
});

describe('a tag YAML does not know is a located problem, never a warning on stderr', () => {
  const emitted: unknown[] = [];
  const listen = (warning: unknown) => emitted.push(warning);
  beforeEach(() => {
    emitted.length = 0;
    process.on('warning', listen);
  });
  afterEach(() => {
    process.off('warning', listen);
  });

  it.each([
    ['on a value', 'id: x\ntitle: !custom Cart\n', 2, 8, 'title'],
    ['in a nested list', 'id: x\nwindow:\n  start: 2026-01-05\nflags:\n  - a\n  - !flag b\n', 6, 5, 'flags[1]'],
    ['on a mapping', 'id: x\nsurface: !surface\n  path: shop\n', 2, 10, 'surface'],
  ])('%s', async (_, text, line, column, field) => {
    const error = firstError(text)!;
    expect(error).toMatchObject({ code: 'plan/unknown-tag', file: 'experiments/x.yaml', line, column, field });
    expect(error.message).toMatch(/a value carries a "!" tag this file format does not use/);
    // Reading a broken plan's flags leniently (for plan-invalid) says nothing either.
    declaredFlags(text);
    await new Promise((resolve) => setImmediate(resolve));
    expect(emitted).toEqual([]);
  });

  it('keeps the tags YAML itself defines', () => {
    const result = loadPlan('id: x\ntitle: !!str 12\n', 'experiments/x.yaml');
    expect(result.ok ? [] : result.errors.map((e) => e.code)).not.toContain('plan/unknown-tag');
  });
});

describe('a key written twice is named, with the line of its first place and its field', () => {
  it.each([
    ['at the top', 'id: dup\nid: dup2\n', 2, 1, 'id', '`id` is written twice in the same mapping (first on line 1)'],
    ['in a nested mapping', 'design:\n  alpha: 0.05\n  power: 0.8\n  alpha: 0.1\n', 4, 3, 'design.alpha', '`alpha` is written twice in the same mapping (first on line 2)'],
    ['in a list item', 'arms:\n  - name: a\n    weight: 1\n    name: b\n', 4, 5, 'arms[0].name', '`name` is written twice in the same mapping (first on line 2)'],
    ['in a flow mapping', 'baseline: { rate: 0.1, rate: 0.2 }\n', 1, 24, 'baseline.rate', '`rate` is written twice in the same mapping (first on line 1)'],
  ])('%s', (_, text, line, column, field, message) => {
    expect(firstError(text)).toMatchObject({ code: 'plan/duplicate-key', line, column, field, message, expected: 'each key once: keep one of the two, or merge what they hold' });
  });
});

describe('an unclosed bracket is reported where it opens, with the field it holds', () => {
  it.each([
    ['id: x\nbaseline: { rate: 0.3\nowners: [a]\n', 'baseline'],
    ['metrics:\n  primary:\n    baseline: { rate: 0.3\n    events: [a]\n', 'metrics.primary.baseline'],
    ['arms:\n  - { name: a\n  - { name: b }\n', 'arms[0]'],
    ['{ id: x\n', ''],
  ])('%j', (text, field) => {
    expect(firstError(text)).toMatchObject({ code: 'plan/bad-yaml', field });
  });
});

describe('common YAML mistakes get what to write instead, at their position', () => {
  it.each([
    ['a second key on the line', 'id: a: b\n', 1, 5, /a second "key:" follows on the same line/, /one key per line/],
    ['a key over two lines', 'id: x\ntitle: a\n  b: c\n', 2, 8, /a second "key:"/, /one key per line/],
    ['a multi-line implicit key', 'id: x\ntitle\nowners: [a]\n', 2, 1, /a key runs over more than one line/, /each key and its colon on one line/],
    ['an unquoted handle', 'owners: @ana\n', 1, 9, /a value starts with @, which YAML reserves/, /quotes around a value that starts with @, as in '@ana-lima'/],
    ['an unclosed quote', 'title: "abc\n', 2, 1, /a quoted value is never closed/, /the same quote mark/],
    ['a tab for indentation', 'a:\n\tb: 1\n', 2, 1, /a tab is used for indentation/, /spaces for indentation/],
    ['text after a quoted value', 'title: "a" b\n', 1, 12, /more text follows a complete value/, /quotes around the whole value/],
    ['a list item out of line', 'owners:\n  - a\n - b\n', 3, 1, /a list item stands where a key was expected/, /indented under the key/],
    ['a stray closing bracket', 'owners: [a, b]]\n', 1, 15, /a bracket here has no partner/, /each \[ closed by \]/],
    ['a key without a colon', 'title: x\nid\n', 2, 1, /a line inside a mapping has no colon/, /"key: value"/],
    ['an unknown escape', 'title: "\\d"\n', 1, 9, /a backslash in a double-quoted value/, /single quotes/],
    ['indentation that fits nothing', 'owners:\n  - 1\n  b: 2\n', 3, 1, /the indentation here does not fit/, /in the same column/],
    ['an unclosed { with keys after it', 'id: x\nbaseline: { rate: 0.3\nowners: [a]\n', 2, 11, /^this is not valid YAML: this \{ is never closed$/, /^\} after the last item/],
    ['an unclosed [ with keys after it', 'flags: [a, b\nowners: [a]\n', 1, 8, /^this is not valid YAML: this \[ is never closed$/, /^\] after the last item/],
    ['an unclosed { at the end of the file', 'id: x\nbaseline: { rate: 0.3\n', 2, 11, /this \{ is never closed/, /\}/],
    ['an unclosed { in a list item', 'arms:\n  - { name: a\n  - { name: b }\n', 2, 5, /this \{ is never closed/, /\}/],
    ['a [ closed by }', 'design: { arms: [a, b }\nid: x\n', 1, 17, /this \[ is never closed/, /\]/],
  ])('%s', (_, text, line, column, message, expected) => {
    const error = firstError(text)!;
    expect(error.code).toBe('plan/bad-yaml');
    expect([error.line, error.column]).toEqual([line, column]);
    expect(error.message).toMatch(/^this is not valid YAML: /);
    expect(error.message).toMatch(message);
    expect(error.expected ?? '').toMatch(expected);
  });
});
