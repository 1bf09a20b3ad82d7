import type { Command } from 'commander';
import { SRM_ALARM_P } from '../core/stats/choices.js';
import { UsageError } from '../errors.js';
import { EXIT, formatOption, parseNumbers, type SetExit, type CliDeps } from './common.js';
import { createCliOutput } from './output.js';

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
      const [{ SRM_JSON_FORMAT, renderSrmText }, { sampleRatioMismatch }] = await Promise.all([import('../core/report/readout.js'), import('../core/stats/srm.js')]);
      const observed = parseNumbers('counts', counts);
      const weights = local.weights ? parseNumbers('weights', local.weights.split(',')) : observed.map(() => 1);
      const threshold = parseNumbers('threshold', [local.threshold])[0]!;
      const check = sampleRatioMismatch(observed, weights, threshold);
      if (!check.ok) throw new UsageError(`${check.error.input}: ${check.error.message}`);
      const output = createCliOutput({ noColorFlag: true, ...(deps.write ? { write: deps.write } : {}) });
      output.out(local.format === 'json' ? JSON.stringify({ format: SRM_JSON_FORMAT, observed, weights, threshold, ...check.value }, null, 2) : renderSrmText(check.value, observed, weights, threshold));
      setExit(check.value.mismatch ? EXIT.findings : EXIT.ok);
    });
}
