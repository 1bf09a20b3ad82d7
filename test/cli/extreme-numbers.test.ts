import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main.js';
import { memoryChange, memoryFiles } from '../../scripts/fuzz/memory-repo.js';
import { checkOutput } from '../../scripts/fuzz/oracles.js';
import { baseFiles, CART_CODE_TOUCHED, cleanPlan, planYaml } from '../review/scenarios.js';

/**
 * The extreme numbers that once put null, NaN, ∞ or n/a into reports, through the CLI program in process
 * (files in memory, as the fuzzer runs it) in every format of size, check and digest.
 */
const design = (extra: Record<string, unknown>) => ({ design: { ...(cleanPlan().design as object), ...extra } });
const primary = (metric: Record<string, unknown>) => ({ metrics: { ...(cleanPlan().metrics as object), primary: { name: 'm', events: ['order_done'], ...metric } } });
const sevenArms = Array.from({ length: 7 }, (_, i) => ({ name: i === 0 ? 'control' : `arm-${i}`, weight: 1 }));

async function cli(files: Map<string, string>, base: Map<string, string>, argv: string[]) {
  let stdout = '';
  let stderr = '';
  const exit = await runCli(['node', 'plumbline', '-C', '/repo', ...argv], {
    files: () => memoryFiles(files),
    openChange: async () => memoryChange(base, files),
    write: { out: (t) => void (stdout += t), err: (t) => void (stderr += t) },
  });
  return { exit, stdout, stderr };
}

describe.each([
  ['daily units 5e-324', design({ 'daily-units': 5e-324 })],
  ['daily units 1e308', design({ 'daily-units': 1e308 })],
  ['a mean of 1e308 with sd 1e308', primary({ kind: 'mean', baseline: { mean: 1e308, sd: 1e308 } })],
  ['a mean of -1e308 with sd 1e308', primary({ kind: 'mean', baseline: { mean: -1e308, sd: 1e308 } })],
  ['cluster mean size 1e308 with size CV 1e6', { unit: { randomization: 'household', analysis: 'user' }, ...design({ cluster: { 'mean-size': 1e308, icc: 0.05, 'size-cv': 1e6 } }) }],
  ['weights that round one arm to nothing', design({ arms: [{ name: 'control', weight: 1e300 }, { name: 'treatment', weight: 1 }] })],
  ['7 arms with a tiny effect', design({ arms: sevenArms, 'min-detectable-effect': { relative: 1e-9 } })],
  ['7 arms with the smallest effect in range, at the least traffic in range', design({ arms: sevenArms, 'min-detectable-effect': { relative: 1e-6 }, 'daily-units': 0.01 })],
  ['the widest spread over the smallest effect in range', { ...primary({ kind: 'mean', baseline: { mean: 1e-12, sd: 1e15 } }), ...design({ 'min-detectable-effect': { relative: 1e-6 }, 'interim-looks': 5 }) }],
  ['the largest groups in range', { unit: { randomization: 'household', analysis: 'user' }, ...design({ cluster: { 'mean-size': 1e7, icc: 1, 'size-cv': 10 }, 'daily-units': 0.01 }) }],
])('%s', (_, overrides) => {
  const plan = planYaml(cleanPlan(overrides));
  const base = new Map(Object.entries(baseFiles()));
  const head = new Map(base);
  head.set('experiments/good.yaml', plan);
  head.set('src/cart.ts', CART_CODE_TOUCHED);
  const inputText = plan;

  it.each([
    ['validate', 'json'],
    ['size', 'json'],
    ['size', 'text'],
    ['size', 'markdown'],
    ['check', 'json'],
    ['check', 'text'],
    ['check', 'markdown'],
    ['digest', 'json'],
    ['digest', 'markdown'],
  ])('%s --format %s gives a clear error or finite figures', async (command, format) => {
    const args = command === 'size' ? ['size', 'experiments/good.yaml'] : command === 'check' ? ['check', '--base', 'main', '--body', 'Relates to good.'] : command === 'digest' ? ['digest', '--today', '2026-12-08'] : ['validate'];
    const out = await cli(head, base, [...args, '--format', format]);
    expect(checkOutput({ command, format, exit: out.exit, stdout: out.stdout, stderr: out.stderr, ms: 0, timeLimitMs: 1, inputText })).toEqual([]);
    if (command === 'validate') expect(JSON.parse(out.stdout).errors ?? 0).toBeGreaterThanOrEqual(0);
  });
});
