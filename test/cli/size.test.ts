import { describe, expect, it } from 'vitest';
import { makeRepo, runCli } from './helpers.js';

const demo = ['-C', 'demo/repo'];

describe('plumbline size', () => {
  it('sizes a demo plan by id: absolute numbers beside relative changes, and the multipliers that applied', () => {
    const run = runCli([...demo, 'size', 'checkout-tip-prompt']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('Sizing for checkout-tip-prompt (experiments/checkout-tip-prompt.yaml)');
    expect(run.stdout).toContain('3 arms (control 34, fixed-amounts 33, percent-of-order 33), α 0.05 two-sided, power 80.0%');
    expect(run.stdout).toMatch(/tip-added\s+primary \(2-sided\)\s+6\.00% → 6\.90% \(\+15% relative, \+0\.9 pp\)/);
    expect(run.stdout).toContain('tip-added: 2 treatment arms against one control: α 0.025 per comparison (Bonferroni).');
    expect(run.stdout).toContain('tip-added: Interim looks (obrien-fleming-spending, 3 analyses): maximum sample ×1.01 to keep the planned power; stop at |z| ≥ ');
  });

  it('sizes by file path and reports exposure dilution in days', () => {
    const run = runCli([...demo, 'size', 'experiments/shared-list-invite.yaml']);
    expect(run.stdout).toMatch(/design effect ×1\.53 on units, whole groups per arm [\d,]+ \/ [\d,]+ \([\d,]+ groups in all; t reference with groups − 2 degrees of freedom\)/);
    expect(run.stdout).toMatch(/needs ×[\d.]+ the units and ×[\d.]+ the days of an analysis of reached units \(\d+ days\)/);
  });

  it('speaks JSON with no NaN, Infinity or null anywhere', () => {
    const run = runCli([...demo, 'size', 'search-suggestions-v2', '--format', 'json']);
    expect(run.stdout).not.toMatch(/NaN|Infinity|null/);
    const report = JSON.parse(run.stdout);
    expect(report.format).toBe('plumbline.sizing/1');
    expect(report.metrics[0]).toMatchObject({ metric: 'suggestion-clicks-per-search', role: 'primary', result: { ok: true } });
    expect(report.metrics[0].result.value.multipliers.dilutionUnits).toBeGreaterThan(2);
  });

  it('writes Markdown with a Mermaid power chart when the curve says something', () => {
    const run = runCli(['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.03', '--daily-units', '5000', '--days', '28', '--format', 'markdown']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('```mermaid\nxychart-beta\n  title "Power by day: metric"');
    expect(run.stdout).toContain('The planned 28 days give 46.0% power, below the planned 80.0%.');
  });

  it('sizes from flags: mean, ratio, clusters and looks', () => {
    const mean = runCli(['size', '--kind', 'mean', '--baseline', '42.5', '--sd', '30', '--effect', '0.02', '--daily-units', '3000', '--interim-looks', '2', '--boundary', 'pocock']);
    expect(mean.status).toBe(0);
    expect(mean.stdout).toMatch(/42\.5 → 43\.35 \(\+2% relative, \+0\.85\)/);
    expect(mean.stdout).toMatch(/Interim looks \(pocock, 3 analyses\): maximum sample ×1\.1\d/);
    const ratio = runCli(['size', '--kind', 'ratio', '--numerator', '0.9,1.4', '--denominator', '3.2,2.5', '--correlation', '0.55', '--effect', '0.05', '--cluster-size', '4', '--icc', '0.1']);
    expect(ratio.status).toBe(0);
    expect(ratio.stdout).toContain('design effect ×1.30 on units');
  });

  it.each([
    [['size'], 'name a plan (id or file), or describe the metric with --kind'],
    [['size', '--kind', 'proportion', '--baseline', 'ten'], '--baseline needs a decimal number; got "ten"'],
    [['size', '--kind', 'proportion', '--baseline', '0x10', '--effect', '0.1'], '--baseline needs a decimal number; got "0x10"'],
    [['size', '--kind', 'proportion', '--effect', '0.1'], '--baseline is required for --kind proportion'],
    [['size', '--kind', 'mean', '--baseline', '4', '--effect', '0.1'], '--sd is required for --kind mean'],
    [['size', '--kind', 'proportion', '--baseline', '0.1'], '--effect is required, unless --days and --daily-units ask what is detectable by then'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--days', '28'], '--days without --effect asks what is detectable by then, which needs --daily-units'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--pre-period-correlation', '1'], '--pre-period-correlation needs a correlation from 0 to 0.99'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--pre-period-correlation', '0.9999999'], '--pre-period-correlation needs a correlation from 0 to 0.99'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--cluster-size', '20', '--icc', '1.5'], '--icc needs an intra-cluster correlation from 0 to 1'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--cluster-size', '20', '--icc', '-0.1'], '--icc needs an intra-cluster correlation from 0 to 1'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--cluster-size', '0', '--icc', '0.1'], '--cluster-size needs a mean group size of at least 1'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--cluster-size', '0.5', '--icc', '0.1'], '--cluster-size needs a mean group size of at least 1'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--cluster-size', '20', '--icc', '0.1', '--size-cv', '-1'], '--size-cv needs the coefficient of variation of group sizes'],
    [['size', '--kind', 'proportion', '--baseline', '0.95', '--effect', '0.1'], 'cannot size this metric: effect: the effect takes the rate from 0.95 to 1.045, outside (0, 1)'],
    [['size', '--kind', 'proportion', '--baseline', '1', '--effect', '0.1'], '--baseline needs a baseline rate strictly between 0 and 1'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--power', '0.04'], 'power (0.04) must exceed the significance level (0.05)'],
    [['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--daily-units', '0'], '--daily-units needs expected new eligible units per day'],
    [['-C', 'demo/repo', 'size', 'nope'], 'no plan "nope" in this repository'],
  ])('refuses %j with a clear message and exit code 2', (args, message) => {
    const run = runCli(args);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain(message);
    expect(run.stderr).not.toMatch(/\n\s+at /);
  });

  it('without --effect, --days and --daily-units answer what is detectable by then', () => {
    const run = runCli(['size', '--kind', 'proportion', '--baseline', '0.1', '--days', '28', '--daily-units', '1000']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('10.0% → 11.0% (+10.3% relative, +1.03 pp)');
  });

  it('rounds groups up in each arm, not in total: m = 20, ICC 0.05 (design effect 1.95)', () => {
    const run = runCli(['size', '--kind', 'proportion', '--baseline', '0.3', '--effect', '0.1', '--cluster-size', '20', '--icc', '0.05', '--format', 'json']);
    expect(run.status).toBe(0);
    const size = JSON.parse(run.stdout).metrics[0].result.value.headline;
    expect(size.clustersPerArm.map((g: { groups: number }) => g.groups)).toEqual([size.clustersPerArm[0].groups, size.clustersPerArm[0].groups]);
    expect(size.clusters).toBe(2 * size.clustersPerArm[0].groups);
    expect(size.perArm[0].units).toBe(20 * size.clustersPerArm[0].groups);
  });

  it('says "not feasible" at 800 units a day, 3% baseline, +5% relative, and keeps counts to the digits they carry', () => {
    const run = runCli(['size', '--kind', 'proportion', '--baseline', '0.03', '--effect', '0.05', '--daily-units', '800', '--days', '28']);
    expect(run.stdout).toMatch(/Not feasible at this traffic: it needs \d+ days, beyond the longest sensible window of 56 days\. The longest window \(56 days\) can detect 3\.00% → /);
    const tiny = runCli(['size', '--kind', 'proportion', '--baseline', '0.03', '--effect', '1e-9', '--daily-units', '800']);
    expect(tiny.status).toBe(0);
    expect(tiny.stdout).toMatch(/\d\.\d\d × 10\^2\d/);
    expect(tiny.stdout).not.toMatch(/\d{16}/);
    expect(tiny.stdout).toContain('Not feasible at this traffic: it needs more than 1 × 10^12 units.');
  });

  it('the demo weekly-shopper test gives traffic as different people and shows the guardrail underpowered', () => {
    const run = runCli([...demo, 'size', 'basket-reorder-shortcut']);
    expect(run.stdout).toContain('40,000 different eligible units in 7 days and 60,000 different eligible units in 28 days');
    expect(run.stdout).toMatch(/basket-abandonment: The planned 28 days give \d+\.\d% power, below the planned 80\.0%\./);
    expect(run.stdout).toContain('Power for the family: ');
  });

  it('warns when the design needs more groups than --groups says exist, and not when there are enough', () => {
    const args = ['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--daily-units', '5000', '--days', '28', '--cluster-size', '20', '--icc', '0.05'];
    const short = runCli([...args, '--groups', '50']);
    expect(short.status).toBe(0);
    expect(short.stdout).toMatch(/The design needs [\d,]+ groups, but only 50 exist/);
    const enough = runCli([...args, '--groups', '100000']);
    expect(enough.stdout).not.toContain('groups, but only');
  });
});


describe('a plan named by id whose file does not load', () => {
  // Its id cannot be read from a file that fails to load, so `size <id>` used to answer "no plan <id> in this
  // repository". The file is found by the name plans are written under (<id>.yaml) or by its path.
  const plan = (extra: string) => `id: broken-plan\ntitle: T\nowners: ['@a']\nflags: [f]\nstate: draft\n${extra}`;
  it.each([['broken-plan'], ['experiments/broken-plan.yaml']])('size %s lists the file\'s errors', (name) => {
    const root = makeRepo({ 'experiments/broken-plan.yaml': plan('design: { alpha: lots }\n') });
    const run = runCli(['-C', root, 'size', name]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('experiments/broken-plan.yaml has errors:');
    expect(run.stderr).toContain('design.alpha');
    expect(run.stderr).not.toContain('no plan "broken-plan"');
  });
  it('a name that matches no file still says which plans exist', () => {
    const root = makeRepo({ 'experiments/broken-plan.yaml': plan('design: { alpha: lots }\n') });
    expect(runCli(['-C', root, 'size', 'other-plan']).stderr).toContain('no plan "other-plan" in this repository');
  });
});
