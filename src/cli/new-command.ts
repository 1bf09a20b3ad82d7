import { resolve } from 'node:path';
import type { Command } from 'commander';
import { writeFileAtomic } from '../adapters/files.js';
import { UsageError } from '../errors.js';
import { context, type CommonOptions, type SetExit, type CliDeps } from './common.js';

/** `plumbline new <flag-key>`: a commented draft plan. */
export function addNewCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('new')
    .description('write a new commented draft plan for a feature flag')
    .argument('<flag-key>', 'the feature-flag key the test reads')
    .option('--id <id>', 'plan id (default: from the flag key)')
    .option('--owner <handle>', 'owner, e.g. @ana-lima')
    .option('--surface <path>', 'surface path, e.g. checkout/payment')
    .option('--out <file>', 'where to write it (default: <plans folder>/<id>.yaml)')
    .option('--today <date>', 'today as YYYY-MM-DD (default: the system date, UTC)')
    .option('--force', 'replace an existing file', false)
    .option('--stdout', 'print the plan instead of writing it', false)
    .action(async (flagKey: string, local: { id?: string; owner?: string; surface?: string; out?: string; today?: string; force: boolean; stdout: boolean }) => {
      const options = program.opts<CommonOptions>();
      const { output, ...ports } = context({ ...options, format: 'text' }, deps);
      const [{ isCalendarDate }, { scaffoldPlan }] = await Promise.all([import('../core/source/fields.js'), import('../run/scaffold.js')]);
      const today = local.today ?? new Date().toISOString().slice(0, 10);
      if (!isCalendarDate(today)) throw new UsageError(`--today ${JSON.stringify(today)} is not a date`, 'write it as YYYY-MM-DD, e.g. --today 2026-12-01');
      const result = await scaffoldPlan({ ...ports, ...local, flagKey, today });
      if (local.stdout) return output.out(result.text);
      await writeFileAtomic(resolve(options.cwd, result.path), result.text, { overwrite: local.force });
      output.out(`Wrote ${result.path} (plan ${result.id}). Fill it in, then run: plumbline validate`);
    });
}
