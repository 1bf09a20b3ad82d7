import { resolve } from 'node:path';
import { Option, type Command } from 'commander';
import { writeFileAtomic } from '../adapters/files.js';
import { formatProblem } from '../core/source/problem.js';
import { UsageError } from '../errors.js';
import { EXIT, context, type CommonOptions, type SetExit, type CliDeps } from './common.js';

export const READOUT_JSON_FORMAT = 'plumbline.readout/1';

interface ReadoutFlags {
  totals: string;
  format: 'text' | 'markdown' | 'json';
  record: boolean;
  decidedBy?: string;
  today?: string;
}


/** `plumbline readout <plan> --totals <file>`: the registered rule applied to the arm totals. */
export function addReadoutCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('readout')
    .description('read a test out against its plan: sample ratio, every metric, the registered rule applied; --record writes the outcome into the plan')
    .argument('<plan>', 'plan id or plan file')
    .requiredOption('--totals <file>', 'the arm-totals file (see docs/totals-reference.md)')
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'markdown', 'json']).default('text'))
    .option('--record', 'write the outcome block into the plan (comments and layout kept)', false)
    .option('--decided-by <handle>', 'who decided, e.g. @ana-lima (required with --record)')
    .option('--today <date>', 'the day recorded, YYYY-MM-DD (default: the system date, UTC)')
    .action(async (planName: string, flags: ReadoutFlags) => {
      const options = program.opts<Omit<CommonOptions, 'format'>>();
      const { output, files } = context({ ...options, format: 'text' }, deps);
      const cwd = resolve(options.cwd);
      const [{ renderReadoutMarkdown }, { renderReadoutText }, { isCalendarDate }, { readOutPlan }, { pathInRepository }] = await Promise.all([
        import('../core/report/readout-markdown.js'),
        import('../core/report/readout-text.js'),
        import('../core/source/fields.js'),
        import('../run/readout.js'),
        import('../run/repo-path.js'),
      ]);
      if (flags.record && !flags.decidedBy) throw new UsageError('--record needs --decided-by', 'name who decided, e.g. --decided-by @ana-lima');
      const today = flags.today ?? new Date().toISOString().slice(0, 10);
      if (!isCalendarDate(today)) throw new UsageError(`--today ${JSON.stringify(today)} is not a date`, 'write it as YYYY-MM-DD, e.g. --today 2026-12-01');
      const outcome = await readOutPlan({
        files,
        ...(options.config ? { settingsPath: options.config } : {}),
        plan: planName,
        totals: pathInRepository(cwd, flags.totals),
        ...(flags.record ? { record: { decidedBy: flags.decidedBy!, recordedOn: today } } : {}),
        ...(deps.history ? { history: deps.history(cwd) } : {}),
      });
      const { readout } = outcome;
      if (outcome.warnings.length) output.err(outcome.warnings.map(formatProblem).join('\n'));
      if (flags.format === 'json') output.out(JSON.stringify({ format: READOUT_JSON_FORMAT, ...readout }, null, 2));
      else if (flags.format === 'markdown') output.out(renderReadoutMarkdown(readout));
      else output.out(renderReadoutText(readout, { color: output.color }));
      if (outcome.recordedText !== undefined) {
        await writeFileAtomic(resolve(cwd, outcome.planFile), outcome.recordedText, { overwrite: true });
        output.err(`Recorded the outcome (${readout.verdict}) in ${outcome.planFile}.`);
      }
      setExit(readout.findings.some((f) => f.severity === 'block') ? EXIT.findings : EXIT.ok);
    });
}
