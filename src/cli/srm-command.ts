import type { Command } from 'commander';
import { SRM_ALARM_P } from '../core/stats/choices.js';
import { UsageError } from '../errors.js';
import { EXIT, formatOption, parseNumbers, type SetExit, type CliDeps } from './common.js';
import { createCliOutput } from './output.js';

/** The command-line argument behind each input the check names. */
const ARGUMENT_OF: Record<string, string> = { observed: 'counts', weights: '--weights', threshold: '--threshold' };

/** `plumbline srm <counts...>`: sample ratio mismatch against planned weights. */
export function addSrmCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('srm')
    .description('sample ratio mismatch: do the units seen per arm fit the planned weights?')
    .argument('<counts...>', 'units observed in each arm, control first, e.g. 50412 49288')
    .option('--weights <weights>', 'planned weights, e.g. 50,50 (default: equal)')
    .option('--threshold <p>', 'alarm below this p-value', String(SRM_ALARM_P))
    .addOption(formatOption())
    .action(async (counts: string[], local: { weights?: string; threshold: string; format: string }) => {
      const [{ SRM_JSON_FORMAT, renderSrmText }, { sampleRatioMismatch, isUnitCount, MAX_UNIT_COUNT }] = await Promise.all([import('../core/report/readout.js'), import('../core/stats/srm.js')]);
      const observed = parseNumbers('counts', counts).map((n, i) => {
        if (!isUnitCount(n)) throw new UsageError(`counts: ${JSON.stringify(counts[i])} is not a count of units`, `write a whole number from 0 to ${MAX_UNIT_COUNT} (Number.MAX_SAFE_INTEGER), e.g. 50412`);
        return n + 0; // -0 reads as 0
      });
      const weights = local.weights ? parseNumbers('weights', local.weights.split(',')) : observed.map(() => 1);
      weights.forEach((w, i) => {
        if (!(w > 0)) throw new UsageError(`--weights: ${JSON.stringify(local.weights!.split(',')[i])} is not a planned weight`, 'write a number above 0 for each arm, e.g. 50,50');
      });
      const threshold = parseNumbers('threshold', [local.threshold])[0]!;
      if (!(threshold > 0 && threshold < 1)) throw new UsageError(`--threshold ${local.threshold}: expected a p-value strictly between 0 and 1`, `e.g. --threshold ${SRM_ALARM_P}`);
      const check = sampleRatioMismatch(observed, weights, threshold);
      if (!check.ok) throw new UsageError(`${ARGUMENT_OF[check.error.input] ?? check.error.input}: ${check.error.message}`);
      const output = createCliOutput({ noColorFlag: true, ...(deps.write ? { write: deps.write } : {}) });
      output.out(local.format === 'json' ? JSON.stringify({ format: SRM_JSON_FORMAT, observed, weights, threshold, ...check.value }, null, 2) : renderSrmText(check.value, observed, threshold));
      setExit(check.value.mismatch ? EXIT.findings : EXIT.ok);
    });
}
