import { describe, expect, it } from 'vitest';
import { runCli } from './helpers.js';

describe('plumbline srm', () => {
  it('raises the alarm below p = 0.0005 and exits 1', () => {
    const run = runCli(['srm', '50412', '49288']);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('chi-square = 12.672 on 1 df. Sample ratio mismatch: p = 3.71e-4 < 0.0005.');
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
