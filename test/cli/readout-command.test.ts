import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDocument } from 'yaml';
import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import { repoRoot, runCli } from './helpers.js';

const DEMO = join(repoRoot, 'demo/repo');
const TOTALS = 'readouts/checkout-wallet-first.totals.yaml';

function demoCopy(): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-readout-'));
  cpSync(DEMO, dir, { recursive: true });
  return dir;
}

describe('plumbline readout on the demo', () => {
  it('reads the overdue test out: the rule applied first, absolute beside relative', () => {
    const run = runCli(['-C', DEMO, 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const lines = run.stdout.split('\n');
    expect(lines[3]).toBe('Rule applied: win: «Make wallets first for everyone.»');
    expect(run.stdout).toMatch(/\+0\.899 pp \[\+0\.66, \+1\.14\]\s+\+1\.1% \[/);
    expect(run.stdout).toContain('harm ruled out');
    expect(run.stdout).not.toMatch(/NaN|Infinity|n\/a|undefined|null/);
  });

  it('JSON carries the same outcome and no non-finite number', () => {
    const run = runCli(['-C', DEMO, 'readout', 'experiments/checkout-wallet-first.yaml', '--totals', TOTALS, '--format', 'json']);
    const report = JSON.parse(run.stdout);
    expect(report).toMatchObject({ format: 'plumbline.readout/1', planId: 'checkout-wallet-first', verdict: 'win', verdictArms: ['treatment'] });
    expect(run.stdout).not.toMatch(/NaN|Infinity|null/);
  });

  it('Markdown renders with GitHub’s renderer into the tables it means (cmark-gfm)', () => {
    const run = runCli(['-C', DEMO, 'readout', 'checkout-wallet-first', '--totals', TOTALS, '--format', 'markdown']);
    expect(run.stdout.split('\n')[2]).toBe('Rule applied: **win**: «Make wallets first for everyone.»');
    const html = spawnSync('cmark-gfm', ['-e', 'table', '-e', 'autolink', '-e', 'strikethrough', '-e', 'tagfilter'], { input: run.stdout, encoding: 'utf8' });
    if (html.status === 0) {
      expect((html.stdout.match(/<table>/g) ?? []).length).toBe(5);
      expect(html.stdout).toContain('<strong>win</strong>');
    }
  });

  it('a bad totals file is a usage error naming file, line and field', () => {
    const dir = demoCopy();
    const path = join(dir, TOTALS);
    writeFileSync(path, readFileSync(path, 'utf8').replace('  treatment:', '  treatement:'));
    const run = runCli(['-C', dir, 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/readouts\/checkout-wallet-first\.totals\.yaml:\d+:\d+: error: arms\.treatement: arm "treatement" is not in the plan; did you mean "treatment"\?/);
    expect(run.stderr).not.toMatch(/at .*\.js:\d+/);
  });

  it('--record writes the outcome block and keeps every other line, comment and layout of the plan', () => {
    const dir = demoCopy();
    const planPath = join(dir, 'experiments/checkout-wallet-first.yaml');
    const before = readFileSync(planPath, 'utf8');
    const run = runCli(['-C', dir, 'readout', 'checkout-wallet-first', '--totals', TOTALS, '--record', '--decided-by', '@ines-carvalho', '--today', '2026-12-08']);
    expect(run.status).toBe(0);
    expect(run.stderr).toContain('Recorded the outcome (win) in experiments/checkout-wallet-first.yaml.');
    const after = readFileSync(planPath, 'utf8');
    expect(after.startsWith(before)).toBe(true);
    const outcome = parseDocument(after).toJS().outcome;
    expect(outcome).toMatchObject({ class: 'win', arms: ['treatment'], 'data-through': '2026-12-06', 'decided-by': '@ines-carvalho', 'recorded-on': '2026-12-08', totals: TOTALS });
    expect(outcome.figures[0]).toMatchObject({ arm: 'treatment', metric: 'payment-completed' });
    // The plan with its outcome still loads under the plan schema.
    expect(loadPlan(after, 'experiments/checkout-wallet-first.yaml').ok).toBe(true);
    // Recording again replaces the block and keeps an override a person wrote.
    writeFileSync(planPath, after.replace("  decided-by: \"@ines-carvalho\"", "  decided-by: \"@ines-carvalho\"\n  override: { reason: Ship to web only first. }"));
    runCli(['-C', dir, 'readout', 'checkout-wallet-first', '--totals', TOTALS, '--record', '--decided-by', '@kofi-mensah', '--today', '2026-12-09']);
    const again = parseDocument(readFileSync(planPath, 'utf8')).toJS().outcome;
    expect(again).toMatchObject({ 'decided-by': '@kofi-mensah', override: { reason: 'Ship to web only first.' } });
  });

  it('--record needs a decider', () => {
    const run = runCli(['-C', DEMO, 'readout', 'checkout-wallet-first', '--totals', TOTALS, '--record']);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('--record needs --decided-by');
  });
});

describe('plumbline readout applies the rule registered at launch', () => {
  const git = (cwd: string, ...args: string[]) =>
    execFileSync('git', args, { cwd, encoding: 'utf8', env: { ...process.env, GIT_AUTHOR_NAME: 'T', GIT_AUTHOR_EMAIL: 't@example.invalid', GIT_COMMITTER_NAME: 'T', GIT_COMMITTER_EMAIL: 't@example.invalid', GIT_CONFIG_GLOBAL: '/dev/null', GIT_CONFIG_NOSYSTEM: '1' } }).trim();
  const PLAN = 'experiments/checkout-wallet-first.yaml';

  /** The demo committed as launched; then the plan edited as given and the totals naming the launch commit. */
  function launchedThenEdited(edit: (plan: string) => string): string {
    const dir = demoCopy();
    git(dir, 'init', '-q', '-b', 'main');
    git(dir, 'add', '-A');
    git(dir, 'commit', '-q', '-m', 'launch');
    const launch = git(dir, 'rev-parse', '--short=7', 'HEAD');
    writeFileSync(join(dir, PLAN), edit(readFileSync(join(dir, PLAN), 'utf8')));
    writeFileSync(join(dir, TOTALS), readFileSync(join(dir, TOTALS), 'utf8').replace(/^plan-commit: .*$/m, `plan-commit: ${launch}`));
    git(dir, 'commit', '-q', '-am', 'later');
    return dir;
  }

  it('says the rule is the one registered at launch when the plan is unchanged', () => {
    const run = runCli(['-C', launchedThenEdited((p) => p), 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(run.status).toBe(0);
    expect(run.stdout.split('\n')[1]).toMatch(/Rule as registered at launch \([0-9a-f]{7}\)\.$/);
  });

  it('blocks a rule changed after launch without an amendment, and applies the launch rule', () => {
    // The win rule rewritten and the tolerance widened after launch.
    const dir = launchedThenEdited((p) => p.replace('win: Make wallets first for everyone.', 'win: Make wallets first and drop the card form.').replace('tolerance: { absolute: 0.003 }', 'tolerance: { absolute: 0.03 }'));
    const run = runCli(['-C', dir, 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('Rule applied: win: «Make wallets first for everyone.»');
    expect(run.stdout).toMatch(/BLOCK The rule was changed after launch \(plan-commit [0-9a-f]{7}\) without an amendment: metrics\.guardrails\[payment-errors\]\.tolerance \(\{ absolute: 0\.003 \} → \{ absolute: 0\.03 \}\); decisions\.win \(Make wallets first for everyone\. → Make wallets first and drop the card form\.\)\. This readout applies the rule as registered at launch/);
    // The guardrail is read against the launch tolerance, 0.3 pp.
    expect(run.stdout).toContain('(tolerance 0.3 pp)');
    // An amendment covers the change: the amended rule applies, with a note.
    const amended = launchedThenEdited((p) => `${p.replace('win: Make wallets first for everyone.', 'win: Make wallets first and drop the card form.')}amendments:\n  - { date: 2026-11-20, changed: win rule, reason: Card support ends in January. }\n`);
    const ok = runCli(['-C', amended, 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(ok.status).toBe(0);
    expect(ok.stdout).toContain('Rule applied: win: «Make wallets first and drop the card form.»');
    expect(ok.stdout).toContain('The plan was amended after launch');
  });

  it('warns and uses today’s plan when the plan-commit is not in the repository, or there is no repository', () => {
    const dir = launchedThenEdited((p) => p);
    writeFileSync(join(dir, TOTALS), readFileSync(join(dir, TOTALS), 'utf8').replace(/^plan-commit: .*$/m, 'plan-commit: deadbee'));
    const run = runCli(['-C', dir, 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(run.status).toBe(0);
    expect(run.stdout.split('\n')[1]).toMatch(/Today's plan: the plan at deadbee cannot be read\.$/);
    expect(run.stdout).toContain("The plan as registered at launch cannot be read: the commit deadbee is not in this repository (a shallow clone, or a mistyped plan-commit). This readout uses today's plan");
    const bare = runCli(['-C', demoCopy(), 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    expect(bare.stdout).toContain('cannot be read: this folder is not a git repository.');
  });

  it('on the demo, reads the plan as launched from this repository’s own history', () => {
    const run = runCli(['-C', DEMO, 'readout', 'checkout-wallet-first', '--totals', TOTALS]);
    const launched = spawnSync('git', ['rev-parse', '--verify', '--quiet', 'f04e991^{commit}'], { cwd: repoRoot, encoding: 'utf8' });
    // A shallow clone lacks the commit; then the readout says so instead.
    expect(run.stdout.split('\n')[1]).toMatch(launched.status === 0 ? /Rule as registered at launch \(f04e991\)\.$/ : /Today's plan: the plan at f04e991 cannot be read\.$/);
  });
});
