// End to end, as a user runs it: raw exposure and event files -> `plumbline totals` -> `plumbline readout`, on a copy
// of the demo repository's overdue test (checkout-wallet-first). The generated data carries a known effect on the
// primary and none on the guardrail; the readout's intervals must cover those true values, and the dirt in the files
// (units in two arms, unknown arms) must reach the readout as counted exclusions.
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { generateData, GUARDRAIL_EVENT_FIX, OVERDUE_PLAN, PLANTED_GUARDRAIL, PLANTED_PRIMARY, writeCsv, writeParquet } from '../helpers/generated-data.js';

const cli = new URL('../../dist/cli.js', import.meta.url).pathname;
const demo = new URL('../../demo/repo', import.meta.url).pathname;
const work = mkdtempSync(join(tmpdir(), 'plumbline-e2e-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** A copy of the demo repository, with the data settings the totals command reads. */
function demoCopy(name: string): string {
  const repo = join(work, name);
  cpSync(demo, repo, { recursive: true });
  // The demo plan's payment-errors guardrail lists order_placed, the primary's event, which would make it a copy of
  // the primary; the generated data logs payment failures as payment_failed.
  const planPath = join(repo, OVERDUE_PLAN.file);
  const plan = readFileSync(planPath, 'utf8');
  if (!plan.includes(GUARDRAIL_EVENT_FIX.from)) throw new Error('the demo plan’s guardrail events changed: update GUARDRAIL_EVENT_FIX');
  writeFileSync(planPath, plan.replace(GUARDRAIL_EVENT_FIX.from, GUARDRAIL_EVENT_FIX.to));
  const settings = readFileSync(join(repo, '.plumbline.yml'), 'utf8');
  writeFileSync(join(repo, '.plumbline.yml'), `${settings}data:\n  exposures: { experiment: experiment, segments: [platform] }\n`);
  return repo;
}

function plumbline(repo: string, args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [cli, '-C', repo, ...args], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const data = generateData({ seed: 12, units: 24_000 });

interface Comparison {
  difference: number;
  interval: { low: number; high: number };
  relative: { value: number; interval: { low: number; high: number } };
}
interface MetricReadout {
  metric: string;
  arms: { arm: string; comparison: Comparison }[];
}

describe.each([
  ['Parquet', 'parquet'],
  ['CSV', 'csv'],
] as const)('%s files -> plumbline totals -> plumbline readout on the overdue demo test', (_label, format) => {
  const repo = demoCopy(`repo-${format}`);
  // The exports inside the repository: --data is a folder (or glob) relative to the repository root.
  const folder = join(repo, 'exports');
  // Paths given to the CLI are relative to the repository root, as a user in the repository writes them.
  const totalsPath = `readouts/${OVERDUE_PLAN.id}.generated.totals.yaml`;
  const totalsFile = join(repo, totalsPath);

  it('writes a totals file from the raw files', async () => {
    if (format === 'parquet') await writeParquet(data, folder);
    else writeCsv(data, folder);
    const run = plumbline(repo, ['totals', OVERDUE_PLAN.id, '--data', 'exports', '--through', OVERDUE_PLAN.dataThrough, '--plan-commit', '5e0c9a4', '--progress', '--out', totalsPath]);
    expect(run.stderr + run.stdout).not.toMatch(/internal error|NaN|Infinity/i);
    expect(run.status).toBe(0);
    const totals = parse(readFileSync(totalsFile, 'utf8')) as { plan: string; 'data-through': string; arms: Record<string, { units: number }> };
    expect(totals.plan).toBe(OVERDUE_PLAN.id);
    expect(totals['data-through']).toBe(OVERDUE_PLAN.dataThrough);
    // Every clean unit lands in its arm: the assigned units less those dropped as several-arm units or lost to
    // the exposure window (the outside-window units are extra units, not assigned ones).
    const counted = Object.values(totals.arms).reduce((sum, arm) => sum + arm.units, 0);
    const assigned = Object.values(data.assigned).reduce((s, n) => s + n, 0);
    expect(counted).toBe(assigned - data.dirt.severalArmUnits);
  });

  it('reads out the planted effect within its interval, and the guardrail unchanged', () => {
    const run = plumbline(repo, ['readout', OVERDUE_PLAN.id, '--totals', totalsPath, '--format', 'json']);
    expect(run.stderr).not.toMatch(/internal error/i);
    const readout = JSON.parse(run.stdout) as { primary: MetricReadout; guardrails: MetricReadout[]; findings: { code: string; message: string }[] };
    const primary = readout.primary.arms.find((a) => a.arm === 'treatment')!.comparison;
    expect(readout.primary.metric).toBe(PLANTED_PRIMARY.metric);
    // The true difference is the planted one: the interval covers it (a fixed seed, so this holds or fails every run).
    expect(primary.interval.low).toBeLessThanOrEqual(PLANTED_PRIMARY.absoluteLift);
    expect(primary.interval.high).toBeGreaterThanOrEqual(PLANTED_PRIMARY.absoluteLift);
    expect(primary.relative.interval.low).toBeLessThanOrEqual(PLANTED_PRIMARY.relativeLift);
    expect(primary.relative.interval.high).toBeGreaterThanOrEqual(PLANTED_PRIMARY.relativeLift);
    // Planted large enough to be found: the interval excludes no effect.
    expect(primary.interval.low).toBeGreaterThan(0);
    const guardrail = readout.guardrails.find((g) => g.metric === PLANTED_GUARDRAIL.metric)!.arms[0]!.comparison;
    expect(guardrail.interval.low).toBeLessThanOrEqual(0);
    expect(guardrail.interval.high).toBeGreaterThanOrEqual(0);
    // Units exposed in both arms break randomization: the readout says how many were left out.
    const exclusion = readout.findings.find((f) => f.message.includes(String(data.dirt.severalArmUnits)));
    expect(exclusion, JSON.stringify(readout.findings.map((f) => f.code))).toBeDefined();
  });
});
