import { spawnSync } from 'node:child_process';
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
