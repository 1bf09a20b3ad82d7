import { readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { makeRepo, repoRoot, runCli } from './helpers.js';

const fixture = (name: string) => readFileSync(join(repoRoot, 'test/fixtures/plans', name), 'utf8');
const demo = ['-C', 'demo/repo'];

describe('plumbline validate', () => {
  it('checks the demo: valid, with the missing decision rules reported at their file', () => {
    const run = runCli([...demo, 'validate']);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^experiments\/delivery-slot-nudge\.yaml:3:1: warning: decisions: no decision rule for win, flat, loss, guardrail-breach/m);
    expect(run.stdout).toContain('Checked 6 plan files and 1 registry file (settings: .plumbline.yml): valid, with 1 warning.');
    expect(run.stdout).not.toContain('\u001b[');
    expect(run.stderr).toBe('');
  });

  it('reports the same in JSON', () => {
    const run = runCli([...demo, 'validate', '--format', 'json']);
    const report = JSON.parse(run.stdout);
    expect(report).toMatchObject({ format: 'plumbline.validation/1', valid: true, planFiles: 6, validPlans: 6, registryEntries: 7, errors: 0, warnings: 1 });
    expect(report.problems[0]).toMatchObject({ file: 'experiments/delivery-slot-nudge.yaml', code: 'plan/decisions-missing', severity: 'warning' });
  });

  it('exits 1 with located messages, and no stack trace, when a plan is invalid', () => {
    const root = makeRepo({ 'experiments/ok.yaml': fixture('valid/minimal.yaml'), 'experiments/bad.yaml': fixture('invalid/alpha-out-of-range.yaml') });
    const run = runCli(['-C', root, 'validate']);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('experiments/bad.yaml:19:10: error: design.alpha: is out of range (expected a significance level strictly between 0 and 1, e.g. 0.05; found the number 1.5)');
    expect(run.stdout).toContain('1 error in 1 plan file');
    expect(run.stdout + run.stderr).not.toMatch(/\n\s+at /);
  });

  it('reports duplicate ids across files', () => {
    const root = makeRepo({ 'experiments/a.yaml': fixture('duplicate-ids/first.yaml'), 'experiments/b.yaml': fixture('duplicate-ids/second.yaml') });
    const run = runCli(['-C', root, 'validate']);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('experiments/b.yaml:3:1: error: id: id "minimal-plan" is already used by experiments/a.yaml:2');
  });

  it('works with zero configuration and says when there are no plans', () => {
    const run = runCli(['-C', makeRepo({ 'README.md': 'empty' }), 'validate']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('No plan files found (no settings file: defaults). Create one with: plumbline new <flag-key>');
  });

  it('exits 2 on an invalid settings file, naming its line', () => {
    const root = makeRepo({ '.plumbline.yml': 'plans: [experiments]\nregistry: [x.yaml]\n' });
    const run = runCli(['-C', root, 'validate']);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('.plumbline.yml:2:1: error: registry: unknown key "registry"; did you mean "registries"?');
  });

  it('exits 2 when a registry file named in the settings is missing', () => {
    const root = makeRepo({ '.plumbline.yml': 'registries:\n  - ops/tests.yaml\n' });
    const run = runCli(['-C', root, 'validate']);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('.plumbline.yml:2:5: error: registries[0]: the registry file ops/tests.yaml does not exist');
  });

  it('exits 2 on usage errors', () => {
    expect(runCli(['validate', '--format', 'xml']).status).toBe(2);
    expect(runCli(['frobnicate']).status).toBe(2);
    const missing = runCli(['-C', 'demo/repo', '--config', 'nope.yml', 'validate']);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain('plumbline: the settings file nope.yml does not exist');
  });
});

describe('plumbline list', () => {
  it('shows the registry, live tests first, with plans and registry-file entries', () => {
    const run = runCli([...demo, 'list']);
    expect(run.status).toBe(0);
    const lines = run.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^ID\s+STATE\s+SURFACE\s+WINDOW\s+OWNERS\s+FILE$/);
    expect(lines[1]).toMatch(/^partner-checkout-banner\s+live\s+checkout\s+2026-11-02 to 2026-12-31\s+@bramblecart\/partner-shops\s+registry\/partner-tests\.yaml:4$/);
    expect(lines.at(-1)).toBe('7 tests: 5 live, 2 draft.');
  });

  it('filters by state and speaks JSON', () => {
    const run = runCli([...demo, 'list', '--state', 'draft', '--format', 'json']);
    const report = JSON.parse(run.stdout);
    expect(report.format).toBe('plumbline.registry/1');
    expect(report.tests.map((t: { id: string }) => t.id)).toEqual(['delivery-slot-nudge', 'shared-list-invite']);
    expect(report.tests[1]).toMatchObject({ surface: 'household/shared-list', window: { start: '2026-12-14', end: '2027-01-24' } });
  });

  it('leaves out invalid files and says so', () => {
    const root = makeRepo({ 'experiments/ok.yaml': fixture('valid/minimal.yaml'), 'experiments/bad.yaml': fixture('invalid/bad-yaml.yaml') });
    const run = runCli(['-C', root, 'list']);
    expect(run.stdout).toContain('1 file with errors left out; run plumbline validate.');
  });

  it('in a repository without plan files, says so and how to write one, as validate does', () => {
    const root = makeRepo({ 'src/app.ts': 'export {};\n' });
    const list = runCli(['-C', root, 'list']);
    expect(list.status).toBe(0);
    expect(list.stdout).toContain('No plan files found (no settings file: defaults). Create one with: plumbline new <flag-key>');
    expect(runCli(['-C', root, 'validate']).stdout).toContain('No plan files found (no settings file: defaults).');
    // A filter that matches nothing in a repository that has plans is not "no plan files".
    expect(runCli([...demo, 'list', '--state', 'on-hold']).stdout).not.toContain('No plan files found');
  });
});

describe('plumbline new', () => {
  it('writes a draft plan that validates, and refuses to overwrite it', () => {
    const root = makeRepo({});
    const first = runCli(['-C', root, 'new', 'checkoutWalletFirst', '--owner', '@ana-lima', '--today', '2026-12-01']);
    expect(first.status).toBe(0);
    expect(first.stdout).toContain('Wrote experiments/checkout-wallet-first.yaml (plan checkout-wallet-first).');
    const path = join(root, 'experiments/checkout-wallet-first.yaml');
    const text = readFileSync(path, 'utf8');
    expect(text).toMatch(/^# yaml-language-server: \$schema=\.\.\/node_modules\/plumbline\/schema\/plan\.schema\.json\n/);
    expect(text).toContain('flags: ["checkoutWalletFirst"]');
    expect(text).toContain('  start: 2026-12-08\n  end: 2027-01-04');

    const validate = runCli(['-C', root, 'validate', '--format', 'json']);
    expect(JSON.parse(validate.stdout)).toMatchObject({ valid: true, planFiles: 1 });

    const again = runCli(['-C', root, 'new', 'checkoutWalletFirst', '--today', '2026-12-01']);
    expect(again.status).toBe(2);
    expect(again.stderr).toContain('a plan with id "checkout-wallet-first" already exists');
    expect(readFileSync(path, 'utf8')).toBe(text);
  });

  it('refuses an existing file unless --force, and never leaves a partial file', () => {
    const root = makeRepo({ 'experiments/keep.yaml': 'not a plan\n' });
    const refused = runCli(['-C', root, 'new', 'other-flag', '--out', 'experiments/keep.yaml', '--today', '2026-12-01']);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toContain('experiments/keep.yaml already exists');
    expect(readFileSync(join(root, 'experiments/keep.yaml'), 'utf8')).toBe('not a plan\n');
    const forced = runCli(['-C', root, 'new', 'other-flag', '--out', 'experiments/keep.yaml', '--force', '--today', '2026-12-01']);
    expect(forced.status).toBe(0);
    expect(readFileSync(join(root, 'experiments/keep.yaml'), 'utf8')).toContain('id: other-flag');
    expect(existsSync(join(root, 'experiments')) && readFileSync(join(root, 'experiments/keep.yaml'), 'utf8').endsWith('\n')).toBe(true);
  });

  it('rejects a bad --today and a bad surface before writing anything', () => {
    const root = makeRepo({});
    expect(runCli(['-C', root, 'new', 'f', '--today', '2026-02-30']).stderr).toContain('--today "2026-02-30" is not a date');
    const bad = runCli(['-C', root, 'new', 'f', '--surface', 'Checkout Page', '--today', '2026-12-01']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('surface.path');
    expect(existsSync(join(root, 'experiments'))).toBe(false);
  });
});

describe('mistyped input on the command line', () => {
  it.each([['validate'], ['list'], ['digest'], ['check', '--base', 'main']])('%s in a folder that does not exist is a usage error, never an all-clear', (...args) => {
    const run = runCli(['-C', '/nonexistent/plumbline-repo', ...args]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('the repository folder /nonexistent/plumbline-repo does not exist');
  });

  it.each([
    [['srm', '0x10', '20'], 'counts: "0x10" is not a number'],
    [['srm', '10', '20', '--weights', '0x32,50'], 'weights: "0x32" is not a number'],
    [['adjust', '0b1'], 'p-values: "0b1" is not a number'],
    [['adjust', '0.01', '--q', '0'], '--q 0: expected a level strictly between 0 and 1'],
    [['adjust', '0.01', '--q', '1'], '--q 1: expected a level strictly between 0 and 1'],
  ])('%j reads plain decimal numbers only', (args, message) => {
    const run = runCli(args);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain(message);
  });
});

describe('plumbline schema and help', () => {
  it('prints the committed plan schema', () => {
    const run = runCli(['schema', 'plan']);
    expect(run.stdout).toBe(readFileSync(join(repoRoot, 'schema/plan.schema.json'), 'utf8'));
  });

  it('prints the committed arm-totals schema, which the demo totals file names', () => {
    const run = runCli(['schema', 'totals']);
    expect(run.status).toBe(0);
    expect(run.stdout).toBe(readFileSync(join(repoRoot, 'schema/totals.schema.json'), 'utf8'));
  });

  it('documents the exit codes in --help', () => {
    const run = runCli(['--help']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('Exit codes: 0 fine, 1 blocking findings or invalid plans, 2 usage, settings or\nenvironment error, 3 internal error (a bug).');
    for (const command of ['validate', 'list', 'new', 'schema']) expect(runCli([command, '--help']).status).toBe(0);
  });

  it('prints the package version for --version and -V, with or without the parser loaded', () => {
    const { version } = JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8')) as { version: string };
    for (const args of [['--version'], ['-V'], ['--no-color', '--version']]) {
      const run = runCli(args);
      expect({ args, status: run.status, stdout: run.stdout }).toEqual({ args, status: 0, stdout: `${version}\n` });
    }
  });
});
