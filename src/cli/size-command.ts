import { Command, Option } from 'commander';
import { EXIT, context, type CommonOptions, type SetExit, type CliDeps } from './common.js';
import { BOUNDARY_KINDS } from '../core/stats/choices.js';
import { UsageError } from '../errors.js';
import type { SizeFlags } from './size-request.js';

export function addSizeOptions(command: Command): Command {
  return command
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'json', 'markdown']).default('text'))
    .addOption(new Option('--kind <kind>', 'metric kind, to size without a plan').choices(['proportion', 'mean', 'ratio']))
    .option('--baseline <number>', 'baseline rate (proportion, e.g. 0.12) or mean (mean)')
    .option('--sd <number>', 'standard deviation per unit (mean)')
    .option('--numerator <mean,sd>', 'per-unit mean and sd of the numerator (ratio), e.g. 0.9,1.4')
    .option('--denominator <mean,sd>', 'per-unit mean and sd of the denominator (ratio), e.g. 3.2,2.5')
    .option('--correlation <number>', 'correlation of numerator and denominator (ratio)', '0')
    .option('--effect <number>', 'minimum detectable effect, relative (0.03 = 3%) unless --absolute')
    .option('--absolute', 'read --effect in the metric’s own units', false)
    .addOption(new Option('--direction <direction>', 'direction of the effect').choices(['increase', 'decrease']).default('increase'))
    .option('--alpha <number>', 'significance level', '0.05')
    .option('--power <number>', 'power', '0.8')
    .addOption(new Option('--sides <n>', 'one- or two-sided test').choices(['1', '2']).default('2'))
    .option('--arms <weights>', 'arm weights, control first, e.g. 50,50 or 34,33,33', '50,50')
    .option('--daily-units <number>', 'new eligible units per day (units not seen before that day)')
    .option('--traffic-share <number>', 'share of eligible units enrolled', '1')
    .option('--reach <number>', 'share of exposed units that reach the change', '1')
    .option('--interim-looks <n>', 'interim analyses before the final one', '0')
    .addOption(new Option('--boundary <kind>', 'stopping boundary for interim looks').choices([...BOUNDARY_KINDS]).default('obrien-fleming-spending'))
    .option('--pre-period-correlation <number>', 'correlation with the pre-period value (CUPED)', '0')
    .option('--cluster-size <number>', 'mean group size, when groups are randomized')
    .option('--icc <number>', 'intra-cluster correlation, when groups are randomized')
    .option('--size-cv <number>', 'coefficient of variation of group sizes', '0')
    .option('--groups <number>', 'how many groups exist to randomize, when groups are randomized')
    .option('--days <n>', 'planned days, for power and detectable effect at the end')
    .addOption(new Option('--method <method>', 'mean and ratio metrics: exact t, normal approximation, or auto').choices(['auto', 'exact', 'normal']).default('auto'));
}

/** `plumbline size [plan]`: units per arm, days, power and detectable effect. */
export function addSizeCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  addSizeOptions(
    program
      .command('size')
      .description('size a test: units per arm, days, power and detectable effect by the planned end')
      .argument('[plan]', 'plan id or plan file; omit to describe a metric with --kind and the flags below'),
  ).action(async (planName: string | undefined, flags: SizeFlags) => {
    const options = program.opts<CommonOptions>();
    const { output, ...ports } = context({ ...options, format: 'text' }, deps);
    if (planName && flags.kind) throw new UsageError('name a plan or give --kind, not both');
    const [{ renderSizingMarkdown, renderSizingText, sizingJson }, { sizeFromRequest, sizeNamedPlan }, { requestFromFlags }] = await Promise.all([
      import('../core/report/sizing.js'),
      import('../run/size.js'),
      import('./size-request.js'),
    ]);
    const outcome = planName ? await sizeNamedPlan({ ...ports, plan: planName }) : sizeFromRequest(requestFromFlags(flags));
    if (!planName && !outcome.sizing.metrics[0]!.result.ok) {
      const { error } = outcome.sizing.metrics[0]!.result;
      throw new UsageError(`cannot size this metric: ${error.input}: ${error.message}`);
    }
    if (flags.format === 'json') output.out(JSON.stringify(sizingJson(outcome.sizing, outcome.context), null, 2));
    else if (flags.format === 'markdown') output.out(renderSizingMarkdown(outcome.sizing, { ...outcome.context, power: outcome.power }));
    else output.out(renderSizingText(outcome.sizing, outcome.context));
    setExit(EXIT.ok);
  });
}
