import type { Command } from 'commander';
import { UsageError } from '../errors.js';
import { EXIT, formatOption, parseNumbers, type SetExit, type CliDeps } from './common.js';
import { createCliOutput } from './output.js';

/**
 * `plumbline adjust <p-values...>`: Benjamini–Hochberg, Holm and Bonferroni. The statistics and the report load when
 * the command runs, so the other commands (and --help) never parse them.
 */
export function addAdjustCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('adjust')
    .description('adjust p-values for multiple comparisons (Benjamini-Hochberg, Holm and Bonferroni)')
    .argument('<p-values...>', 'p-values, e.g. 0.001 0.02 0.04')
    .option('--q <level>', 'false discovery rate (and family-wise level) to compare with', '0.05')
    .addOption(formatOption())
    .action(async (values: string[], local: { q: string; format: string }) => {
      const [{ ADJUST_JSON_FORMAT, renderAdjustedText }, { adjustPValues }] = await Promise.all([import('../core/report/readout.js'), import('../core/stats/multiple-testing.js')]);
      const p = parseNumbers('p-values', values);
      const q = parseNumbers('q', [local.q])[0]!;
      if (!(q > 0 && q < 1)) throw new UsageError(`--q ${local.q}: expected a level strictly between 0 and 1`, 'e.g. --q 0.05');
      const adjusted = adjustPValues(p);
      if (!adjusted.ok) throw new UsageError(`${adjusted.error.input}: ${adjusted.error.message}`);
      const output = createCliOutput({ noColorFlag: true, ...(deps.write ? { write: deps.write } : {}) });
      output.out(local.format === 'json' ? JSON.stringify({ format: ADJUST_JSON_FORMAT, q, pValues: p, ...adjusted.value }, null, 2) : renderAdjustedText(p, adjusted.value, q));
      setExit(EXIT.ok);
    });
}
