import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { twoCommitRepos } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE_TOUCHED, cleanPlan, planYaml } from '../review/scenarios.js';
import { runCli } from './helpers.js';

/** Regression tests for inputs a fuzzer found: each is the smallest reproducer of one failure, run through the CLI. */
const repo = twoCommitRepos();

describe('a plan id tens of thousands of characters long', () => {
  const longId = 'x'.repeat(40_000);

  it('is a validation error on check, never an internal error, even when the description names it', () => {
    const r = repo(baseFiles(), { 'experiments/good.yaml': planYaml(cleanPlan({ id: longId })), 'src/cart.ts': CART_CODE_TOUCHED });
    writeFileSync(join(r.root, 'pr.json'), JSON.stringify({ pull_request: { title: 'Cart', body: `Relates to ${longId} and (${longId}).` } }));
    const run = runCli(['-C', r.root, 'check', '--base', 'main', '--pr-json', 'pr.json', '--format', 'json']);
    expect(run.stderr).not.toContain('internal error');
    expect(run.status).not.toBe(3);
    expect(run.stdout).toContain('at most 100 characters long');
  });

  it('is reported by validate at the id field with its line', () => {
    const r = repo(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ id: longId })) }), {});
    const run = runCli(['-C', r.root, 'validate']);
    expect(run.status).toBe(1);
    expect(run.stdout + run.stderr).toMatch(/experiments\/good\.yaml:1:\d+: .*id: .*at most 100 characters long/);
  });
});

describe('deeply nested YAML', () => {
  it.each([300, 1000])('%i levels are a plan error at the line where the nesting passes the limit', (levels) => {
    const nested = `id: good\ntitle: ${'['.repeat(levels)}1${']'.repeat(levels)}\n`;
    const r = repo(baseFiles({ 'experiments/good.yaml': nested }), {});
    const run = runCli(['-C', r.root, 'validate']);
    expect(run.status).toBe(1);
    expect(run.stdout + run.stderr).toMatch(/experiments\/good\.yaml:2:\d+: .*nested more than 32 levels deep/);
    expect(run.stdout + run.stderr).not.toMatch(/Maximum call stack|internal error/);
  });
});
