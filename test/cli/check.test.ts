import { readFileSync, writeFileSync } from 'node:fs';
import { execFileSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { twoCommitRepos } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE_TOUCHED, cleanPlan, planYaml } from '../review/scenarios.js';
import { repoRoot, runCli } from './helpers.js';

const repo = twoCommitRepos();
const git = (cwd: string, ...args: string[]) => execFileSync('git', args, { cwd, encoding: 'utf8' });

describe('plumbline check', () => {
  it('exits 1 and explains when a decision rule is missing', () => {
    // A draft that starts later: its plan may still change, so only the missing rules block.
    const draft = { state: 'draft', window: { start: '2027-01-04', end: '2027-01-31' } };
    const plan = planYaml(cleanPlan({ ...draft, decisions: { win: 'Ship.' } }));
    const r = repo(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan(draft)) }), { 'experiments/good.yaml': plan, 'src/cart.ts': CART_CODE_TOUCHED });
    // The finding points at the plan's decisions: line, where the fix goes.
    const decisionsLine = plan.split('\n').findIndex((l) => l.startsWith('decisions:')) + 1;
    const run = runCli(['-C', r.root, 'check', '--base', 'main']);
    expect(run.status).toBe(1);
    expect(run.stdout).toMatch(/^Plumbline: blocked \(this change: 1 blocking finding\) for [0-9a-f]{7}\.\.\.[0-9a-f]{7}$/m);
    expect(run.stdout).toContain(`experiments/good.yaml:${decisionsLine}: BLOCK decisions-missing [good]: No decision rule for flat, loss, guardrail-breach`);
  });

  it('writes JSON that validates against the published schema when a plan never reaches its sample', () => {
    // Tiny traffic leaves sizing's figures out with a reason (no power at the end, nothing detectable within 0-100%,
    // no family power); every such field must be in the published schema (JSON Schema 2020-12, checked with Ajv).
    const draft = { state: 'draft', window: { start: '2027-01-04', end: '2027-01-31' }, design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 0.01 } };
    const r = repo(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan({ ...draft, title: 'Before' })) }), { 'experiments/good.yaml': planYaml(cleanPlan(draft)), 'src/cart.ts': CART_CODE_TOUCHED });
    const run = runCli(['-C', r.root, 'check', '--base', 'main', '--format', 'json']);
    const json = JSON.parse(run.stdout);
    const sizing = JSON.stringify(json.plans);
    expect(sizing).toContain('familyOmitted');
    expect(sizing).toMatch(/noPower|noneDetectable/);
    const schema = JSON.parse(readFileSync(join(repoRoot, 'schema/review-report.schema.json'), 'utf8'));
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(schema);
    expect(validate(json), JSON.stringify(validate.errors)).toBe(true);
  });

  it('exits 0 on a clean change and writes the JSON report to --output', () => {
    const r = repo(baseFiles(), { 'src/cart.ts': CART_CODE_TOUCHED });
    const run = runCli(['-C', r.root, 'check', '--base', 'main', '--format', 'json', '--output', 'report.json']);
    expect(run.status).toBe(0);
    const printed = JSON.parse(run.stdout);
    expect(printed).toMatchObject({ format: 'plumbline.review/1', verdict: 'clear', head: r.head, base: r.base });
    expect(JSON.parse(readFileSync(join(r.root, 'report.json'), 'utf8'))).toEqual(printed);
  });

  it('repeats the load warnings of the plans it reviews, once each, as warnings that do not block', () => {
    const draft = { state: 'draft', window: { start: '2027-01-04', end: '2027-01-31' } };
    const plan = planYaml(cleanPlan({ ...draft, surface: { path: 'shop/cart', 'exclusion-group': { name: 'cart-core', slice: { from: 0, to: 50 } } } }));
    const r = repo(baseFiles({ 'experiments/good.yaml': planYaml(cleanPlan(draft)) }), { 'experiments/good.yaml': plan, 'src/cart.ts': CART_CODE_TOUCHED });
    const keyLine = plan.split('\n').findIndex((l) => l.trimStart().startsWith('exclusion-group:')) + 1;
    const validate = runCli(['-C', r.root, 'validate']);
    expect(validate.stdout).toContain(`experiments/good.yaml:${keyLine}:3: warning: surface.exclusion-group:`);
    const text = runCli(['-C', r.root, 'check', '--base', 'main']);
    expect(text.status).toBe(0);
    expect(text.stdout.split('\n').filter((l) => l.includes('exclusion-group'))).toEqual([expect.stringContaining(`experiments/good.yaml:${keyLine}: warn  file-warning [good]: surface.exclusion-group: "exclusion-group" is the old name of "traffic-split"`)]);
    const markdown = runCli(['-C', r.root, 'check', '--base', 'main', '--format', 'markdown']);
    expect(markdown.stdout.match(/is the old name of/g)).toHaveLength(1);
    const json = JSON.parse(runCli(['-C', r.root, 'check', '--base', 'main', '--format', 'json']).stdout);
    const warnings = json.findings.filter((f: { code: string }) => f.code === 'file-warning');
    expect(warnings).toEqual([expect.objectContaining({ severity: 'warn', plan: 'good', file: 'experiments/good.yaml', line: keyLine })]);
    expect(warnings[0].message).toContain('plan/renamed-key');
  });

  it('reads the description from --pr-json in GitHub’s pull-request shape', () => {
    const r = repo(baseFiles(), { 'README.md': 'docs\n' });
    const pr = join(r.root, 'pr.json');
    writeFileSync(pr, JSON.stringify({ pull_request: { title: 'Docs', body: 'Relates to good.', labels: [{ name: 'docs' }], head: { ref: 'docs/x' } } }));
    const run = runCli(['-C', r.root, 'check', '--base', 'main', '--pr-json', 'pr.json', '--format', 'json']);
    expect(JSON.parse(run.stdout).plans.map((p: { id: string; reasons: string[] }) => [p.id, p.reasons])).toEqual([['good', ['named in the description']]]);
  });

  it('says there is nothing to check when the change touches no flag or plan', () => {
    const r = repo(baseFiles(), { 'README.md': 'docs\n' });
    const run = runCli(['-C', r.root, 'check', '--base', 'main', '--format', 'markdown']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('### ✅ Plumbline: nothing to check');
  });

  it('warns that the refs look swapped when head is an ancestor of base, and exits 0 as for any warning', () => {
    const r = repo(baseFiles(), { 'src/cart.ts': CART_CODE_TOUCHED });
    git(r.root, 'tag', 'before', r.base);
    git(r.root, 'tag', 'after', r.head);
    const swapped = runCli(['-C', r.root, 'check', '--base', 'after', '--head', 'before']);
    expect(swapped.status).toBe(0);
    expect(swapped.stdout).toMatch(/^Plumbline: passes, with warnings \(this change: 1 warning\) for /);
    expect(swapped.stdout).toContain('warn  refs-swapped: --head before is an ancestor of --base after: the refs look swapped; the change from base to head is empty, so nothing was reviewed.');
    const json = JSON.parse(runCli(['-C', r.root, 'check', '--base', 'after', '--head', 'before', '--format', 'json']).stdout);
    expect(json).toMatchObject({ verdict: 'warnings', counts: { block: 0, warn: 1, note: 0, known: 0 } });
    expect(json.findings.map((f: { code: string }) => f.code)).toEqual(['refs-swapped']);
    // The same commit on both sides is an empty change too, but nothing looks swapped.
    const same = runCli(['-C', r.root, 'check', '--base', 'after', '--head', 'after']);
    expect(same.status).toBe(0);
    expect(same.stdout).toMatch(/^Plumbline: nothing to check for /);
    // In the right order, the change is reviewed.
    expect(runCli(['-C', r.root, 'check', '--base', 'before', '--head', 'after']).stdout).not.toContain('refs-swapped');
  });

  it('gives a clear usage error for a ref that does not exist, and outside a repository', () => {
    const r = repo(baseFiles(), {});
    const missing = runCli(['-C', r.root, 'check', '--base', 'no-such-branch']);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain('plumbline: --base no-such-branch is not a commit in this repository');
    expect(missing.stderr).toContain('fetch-depth: 0');
    const outside = runCli(['-C', '/', 'check', '--base', 'main']);
    expect(outside.status).toBe(2);
    expect(outside.stderr).toMatch(/not a git repository|is not a commit/);
    expect(runCli(['check']).stderr).toContain("required option '--base <ref>' not specified");
  });

  it('runs on the demo change as npm run demo does', () => {
    const demo = spawnSync(process.execPath, ['scripts/demo.mjs'], { cwd: repoRoot, encoding: 'utf8' });
    expect(demo.status).toBe(0);
    expect(demo.stdout).toMatch(/### ⛔ Plumbline: blocked — first: /);
    expect(demo.stdout).toContain('(exit code 1: 1 means a blocking finding, which fails the check)');
  }, 120_000);
});
