import { describe, expect, it } from 'vitest';
import { runCli } from './helpers.js';

describe('plumbline srm', () => {
  it('raises the alarm below p = 0.0005 and exits 1', () => {
    const run = runCli(['srm', '50412', '49288']);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('chi-square = 12.672 on 1 df. Sample ratio mismatch: p = 3.71e-4 (alarm below 0.0005).');
  });

  it('states a p-value below 1e-12 as one comparison, "p < 1e-12"', () => {
    // chisq.test(c(1000, 2000)) in R 4.2 gives X-squared = 333.33 and p.value = 1.8e-74.
    const run = runCli(['srm', '1000', '2000']);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('chi-square = 333.333 on 1 df. Sample ratio mismatch: p < 1e-12 (alarm below 0.0005).');
    expect(run.stdout).not.toMatch(/p = </);
  });

  it.each([
    ['1e308', '1e308'],
    ['10.5', '9.5'],
    ['-1', '20'],
    ['9007199254740992', '1'],
  ])('refuses %s %s: counts are whole numbers from 0 to Number.MAX_SAFE_INTEGER (exit 2)', (...counts) => {
    const run = runCli(['srm', ...counts]);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain(`counts: "${counts[0]}" is not a count of units`);
    expect(run.stderr).toContain('write a whole number from 0 to 9007199254740991 (Number.MAX_SAFE_INTEGER)');
  });

  it.each([
    [['10', '20', '--threshold', '2'], '--threshold 2: expected a p-value strictly between 0 and 1'],
    [['10', '20', '--weights', '0,1'], '--weights: "0" is not a planned weight'],
    [['10', '20', '--weights', '1,1e-320'], '--weights: the planned weights are too far apart'],
  ])('refuses srm %j with a usage error naming the argument', (args, message) => {
    const run = runCli(['srm', ...args]);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain(message);
  });

  it.each([
    [['9007199254740991', '9007199254740991']],
    [['0', '5']],
    [['10', '20', '--weights', '1e308,1e308']],
  ])('never prints NaN, Infinity or n/a at the edges it accepts: srm %j', (args) => {
    const run = runCli(['srm', ...args]);
    expect(run.status).toBe(0);
    expect(run.stdout).not.toMatch(/NaN|Infinity|n\/a/);
    expect(run.stdout).toMatch(/No sample ratio mismatch: p = \d/);
  });

  it('shows a fractional expected count as it is (2.5, not 3)', () => {
    expect(runCli(['srm', '0', '5']).stdout).toMatch(/arm 1 +50\.0% +0 +2\.5 +0\.00%/);
  });

  it('passes a split that fits its planned weights (chisq.test(c(5050, 4950)) gives p = 0.3173 in R 4.2.2)', () => {
    const run = runCli(['srm', '5050', '4950', '--weights', '50,50', '--format', 'json']);
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(report).toMatchObject({ format: 'plumbline.srm/1', mismatch: false, degreesOfFreedom: 1 });
    expect(report.pValue).toBeCloseTo(0.3173105079, 9);
  });

  it('refuses counts that do not match the weights', () => {
    const run = runCli(['srm', '10', '20', '30', '--weights', '50,50']);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('arms: 3 observed counts for 2 planned arms');
  });
});

describe('plumbline adjust', () => {
  it('reproduces the Benjamini & Hochberg (1995) example: 4 found by BH, 3 by Holm, 3 by Bonferroni', () => {
    const p = ['0.0001', '0.0004', '0.0019', '0.0095', '0.0201', '0.0278', '0.0298', '0.0344', '0.0459', '0.3240', '0.4262', '0.5719', '0.6528', '0.7590', '1.000'];
    const run = runCli(['adjust', ...p]);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('At 0.05: Benjamini-Hochberg (false discovery rate) finds 4 of 15 significant; Holm (any false alarm, step-down) finds 3; Bonferroni (any false alarm) finds 3.');
    const holm = JSON.parse(runCli(['adjust', '--format', 'json', ...p]).stdout).holm as number[];
    [0.0015, 0.0056, 0.0247, 0.114].forEach((v, i) => expect(holm[i]).toBeCloseTo(v, 12));
  });

  it('refuses what is not a p-value', () => {
    expect(runCli(['adjust', '0.5', 'x']).stderr).toContain('p-values: "x" is not a number');
    expect(runCli(['adjust', '0.5', '1.5']).stderr).toContain('every p-value must lie in [0, 1]');
  });
});
