import type { Command } from 'commander';
import { ADJUST_JSON_FORMAT, renderAdjustedText } from '../core/report/readout.js';
import { benjaminiHochberg, bonferroniAdjust } from '../core/stats/multiple-testing.js';
import { UsageError } from '../errors.js';
import { EXIT, formatOption, parseNumbers, type SetExit } from './common.js';
import { createCliOutput } from './output.js';

/** `plumbline adjust <p-values...>`: Benjamini–Hochberg and Bonferroni. */
export function addAdjustCommand(program: Command, setExit: SetExit): void {
  program
    .command('adjust')
    .description('adjust p-values for multiple comparisons (Benjamini-Hochberg and Bonferroni)')
    .argument('<p-values...>', 'p-values, e.g. 0.001 0.02 0.04')
    .option('--q <level>', 'false discovery rate (and family-wise level) to compare with', '0.05')
    .addOption(formatOption())
    .action((values: string[], local: { q: string; format: string }) => {
      const p = parseNumbers('p-values', values);
      const q = parseNumbers('q', [local.q])[0]!;
      const bh = benjaminiHochberg(p);
      const bonferroni = bonferroniAdjust(p);
      if (!bh.ok) throw new UsageError(`${bh.error.input}: ${bh.error.message}`);
      if (!bonferroni.ok) throw new UsageError(`${bonferroni.error.input}: ${bonferroni.error.message}`);
      const output = createCliOutput({ noColorFlag: true });
      output.out(
        local.format === 'json'
          ? JSON.stringify({ format: ADJUST_JSON_FORMAT, q, pValues: p, benjaminiHochberg: bh.value, bonferroni: bonferroni.value }, null, 2)
          : renderAdjustedText(p, bh.value, bonferroni.value, q),
      );
      setExit(EXIT.ok);
    });
}
