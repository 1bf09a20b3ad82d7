import { readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Cold start: `plumbline --help` loads main.ts and everything it imports statically, so the command
 * modules must reach their use cases, zod, yaml, the statistics and git only through import() inside
 * their actions. This walks the static import graph of the sources from cli/main.ts (type-only
 * imports are erased by the compiler and do not count).
 */
const SRC = resolve(__dirname, '../../src');
const STATIC = /^(?:import|export)\s+(type\s+)?(?:[^;]*?\s+from\s+)?'([^']+)';/gms;

function staticGraph(entry: string): { files: Set<string>; packages: Set<string> } {
  const files = new Set<string>();
  const packages = new Set<string>();
  const visit = (file: string) => {
    if (files.has(file)) return;
    files.add(file);
    for (const match of readFileSync(file, 'utf8').matchAll(STATIC)) {
      if (match[1]) continue;
      const spec = match[2]!;
      if (spec.startsWith('.')) visit(resolve(dirname(file), spec.replace(/\.js$/, '.ts')));
      else packages.add(spec);
    }
  };
  visit(entry);
  return { files, packages };
}

describe('what the program loads before it parses', () => {
  const { files, packages } = staticGraph(join(SRC, 'cli/main.ts'));
  const reached = [...files].map((f) => relative(SRC, f));

  it('reaches every command module (the walk follows the wiring)', () => {
    expect(reached).toEqual(expect.arrayContaining(['cli/validate-command.ts', 'cli/check-command.ts', 'cli/size-command.ts', 'cli/common.ts']));
  });

  it('loads no use case, git, report or file-format code', () => {
    expect(reached.filter((f) => f.startsWith('run/') || f === 'adapters/git.ts' || f.startsWith('core/report/') || f === 'core/source/fields.ts' || f.endsWith('/schema.ts') || f.endsWith('/load.ts'))).toEqual([]);
  });

  it('loads no package but commander and Node built-ins', () => {
    expect([...packages].filter((p) => p !== 'commander' && !p.startsWith('node:'))).toEqual([]);
  });

  it('keeps the SQL engines and the query builder out: only `plumbline totals` loads them, by import()', () => {
    expect(reached.filter((f) => f.startsWith('adapters/sql/') || f.startsWith('core/totals-query/'))).toEqual([]);
    expect([...packages].filter((p) => p === 'pg' || p.startsWith('@duckdb/') || p === 'node-sql-parser')).toEqual([]);
    expect(reached).toContain('cli/totals-command.ts');
  });
});

describe('the totals use case', () => {
  it('loads neither DuckDB, pg nor git statically: the command passes them in', () => {
    const { files, packages } = staticGraph(join(SRC, 'run/totals.ts'));
    const reached = [...files].map((f) => relative(SRC, f));
    expect(reached.filter((f) => f.startsWith('adapters/'))).toEqual([]);
    expect([...packages].filter((p) => p === 'pg' || p.startsWith('@duckdb/'))).toEqual([]);
  });
});
